import { useRef, useState, type FormEvent, type ReactNode } from "react";
import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { useParams } from "react-router-dom";
import {
  placementLabels,
  reviewDecisionSchema,
  reviewPinSchema,
  type ReviewDecision,
  type ReviewDecisionInput,
  type ReviewPage as ReviewPageData,
  type ReviewPinView,
  type ReviewSegment,
} from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { allOf, QueryState } from "../../../components/States";
import { Wordmark } from "../../../components/Wordmark";
import { formatClock, formatInstant, formatInstantNamingZone, formatSeconds } from "../../../lib/format";
import { useMe, useTimeZone } from "../../../lib/session";
import { useAddReviewPin } from "../api/add-review-pin";
import { useDecide } from "../api/decide-review";
import { useReview } from "../api/get-review";
import { TextAreaField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";
import { SegmentPlayer, type SegmentPlayerHandle } from "./SegmentPlayer";

function Frame({ children }: { children: ReactNode }) {
  return (
    <main className="min-h-screen bg-ply-100 px-4 py-4 sm:py-8">
      <div className="mx-auto flex max-w-3xl flex-col gap-6">
        <Wordmark className="text-xl" />
        {children}
        <p className="text-xs text-graphite-500">This page was sent to you by a channel that plans its videos with Kerf. You don't need an account to use it.</p>
      </div>
    </main>
  );
}

function Closed({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="rounded-xl border border-ply-300 bg-white p-5 shadow-sm sm:p-8">
      <h1 className="mb-3 text-xl font-bold">{title}</h1>
      <div className="text-graphite-700">{children}</div>
    </section>
  );
}

const decisionText: Record<ReviewDecision, string> = { approved: "approved", changes_asked: "asked for changes" };

/** The sponsor's contact, without an account: read the script (and watch the cut), then decide once. */
export function ReviewPage() {
  const { token = "" } = useParams();
  // The page's CSRF token comes from /api/auth/me, like every page's.
  const me = useMe();
  const review = useReview(token);
  return (
    <Frame>
      <QueryState query={allOf(review, me)} loading="Opening the review…" missing={invalidLink}>
        {([page]) => <Body token={token} page={page} />}
      </QueryState>
    </Frame>
  );
}

const invalidLink = { title: "This review link isn't valid", text: "Check that you copied the whole link from the e-mail, or ask the channel for a new one." };

function Body({ token, page }: { token: string; page: ReviewPageData }) {
  const timeZone = useTimeZone();
  switch (page.state) {
    case "decided":
      return (
        <Closed title="Thank you: your decision is recorded">
          <p>
            {page.contactName} {decisionText[page.decision]} on {formatInstant(page.decidedAt, timeZone)}. {page.channelName} has been told by e-mail.
          </p>
          <p className="mt-2 text-sm text-graphite-500">This link works for one decision only. For another round, the channel will send a new link.</p>
        </Closed>
      );
    case "expired":
      return (
        <Closed title="This review link has expired">
          <p>Ask {page.channelName} to send a new one.</p>
        </Closed>
      );
    case "revoked":
      return (
        <Closed title="This review link was withdrawn">
          <p>{page.channelName} withdrew it. If you still need to review, ask them for a new link.</p>
        </Closed>
      );
    case "closed":
      return (
        <Closed title="This review link has closed">
          <p>{page.reason}</p>
        </Closed>
      );
    case "open":
      // Keyed by what the page shows: a decision is always made against the page as it is now.
      return <OpenReview key={page.seen} token={token} page={page} />;
  }
}

interface DecisionValues {
  decision: ReviewDecision | null;
  comment: string;
}

/** `seen` says what the page showed: if the channel changed it since, the server answers 409 and the page reloads. */
const decisionResolver = (seen: string) => schemaResolver(reviewDecisionSchema, (v: DecisionValues) => ({ ...v, seen }));

function OpenReview({ token, page }: { token: string; page: Extract<ReviewPageData, { state: "open" }> }) {
  const decide = useDecide(token);
  const timeZone = useTimeZone();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<DecisionValues, unknown, ReviewDecisionInput>({ resolver: decisionResolver(page.seen), defaultValues: { decision: null, comment: "" } });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await decide.mutateAsync(body);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["decision", "comment"]));
    }
  });
  return (
    <>
      <header className="rounded-xl border border-ply-300 bg-white p-4 sm:p-6 shadow-sm">
        <p className="text-sm text-graphite-500">
          {page.channelName} · for {page.contactName} of {page.company}
        </p>
        <h1 className="mt-1 text-xl font-bold break-words sm:text-2xl">Review: {page.deliverableTitle}</h1>
        <p className="mt-1 text-graphite-700">
          {placementLabels[page.placement]} segment in “{page.episodeTitle}”. This link is open until {formatInstantNamingZone(page.expiresAt, timeZone)}.
        </p>
      </header>
      <section aria-labelledby="script-heading" className="rounded-xl border border-ply-300 bg-white p-4 sm:p-6">
        <h2 id="script-heading" className="mb-2 text-lg font-semibold">
          The script
        </h2>
        <p className="mb-3 text-sm text-graphite-500">
          Reads in about {formatSeconds(page.estimatedSeconds)}; the contract asks for {formatSeconds(page.segmentSeconds)}.
        </p>
        <p className="whitespace-pre-wrap rounded-md bg-ply-50 p-4 leading-relaxed">{page.script || "The script isn't written yet."}</p>
        <dl className="mt-4 grid grid-cols-1 gap-x-4 gap-y-1 text-sm sm:grid-cols-[10rem_1fr]">
          <dt className="text-graphite-500">Talking points</dt>
          <dd>{page.talkingPoints.length ? page.talkingPoints.join(" · ") : "None listed"}</dd>
          <dt className="text-graphite-500">Link</dt>
          <dd className="break-all">{page.link ?? "None"}</dd>
          <dt className="text-graphite-500">Promo code</dt>
          <dd>{page.promoCode ?? "None"}</dd>
          <dt className="text-graphite-500">Disclosure</dt>
          <dd>{page.disclosureText ?? "A plain label such as “Sponsored”"}</dd>
        </dl>
      </section>
      {page.cutUrl && page.segment && <SegmentReview token={token} url={page.cutUrl} segment={page.segment} contractSeconds={page.segmentSeconds} pins={page.pins} />}
      <form onSubmit={onSubmit} noValidate aria-labelledby="decision-heading" className="rounded-xl border border-ply-300 bg-white p-4 sm:p-6">
        <h2 id="decision-heading" className="mb-3 text-lg font-semibold">
          Your decision
        </h2>
        <fieldset className="mb-3 flex flex-wrap gap-4">
          <legend className="sr-only">Decision</legend>
          <label className="flex items-center gap-2">
            <input type="radio" value="approved" {...form.register("decision")} /> Approve
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="changes_asked" {...form.register("decision")} /> Ask for changes
          </label>
        </fieldset>
        {errors.decision && <p className="mb-2 text-sm text-alarm-600">{errors.decision.message}</p>}
        <TextAreaField label="Comment" rows={4} {...form.register("comment")} hint="Needed when you ask for changes: say what should change." error={errors.comment?.message} />
        {formError && (
          <div className="mt-3">
            <Notice kind="error">{formError}</Notice>
          </div>
        )}
        <Button type="submit" className="mt-4" busy={decide.isPending}>
          Send decision
        </Button>
      </form>
    </>
  );
}

