import { useRef, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { cutSchema, type CutInput, type DealView, type ReviewPinView } from "@shared/sponsors/schemas";
import { frameRateNames } from "@shared/timecode/rates";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { useOpenedRecord } from "../../../lib/conflicts";
import { formatClock, formatSeconds } from "../../../lib/format";
import { useCutPlayer } from "../api/get-cut-player";
import { useUpdateCut } from "../api/update-cut";
import { CheckboxField, SelectField, TextField } from "../../../components/form-fields";
import { applyServerErrors, errorAt } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";
import { SegmentPlayer, type SegmentPlayerHandle } from "./SegmentPlayer";

interface CutValues {
  clipId: string;
  timing: { inTimecode: string; outTimecode: string; frameRate: string; dropFrame: boolean };
}

const cutFields = ["clipId", "timing", "timing.inTimecode", "timing.outTimecode", "timing.frameRate", "timing.dropFrame"];
const cutResolver = schemaResolver(cutSchema, (v: CutValues) => ({ clipId: v.clipId || null, timing: v.timing.inTimecode || v.timing.outTimecode ? v.timing : null }));
type Choice = NonNullable<DealView["cutChoices"]>[number];

/** The cut's fields as the deal holds them; a clip's own frame rate stands for any other. */
const cutValues = (deal: DealView): CutValues => {
  const clip = (deal.cutChoices ?? []).find((c) => c.id === deal.cut.clip?.id);
  return {
    clipId: deal.cut.clip?.id ?? "",
    timing: {
      inTimecode: deal.cut.timing?.inTimecode ?? "",
      outTimecode: deal.cut.timing?.outTimecode ?? "",
      frameRate: clip?.frameRate ?? deal.cut.timing?.frameRate ?? "25",
      dropFrame: clip?.frameRate ? clip.dropFrame : (deal.cut.timing?.dropFrame ?? false),
    },
  };
};

/** The editor's part: the clip the sponsor reviews, the segment's in and out in it, and the sponsor's pinned comments. */
export function CutPanel({ channelId, deal, canEdit }: { channelId: string; deal: DealView; canEdit: boolean }) {
  const timing = deal.cut.timing;
  const measured = timing ? timing.measuredSeconds : null;
  return (
    <div className="flex flex-col gap-3 text-sm">
      {!canEdit && (
        <p>
          {deal.cut.clip ? `Cut: ${deal.cut.clip.fileName}` : "No cut attached."}{" "}
          {measured !== null && `Measured length ${formatSeconds(measured)} against ${formatSeconds(deal.segmentSeconds)} contracted.`}
        </p>
      )}
      {canEdit && <CutForm channelId={channelId} deal={deal} />}
      {deal.cut.clip && <CutWatch channelId={channelId} deal={deal} />}
    </div>
  );
}

function CutForm({ channelId, deal }: { channelId: string; deal: DealView }) {
  const update = useUpdateCut(channelId, deal.id);
  const timing = deal.cut.timing;
  const measured = timing ? timing.measuredSeconds : null;
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<CutValues, unknown, CutInput>({ resolver: cutResolver, defaultValues: cutValues(deal) });
  // The cut as the editor started from it: the save is made against the deal's version then.
  const record = useOpenedRecord(deal, (from) => form.reset(cutValues(from)));
  const errors = form.formState.errors;
  const choices = deal.cutChoices ?? [];
  const clipId = useWatch({ control: form.control, name: "clipId" });
  const chosen: Choice | undefined = choices.find((c) => c.id === clipId);
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      record.startFrom(await update.mutateAsync({ ...body, version: record.version }));
    } catch (error) {
      setFormError(record.conflictIn(error) ?? applyServerErrors(error, form.setError, cutFields));
    }
  });
  const clipField = form.register("clipId", {
    // The clip decides the frame rate its in and out are counted in.
    onChange: (event: { target: { value: string } }) => {
      const clip = choices.find((c) => c.id === event.target.value);
      if (clip?.frameRate) {
        form.setValue("timing.frameRate", clip.frameRate);
        form.setValue("timing.dropFrame", clip.dropFrame);
      }
    },
  });
  const fromClip = Boolean(chosen?.frameRate);
  return (
    <form onSubmit={onSubmit} noValidate aria-label="The cut" className="flex flex-col gap-3">
      <SelectField
        label="Cut for the sponsor's review"
        hint="A clip of the episode's footage. To send a separate draft cut, upload it with the footage first, then pick it here."
        options={[{ value: "", label: choices.length ? "No cut attached" : "No footage on this episode yet" }, ...choices.map((c) => ({ value: c.id, label: c.fileName }))]}
        {...clipField}
        error={errors.clipId?.message}
      />
      <p className="text-graphite-500">
        {chosen
          ? `In and out are in the clip's own timecode${chosen.startTimecode ? `, which starts at ${chosen.startTimecode}` : ", from 00:00:00:00"}. Leave both blank to send the whole file as the segment.`
          : "In and out measure the segment; with a clip attached, the sponsor's player plays only that range."}
      </p>
      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="Segment in" placeholder="00:12:30:00" {...form.register("timing.inTimecode")} error={errorAt(errors, "timing.inTimecode")} />
        <TextField label="Segment out" placeholder="00:13:30:00" {...form.register("timing.outTimecode")} error={errorAt(errors, "timing.outTimecode")} />
        {fromClip && chosen ? (
          <p className="sm:mt-6">
            Frame rate <strong>{chosen.frameRate} fps</strong>
            {chosen.dropFrame ? " drop-frame" : ""}, from the clip
          </p>
        ) : (
          <>
            <SelectField label="Frame rate" options={frameRateNames.map((r) => ({ value: r, label: `${r} fps` }))} {...form.register("timing.frameRate")} error={errorAt(errors, "timing.frameRate")} />
            <div className="sm:mt-6">
              <CheckboxField label="Drop-frame" {...form.register("timing.dropFrame")} />
            </div>
          </>
        )}
      </div>
      {errorAt(errors, "timing.dropFrame") && <p className="text-alarm-600">{errorAt(errors, "timing.dropFrame")}</p>}
      {errors.timing?.root?.message && <p className="text-alarm-600">{errors.timing.root.message}</p>}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" tone="quiet" busy={update.isPending}>
          Save the cut
        </Button>
        {measured !== null && (
          <span>
            Measured: <strong>{formatSeconds(measured)}</strong> ({measured.toFixed(2)} s) against {formatSeconds(deal.segmentSeconds)} contracted
          </span>
        )}
      </div>
      {formError && <Notice kind="error">{formError}</Notice>}
    </form>
  );
}

