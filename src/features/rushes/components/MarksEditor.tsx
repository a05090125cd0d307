import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useRef, type BaseSyntheticEvent } from "react";
import { useForm, useWatch, type UseFormReturn } from "react-hook-form";
import { z } from "zod";
import type { ClipDetail, FootageLinks, MarkView } from "@shared/rushes/schemas";
import type { TimecodeFormat } from "@shared/timecode/rates";
import { markRangeAt } from "@shared/timecode/schemas";
import { Button } from "../../../components/Button";
import { useAddMark } from "../api/add-mark";
import { useDeleteMark } from "../api/delete-mark";
import { useFootageLinks } from "../api/footage-links";
import { useUpdateMark } from "../api/update-mark";
import { clipFormatText } from "./labels";
import type { MarkDraft } from "./ClipPlayer";
import { TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";

type MarkValues = { in: string; out: string; note: string };

export interface MarkForm {
  form: UseFormReturn<MarkValues>;
  submit: (event?: BaseSyntheticEvent) => Promise<void>;
  draft: MarkDraft;
}

const separatorOf = (format: TimecodeFormat | null) => (format?.dropFrame ? ";" : ":");
export const clipFormat = (clip: ClipDetail): TimecodeFormat | null => (clip.frameRate ? { rate: clip.frameRate, dropFrame: clip.dropFrame } : null);

/**
 * The mark being made, shared by the player (which sets in and out from the picture and opens the
 * note) and the typed form below it. `onSaved` runs after a mark is stored.
 */
export function useMarkForm(channelId: string, clip: ClipDetail, onSaved: () => void): MarkForm {
  const addMark = useAddMark(channelId, clip.id);
  const format = clipFormat(clip);
  // The shared rule (shared/timecode) checks both labels in the browser; the server checks them again with the clip's bounds.
  const range = format ? markRangeAt(format) : z.object({ in: z.string(), out: z.string() });
  const schema = range.and(z.object({ note: z.string().max(500, "Keep the note under 500 characters.") }));
  const start = clip.startTimecode ?? `00:00:00${separatorOf(format)}00`;
  const form = useForm<MarkValues>({ resolver: zodResolver(schema), defaultValues: { in: start, out: "", note: "" } });
  const submit = form.handleSubmit(async (values) => {
    try {
      await addMark.mutateAsync(values);
      form.reset({ in: values.out, out: "", note: "" });
      onSaved();
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ["in", "out", "note"]);
      if (message) form.setError("root", { message });
    }
  });
  const set = (field: "in" | "out") => (label: string) => form.setValue(field, label, { shouldValidate: form.formState.isSubmitted });
  const [inLabel, outLabel] = useWatch({ control: form.control, name: ["in", "out"] });
  const draft: MarkDraft = { in: inLabel, out: outLabel, setIn: set("in"), setOut: set("out"), writeNote: () => form.setFocus("note") };
  return { form, submit, draft };
}

/** In and out points with a note, typed as SMPTE timecode at the clip's own rate and count; `current` is the mark the clip was opened at. */
export function MarksEditor({ channelId, clip, marking, current = null }: { channelId: string; clip: ClipDetail; marking: MarkForm; current?: string | null }) {
  const currentRow = useRef<HTMLLIElement>(null);
  useEffect(() => currentRow.current?.scrollIntoView({ block: "nearest" }), [current]);
  const deleteMark = useDeleteMark(channelId, clip.id);
  const links = useFootageLinks(channelId, clip.episodeId);
  const format = clipFormat(clip);
  const separator = separatorOf(format);
  return (
    <section aria-labelledby="marks-heading" className="rounded-md border border-ply-300 p-3">
      <h3 id="marks-heading" className="font-semibold">
        Marks
      </h3>
      {!format ? (
        <p className="text-sm text-graphite-500">This clip has no frame rate, so it can't take timecode marks.</p>
      ) : (
        <>
          <p className="mb-2 text-xs text-graphite-500">
            {clipFormatText(clip)}: set in and out from the picture, or write HH:MM:SS{separator}FF. The clip starts at <span className="font-mono">{clip.startTimecode ?? `00:00:00${separator}00`}</span>; the out point is the first frame after the mark.
          </p>
          {clip.marks.length > 0 && (
            <ul className="mb-3 divide-y divide-ply-200 text-sm" aria-label="Marks on this clip">
              {clip.marks.map((m) => (
                <li
                  key={m.id}
                  ref={m.id === current ? currentRow : undefined}
                  aria-current={m.id === current ? "true" : undefined}
                  className={`flex items-center gap-3 py-1.5 ${m.id === current ? "-mx-2 rounded-sm bg-amber-cut/25 px-2" : ""}`}
                >
                  <div className="min-w-0 flex-1">
                    <span className="block font-mono">
                      {m.in} → {m.out}
                    </span>
                    {m.note && <span className="block break-words">{m.note}</span>}
                    {links.data && <MarkShows channelId={channelId} clipId={clip.id} mark={m} links={links.data} />}
                  </div>
                  <Button tone="quiet" aria-label={`Remove mark ${m.in} to ${m.out}`} onClick={() => deleteMark.mutate(m.id)}>
                    Remove
                  </Button>
                </li>
              ))}
            </ul>
          )}
          {deleteMark.isError && (
            <p role="alert" className="mb-2 text-sm text-alarm-600">
              {deleteMark.error.message}
            </p>
          )}
          <MarkFields marking={marking} />
        </>
      )}
    </section>
  );
}

