import { useState } from "react";
import { cutSchema, type DealView } from "@shared/sponsors/schemas";
import { frameRateNames } from "@shared/timecode/rates";
import { fieldMessages } from "@shared/http/errors";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField } from "../../../components/SelectField";
import { TextField } from "../../../components/TextField";
import { ApiError } from "../../../lib/api-client";
import { formatSeconds } from "../../../lib/format";
import { useUpdateCut } from "../api/save-deal";

/** The editor's part: the clip the sponsor reviews, and the segment's in and out in the cut. */
export function CutPanel({ channelId, deal, canEdit }: { channelId: string; deal: DealView; canEdit: boolean }) {
  const update = useUpdateCut(channelId, deal.id);
  const timing = deal.cut.timing;
  const [clipId, setClipId] = useState(deal.cut.clip?.id ?? "");
  const [inTc, setIn] = useState(timing?.inTimecode ?? "");
  const [outTc, setOut] = useState(timing?.outTimecode ?? "");
  const [rate, setRate] = useState(timing?.frameRate ?? "25");
  const [dropFrame, setDropFrame] = useState(timing?.dropFrame ?? false);
  const [errors, setErrors] = useState<Record<string, string>>({});

  const save = async () => {
    const body = { clipId: clipId || null, timing: inTc || outTc ? { inTimecode: inTc, outTimecode: outTc, frameRate: rate, dropFrame } : null };
    const checked = cutSchema.safeParse(body);
    if (!checked.success) {
      setErrors(fieldMessages(checked.error.issues));
      return;
    }
    setErrors({});
    await update.mutateAsync(checked.data).catch((error: unknown) => {
      if (error instanceof ApiError) setErrors(error.fields);
    });
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