/** The segment as the sponsor sees it, on request (its address lasts an hour), and the comments they pinned to it. */
function CutWatch({ channelId, deal }: { channelId: string; deal: DealView }) {
  const [open, setOpen] = useState(false);
  const [startAt, setStartAt] = useState(0);
  const player = useRef<SegmentPlayerHandle>(null);
  const pins = deal.cut.pins ?? [];
  const query = useCutPlayer(channelId, deal.id, deal.cut.clip?.id ?? null, open);
  const jump = (pin: ReviewPinView) => {
    if (open && player.current) player.current.seek(pin.atSeconds);
    else {
      setStartAt(pin.atSeconds);
      setOpen(true);
    }
  };
  return (
    <div className="flex flex-col gap-3">
      {!open ? (
        <div>
          <Button type="button" tone="quiet" onClick={() => setOpen(true)}>
            Watch the segment as the sponsor sees it
          </Button>
        </div>
      ) : (
        <QueryState query={query} loading="Opening the cut…">
          {(cut) =>
            cut.url && cut.segment ? (
              <div className="max-w-2xl">
                <SegmentPlayer key={`${cut.url}-${startAt}`} ref={player} url={cut.url} segment={cut.segment} startAt={startAt} label="Cut player" />
              </div>
            ) : (
              <p className="text-graphite-500">{cut.url ? "The segment's in and out don't fit the clip: correct them above." : "The cut can't be played right now: storage isn't reachable."}</p>
            )
          }
        </QueryState>
      )}
      {deal.cut.pins !== undefined && (
        <section aria-label="Sponsor's pinned comments">
          <h4 className="font-semibold">Sponsor's pinned comments</h4>
          {pins.length === 0 ? (
            <p className="text-graphite-500">None yet. Comments the sponsor pins on the review page show here at their moment of the cut.</p>
          ) : (
            <ol className="mt-1 flex flex-col gap-1">
              {pins.map((pin) => (
                <li key={pin.id} className="flex flex-wrap items-baseline gap-x-2">
                  <button type="button" className="font-mono text-rust-700 underline" onClick={() => jump(pin)} aria-label={`Play from ${pin.timecode ?? formatClock(pin.atSeconds)}`}>
                    {pin.timecode ?? formatClock(pin.atSeconds)}
                  </button>
                  <span className="whitespace-pre-wrap">{pin.note}</span>
                  <span className="text-graphite-500">
                    {pin.contactName}
                    {pin.deliverableTitle ? ` · ${pin.deliverableTitle}` : ""}
                  </span>
                </li>
              ))}
            </ol>
          )}
        </section>
      )}
    </div>
  );
}