/**
 * What the marked moment shows: one of the episode's runs or iterations, saved as soon as it is
 * chosen. Choosing one clears the other; a mark linked to both (through the API) shows its run here.
 */
function MarkShows({ channelId, clipId, mark, links }: { channelId: string; clipId: string; mark: MarkView; links: FootageLinks }) {
  const update = useUpdateMark(channelId, clipId);
  const current = mark.benchRunId ? `run:${mark.benchRunId}` : mark.buildIterationId ? `iteration:${mark.buildIterationId}` : "";
  const choose = (value: string) => {
    const [kind, id] = value.split(":");
    update.mutate({ markId: mark.id, patch: { benchRunId: kind === "run" ? id : null, buildIterationId: kind === "iteration" ? id : null } });
  };
  if (links.runs.length === 0 && links.iterations.length === 0 && !current) return null;
  return (
    <label className="mt-1 flex min-w-0 flex-wrap items-center gap-2 text-xs text-graphite-700">
      Shows
      <select
        value={current}
        disabled={update.isPending}
        aria-label={`What the mark ${mark.in} to ${mark.out} shows`}
        onChange={(e) => choose(e.target.value)}
        className="max-w-full min-w-0 rounded-md border border-ply-300 bg-white px-1.5 py-1 text-xs"
      >
        <option value="">Nothing linked</option>
        {links.runs.length > 0 && (
          <optgroup label="Bench runs">
            {links.runs.map((r) => (
              <option key={r.id} value={`run:${r.id}`}>
                Run {r.number} · {r.title}
              </option>
            ))}
          </optgroup>
        )}
        {links.iterations.length > 0 && (
          <optgroup label="Build iterations">
            {links.iterations.map((i) => (
              <option key={i.id} value={`iteration:${i.id}`}>
                Iteration {i.number} · {i.title}
              </option>
            ))}
          </optgroup>
        )}
      </select>
      {update.isError && (
        <span role="alert" className="text-alarm-600">
          {update.error.message}
        </span>
      )}
    </label>
  );
}

function MarkFields({ marking: { form, submit } }: { marking: MarkForm }) {
  const errors = form.formState.errors;
  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="grid grid-cols-2 items-start gap-2" aria-label="Add a mark">
      <TextField label="In" autoComplete="off" spellCheck={false} size={12} className="min-w-0" {...form.register("in")} error={errors.in?.message} />
      <TextField label="Out" autoComplete="off" spellCheck={false} size={12} className="min-w-0" {...form.register("out")} error={errors.out?.message} />
      <div className="col-span-2">
        <TextField label="Note" {...form.register("note")} error={errors.note?.message} placeholder="e.g. the moment it fails" />
      </div>
      <div className="col-span-2">
        <Button type="submit" busy={form.formState.isSubmitting}>
          Add mark
        </Button>
      </div>
      {errors.root && <p className="col-span-2 text-sm text-alarm-600">{errors.root.message}</p>}
    </form>
  );
}
