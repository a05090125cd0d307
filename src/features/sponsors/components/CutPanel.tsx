import { useState } from "react";
import { useForm } from "react-hook-form";
import { cutSchema, type CutInput, type DealView } from "@shared/sponsors/schemas";
import { frameRateNames } from "@shared/timecode/rates";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { useOpenedRecord } from "../../../lib/conflicts";
import { formatSeconds } from "../../../lib/format";
import { useUpdateCut } from "../api/update-cut";
import { CheckboxField, SelectField, TextField } from "../../../components/form-fields";
import { applyServerErrors, errorAt } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

interface CutValues {
  clipId: string;
  timing: { inTimecode: string; outTimecode: string; frameRate: string; dropFrame: boolean };
}

const cutFields = ["clipId", "timing", "timing.inTimecode", "timing.outTimecode", "timing.frameRate", "timing.dropFrame"];
const cutResolver = schemaResolver(cutSchema, (v: CutValues) => ({ clipId: v.clipId || null, timing: v.timing.inTimecode || v.timing.outTimecode ? v.timing : null }));
/** The cut's fields as the deal holds them. */
const cutValues = (deal: DealView): CutValues => ({
  clipId: deal.cut.clip?.id ?? "",
  timing: {
    inTimecode: deal.cut.timing?.inTimecode ?? "",
    outTimecode: deal.cut.timing?.outTimecode ?? "",
    frameRate: deal.cut.timing?.frameRate ?? "25",
    dropFrame: deal.cut.timing?.dropFrame ?? false,
  },
});

/** The editor's part: the clip the sponsor reviews, and the segment's in and out in the cut. */
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
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      record.startFrom(await update.mutateAsync({ ...body, version: record.version }));
    } catch (error) {
      setFormError(record.conflictIn(error) ?? applyServerErrors(error, form.setError, cutFields));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="The cut" className="flex flex-col gap-3">
      <SelectField
        label="Cut for the sponsor's review"
        options={[{ value: "", label: (deal.cutChoices ?? []).length ? "No cut attached" : "No footage on this episode yet" }, ...(deal.cutChoices ?? []).map((c) => ({ value: c.id, label: c.fileName }))]}
        {...form.register("clipId")}
        error={errors.clipId?.message}
      />
      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="Segment in" placeholder="00:12:30:00" {...form.register("timing.inTimecode")} error={errorAt(errors, "timing.inTimecode")} />
        <TextField label="Segment out" placeholder="00:13:30:00" {...form.register("timing.outTimecode")} error={errorAt(errors, "timing.outTimecode")} />
        <SelectField label="Frame rate" options={frameRateNames.map((r) => ({ value: r, label: `${r} fps` }))} {...form.register("timing.frameRate")} error={errorAt(errors, "timing.frameRate")} />
        <div className="sm:mt-6">
          <CheckboxField label="Drop-frame" {...form.register("timing.dropFrame")} />
        </div>
      </div>
      {errorAt(errors, "timing.dropFrame") && <p className="text-alarm-600">{errorAt(errors, "timing.dropFrame")}</p>}
      {errors.timing?.root?.message && <p className="text-alarm-600">{errors.timing.root.message}</p>}
      <div className="flex items-center gap-3">
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
