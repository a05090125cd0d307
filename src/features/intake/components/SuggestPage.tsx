import { useState, type FormEvent, type ReactNode } from "react";
import { useParams } from "react-router-dom";
import { SUGGESTION_MAX } from "@shared/intake/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { allOf, QueryState } from "../../../components/States";
import { TextAreaField, TextField } from "../../../components/form-fields";
import { Wordmark } from "../../../components/Wordmark";
import { ApiError } from "../../../lib/api-client";
import { useMe } from "../../../lib/session";
import { usePublicPage, useSendSuggestion } from "../api/public-page";

export function PublicFrame({ children }: { children: ReactNode }) {
  return (
    <main className="min-h-screen bg-ply-100 px-4 py-4 sm:py-8">
      <div className="mx-auto flex max-w-2xl flex-col gap-6">
        <Wordmark className="text-xl" />
        {children}
        <p className="text-xs text-graphite-500">This page belongs to a channel that plans its videos with Kerf. You don't need an account to use it.</p>
      </div>
    </main>
  );
}

const closedPage = { title: "This suggestion page is closed", text: "The channel isn't taking suggestions here at the moment. Check the address, or try again another time." };

/** A channel's public page: its name and prompt, and a form for one suggestion. */
export function SuggestPage() {
  const { channelId = "" } = useParams();
  const page = usePublicPage(channelId);
  const me = useMe();
  return (
    <PublicFrame>
      <QueryState query={allOf(page, me)} loading="Opening the suggestion page…" missing={closedPage}>
        {([data]) => <SuggestForm channelId={channelId} name={data.name} prompt={data.prompt} />}
      </QueryState>
    </PublicFrame>
  );
}

function SuggestForm({ channelId, name, prompt }: { channelId: string; name: string; prompt: string }) {
  const send = useSendSuggestion(channelId);
  const [text, setText] = useState("");
  const [email, setEmail] = useState("");
  const [consent, setConsent] = useState(false);
  const [nickname, setNickname] = useState("");
  const [thanks, setThanks] = useState<string | null>(null);
  const fields = send.error instanceof ApiError ? send.error.fields : {};

  function submit(event: FormEvent) {
    event.preventDefault();
    send.mutate(
      { text, email, consent, nickname },
      {
        onSuccess: (answer) => {
          setThanks(email ? `${answer.message} We've sent a link to ${email}: open it to confirm the address.` : answer.message);
          setText("");
          setEmail("");
          setConsent(false);
        },
      },
    );
  }

  return (
    <section className="rounded-xl border border-ply-300 bg-white p-5 shadow-sm sm:p-8">
      <h1 className="text-xl font-bold">Suggest a challenge to {name}</h1>
      {prompt && <p className="mt-2 whitespace-pre-line text-graphite-700">{prompt}</p>}
      {thanks && (
        <div className="mt-4">
          <Notice kind="success">{thanks}</Notice>
        </div>
      )}
      <form className="mt-4 flex flex-col gap-4" onSubmit={submit} noValidate>
        <TextAreaField label="Your suggestion" rows={4} maxLength={SUGGESTION_MAX} value={text} onChange={(e) => setText(e.target.value)} error={fields.text} hint={`Up to ${SUGGESTION_MAX} characters.`} required />
        <TextField label="Your e-mail (optional)" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={fields.email} hint="Only if you'd like one mail when a video comes of it." />
        <div className="flex items-start gap-2">
          <input id="suggest-consent" type="checkbox" className="mt-1 size-4 accent-rust-600" checked={consent} onChange={(e) => setConsent(e.target.checked)} aria-describedby={fields.consent ? "suggest-consent-error" : undefined} />
          <label htmlFor="suggest-consent" className="text-sm text-graphite-700">
            {name} may write to this address once, when a video comes of my suggestion. I'll confirm the address first, and every mail lets me stop them.
          </label>
        </div>
        {fields.consent && (
          <p id="suggest-consent-error" className="-mt-3 text-sm text-alarm-600">
            {fields.consent}
          </p>
        )}
        {/* A field people never see: only a form-filling robot fills it. */}
        <div className="absolute -left-[10000px] h-px w-px overflow-hidden" aria-hidden="true">
          <label htmlFor="suggest-nickname">Leave this empty</label>
          <input id="suggest-nickname" tabIndex={-1} autoComplete="off" value={nickname} onChange={(e) => setNickname(e.target.value)} />
        </div>
        {send.error && !Object.keys(fields).length && <Notice kind="error">{send.error.message}</Notice>}
        <div>
          <Button type="submit" busy={send.isPending}>
            Send the suggestion
          </Button>
        </div>
      </form>
    </section>
  );
}
