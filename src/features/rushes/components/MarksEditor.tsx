import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { z } from "zod";
import type { ClipDetail } from "@shared/rushes/schemas";
import { markRangeAt } from "@shared/timecode/schemas";
import { Button } from "../../../components/Button";
import { useAddMark } from "../api/add-mark";
import { useDeleteMark } from "../api/delete-mark";
import { clipFormatText } from "./labels";
import { TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";

/** In and out points with a note, typed as SMPTE timecode at the clip's own rate and count. */
export function MarksEditor({ channelId, clip }: { channelId: string; clip: ClipDetail }) {
  const addMark = useAddMark(channelId, clip.id);
  const deleteMark = useDeleteMark(channelId, clip.id);
  const format = clip.frameRate ? { rate: clip.frameRate, dropFrame: clip.dropFrame } : null;
  const separator = clip.dropFrame ? ";" : ":";
  const start = clip.startTimecode ?? `00:00:00${separator}00`;
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
            {clipFormatText(clip)}: write HH:MM:SS{separator}FF. The clip starts at <span className="font-mono">{start}</span>; the out point is the first frame after the mark.
          </p>
          {clip.marks.length > 0 && (
            <ul className="mb-3 divide-y divide-ply-200 text-sm" aria-label="Marks on this clip">
              {clip.marks.map((m) => (
                <li key={m.id} className="flex items-center gap-3 py-1.5">
                  <span className="font-mono">
                    {m.in} → {m.out}
                  </span>
                  <span className="flex-1">{m.note}</span>
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
          <MarkForm key={clip.id} format={format} start={start} onAdd={(v) => addMark.mutateAsync(v)} />
        </>
      )}
    </section>
  );
}

function MarkForm({ format, start, onAdd }: { format: { rate: { numerator: number; denominator: number }; dropFrame: boolean }; start: string; onAdd: (v: { in: string; out: string; note: string }) => Promise<unknown> }) {
  // The shared rule (shared/timecode) checks both labels in the browser; the server checks them again with the clip's bounds.
  const schema = markRangeAt(format).and(z.object({ note: z.string().max(500, "Keep the note under 500 characters.") }));
  const form = useForm<{ in: string; out: string; note: string }>({ resolver: zodResolver(schema), defaultValues: { in: start, out: "", note: "" } });
  const submit = form.handleSubmit(async (values) => {
    try {
      await onAdd(values);
      form.reset({ in: values.out, out: "", note: "" });
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ["in", "out", "note"]);
      if (message) form.setError("root", { message });
    }
  });
  const errors = form.formState.errors;
  return (
    <form onSubmit={submit} noValidate className="grid grid-cols-2 items-start gap-2" aria-label="Add a mark">
      <TextField label="In" autoComplete="off" spellCheck={false} size={12} {...form.register("in")} error={errors.in?.message} />
      <TextField label="Out" autoComplete="off" spellCheck={false} size={12} {...form.register("out")} error={errors.out?.message} />
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