/** The segment's running time against the contract, in words. */
export function runningTimeWords(segmentSeconds: number, contractSeconds: number): string {
  const gap = Math.round(segmentSeconds - contractSeconds);
  const verdict = gap === 0 ? "on the length" : gap < 0 ? `${formatSeconds(-gap)} short` : `${formatSeconds(gap)} over`;
  return `The segment runs ${formatSeconds(segmentSeconds)}; the contract asks for ${formatSeconds(contractSeconds)} (${verdict}).`;
}

interface PinValues {
  note: string;
}

const pinNoteSchema = reviewPinSchema.pick({ note: true });

/** The segment and its player; a comment is pinned to the moment the player is at when it is sent. */
function SegmentReview({ token, url, segment, contractSeconds, pins }: { token: string; url: string; segment: ReviewSegment; contractSeconds: number; pins: ReviewPinView[] }) {
  const player = useRef<SegmentPlayerHandle>(null);
  const addPin = useAddReviewPin(token);
  const [formError, setFormError] = useState<string | null>(null);
  const [pinnedAt, setPinnedAt] = useState<number | null>(null);
  const form = useForm<PinValues>({ resolver: zodResolver(pinNoteSchema), defaultValues: { note: "" } });
  const pausePlayer = () => player.current?.pause();
  // The moment is where the player is when the comment is sent: the sponsor paused there, or it stopped there.
  const momentNow = () => player.current?.position() ?? 0;
  const send = async ({ note }: PinValues) => {
    setFormError(null);
    try {
      const pin = await addPin.mutateAsync({ note, atSeconds: momentNow() });
      setPinnedAt(pin.atSeconds);
      form.reset({ note: "" });
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["note"]));
    }
  };
  const onSubmit = (event: FormEvent) => void form.handleSubmit(send)(event);
  const length = segment.endSeconds - segment.startSeconds;
  return (
    <section aria-labelledby="cut-heading" className="rounded-xl border border-ply-300 bg-white p-4 sm:p-6">
      <h2 id="cut-heading" className="mb-1 text-lg font-semibold">
        {segment.wholeFile ? "The draft cut" : "Your segment in the cut"}
      </h2>
      <p className="mb-3 text-sm text-graphite-700">{runningTimeWords(length, contractSeconds)}</p>
      <SegmentPlayer ref={player} url={url} segment={segment} label="Segment player" />
      <form onSubmit={onSubmit} noValidate aria-label="Comment on a moment" className="mt-4 flex flex-col gap-2">
        <TextAreaField
          label="Comment on this moment"
          rows={2}
          hint="Pause where it matters; the comment is pinned to where the player is when you send it."
          {...form.register("note")}
          onFocus={pausePlayer}
          error={form.formState.errors.note?.message}
        />
        {formError && <Notice kind="error">{formError}</Notice>}
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" tone="quiet" busy={addPin.isPending}>
            Pin comment here
          </Button>
          {pinnedAt !== null && <span className="text-sm text-graphite-700" role="status">Pinned at {formatClock(pinnedAt)}.</span>}
        </div>
      </form>
      <h3 className="mt-4 text-base font-semibold">Your pinned comments</h3>
      {pins.length === 0 ? (
        <p className="text-sm text-graphite-500">None yet. The channel sees each one at its moment of the cut.</p>
      ) : (
        <ol aria-label="Your pinned comments" className="mt-1 flex flex-col gap-1">
          {pins.map((pin) => (
            <li key={pin.id} className="flex flex-wrap items-baseline gap-2 text-sm">
              <button type="button" className="font-mono text-rust-700 underline" onClick={() => player.current?.seek(pin.atSeconds)} aria-label={`Go to ${formatClock(pin.atSeconds)}`}>
                {formatClock(pin.atSeconds)}
              </button>
              <span className="whitespace-pre-wrap">{pin.note}</span>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
