import { useState } from "react";
import { formatSeconds } from "@shared/sponsors/read";
import { cutSchema, type DealView } from "@shared/sponsors/schemas";
import { frameRateNames } from "@shared/timecode/rates";
import { fieldMessages } from "@shared/http/errors";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField } from "../../../components/SelectField";
import { TextField } from "../../../components/TextField";
import { ApiError } from "../../../lib/api-client";
import { changedFields, useOpenedRecord } from "../../../lib/conflicts";
import { useUpdateCut } from "../api/save-deal";

/** The cut's fields as the deal holds them. */
const cutOf = (deal: DealView) => ({
  clipId: deal.cut.clip?.id ?? "",
  inTc: deal.cut.timing?.inTimecode ?? "",
  outTc: deal.cut.timing?.outTimecode ?? "",
  rate: deal.cut.timing?.frameRate ?? "25",
  dropFrame: deal.cut.timing?.dropFrame ?? false,
});

/** The editor's part: the clip the sponsor reviews, and the segment's in and out in the cut. */
export function CutPanel({ channelId, deal, canEdit }: { channelId: string; deal: DealView; canEdit: boolean }) {
  const update = useUpdateCut(channelId, deal.id);
  const timing = deal.cut.timing;
  const [clipId, setClipId] = useState(cutOf(deal).clipId);
  const [inTc, setIn] = useState(cutOf(deal).inTc);
  const [outTc, setOut] = useState(cutOf(deal).outTc);
  const [rate, setRate] = useState(cutOf(deal).rate);
  const [dropFrame, setDropFrame] = useState(cutOf(deal).dropFrame);
  const [errors, setErrors] = useState<Record<string, string>>({});
  // The cut as the editor started from it: the save is made against the deal's version then.
  const record = useOpenedRecord(deal, (from) => {
    const cut = cutOf(from);
    setClipId(cut.clipId);
    setIn(cut.inTc);
    setOut(cut.outTc);
    setRate(cut.rate);
    setDropFrame(cut.dropFrame);
  });
  const dirty = Object.keys(changedFields(cutOf(record.opened), { clipId, inTc, outTc, rate, dropFrame })).length > 0;
  // Someone else's save shows at once while this editor has changed nothing.
  if (deal.version !== record.version && !dirty && !update.isPending) record.startFrom(deal);

  const save = async () => {
    const body = { clipId: clipId || null, timing: inTc || outTc ? { inTimecode: inTc, outTimecode: outTc, frameRate: rate, dropFrame } : null };
    const checked = cutSchema.safeParse(body);
    if (!checked.success) {
      setErrors(fieldMessages(checked.error.issues));
      return;
    }
    setErrors({});
    try {
      record.startFrom(await update.mutateAsync({ ...checked.data, version: record.version }));
    } catch (error) {
      if (!record.conflictIn(error) && error instanceof ApiError) setErrors(error.fields);
    }
  };

  const measured = timing ? timing.measuredSeconds : null;
  return (
    <div className="flex flex-col gap-3 text-sm">
      {!canEdit && (
        <p>
          {deal.cut.clip ? `Cut: ${deal.cut.clip.fileName}` : "No cut attached."}{" "}
          {measured !== null && `Measured length ${formatSeconds(measured)} against ${formatSeconds(deal.segmentSeconds)} contracted.`}
        </p>
      )}
      {canEdit && (
        <>
          <SelectField
            label="Cut for the sponsor's review"
            value={clipId}
            onChange={(e) => setClipId(e.target.value)}
            options={[{ value: "", label: (deal.cutChoices ?? []).length ? "No cut attached" : "No footage on this episode yet" }, ...(deal.cutChoices ?? []).map((c) => ({ value: c.id, label: c.fileName }))]}
            error={errors.clipId}
          />
          <div className="grid gap-3 sm:grid-cols-4">
            <TextField label="Segment in" placeholder="00:12:30:00" value={inTc} onChange={(e) => setIn(e.target.value)} error={errors["timing.inTimecode"]} />
            <TextField label="Segment out" placeholder="00:13:30:00" value={outTc} onChange={(e) => setOut(e.target.value)} error={errors["timing.outTimecode"]} />
            <SelectField label="Frame rate" value={rate} onChange={(e) => setRate(e.target.value)} options={frameRateNames.map((r) => ({ value: r, label: `${r} fps` }))} error={errors["timing.frameRate"]} />
            <label className="mt-6 flex items-center gap-2">
              <input type="checkbox" checked={dropFrame} onChange={(e) => setDropFrame(e.target.checked)} />
              Drop-frame
            </label>
          </div>
          {errors["timing.dropFrame"] && <p className="text-alarm-600">{errors["timing.dropFrame"]}</p>}
          <div className="flex items-center gap-3">
            <Button tone="quiet" busy={update.isPending} onClick={() => void save()}>
              Save the cut
            </Button>
            {measured !== null && (
              <span>
                Measured: <strong>{formatSeconds(measured)}</strong> ({measured.toFixed(2)} s) against {formatSeconds(deal.segmentSeconds)} contracted
              </span>
            )}
          </div>
          {update.isError && !(update.error instanceof ApiError && Object.keys(update.error.fields).length) && <Notice kind="error">{update.error.message}</Notice>}
        </>
      )}
    </div>
  );
}
