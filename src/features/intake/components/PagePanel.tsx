import { useState, type FormEvent } from "react";
import type { PageSettings } from "@shared/intake/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { TextAreaField } from "../../../components/form-fields";
import { ApiError } from "../../../lib/api-client";
import { usePageSettings, useSavePageSettings } from "../api/page-settings";

/** The public suggestion page: its address, whether it takes suggestions, and its prompt. */
export function PagePanel({ channelId, canChange }: { channelId: string; canChange: boolean }) {
  const settings = usePageSettings(channelId);
  return (
    <section className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4" aria-labelledby="page-heading">
      <h2 id="page-heading" className="font-semibold">
        Public suggestion page
      </h2>
      <QueryState query={settings} loading="Loading the page's settings…">
        {(page) => <PageForm channelId={channelId} page={page} canChange={canChange} />}
      </QueryState>
    </section>
  );
}

function PageForm({ channelId, page, canChange }: { channelId: string; page: PageSettings; canChange: boolean }) {
  const save = useSavePageSettings(channelId);
  const [open, setOpen] = useState(page.open);
  const [prompt, setPrompt] = useState(page.prompt);
  const address = `${window.location.origin}/suggest/${channelId}`;
  const fields = save.error instanceof ApiError ? save.error.fields : {};
  function submit(event: FormEvent) {
    event.preventDefault();
    save.mutate({ open, prompt });
  }
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <p className="text-sm text-graphite-700">
        {page.open ? "Open at " : "Closed. When open, it is at "}
        <a className="break-all text-rust-600 underline" href={address}>
          {address}
        </a>
        . Visitors see only the channel's name and this prompt.
      </p>
      {canChange ? (
        <>
          <div className="flex items-center gap-2">
            <input id="page-open" type="checkbox" className="size-4 accent-rust-600" checked={open} onChange={(e) => setOpen(e.target.checked)} />
            <label htmlFor="page-open" className="text-sm font-medium text-graphite-700">
              Take suggestions on the public page
            </label>
          </div>
          <TextAreaField label="Prompt shown to visitors" value={prompt} onChange={(e) => setPrompt(e.target.value)} error={fields.prompt} />
          {save.isSuccess && !save.isPending && <Notice kind="success">Saved.</Notice>}
          {save.error && !Object.keys(fields).length && <Notice kind="error">{save.error.message}</Notice>}
          <div>
            <Button type="submit" tone="quiet" busy={save.isPending}>
              Save the page
            </Button>
          </div>
        </>
      ) : (
        page.prompt && <p className="whitespace-pre-line text-sm text-graphite-500">Prompt: {page.prompt}</p>
      )}
    </form>
  );
}
