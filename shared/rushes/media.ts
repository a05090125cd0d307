import { frameRateName, labelsDroppedPerMinute } from "../timecode/rates";
import { checkTimecode } from "../timecode/timecode";
import { isInstantInRange } from "../fields/dates";
import { toPlainLine } from "../fields/text";
import { emptyMetadata, type ClipMetadata } from "./schemas";

/**
 * From a media probe's tracks (mediainfo.js's object form: General, Video and "Other" time code
 * tracks) to Kerf's clip metadata. Anything unreadable is left empty rather than guessed.
 */
export type ProbeTrack = Record<string, unknown> & { "@type": string };

const num = (v: unknown): number | null => {
  const n = typeof v === "number" ? v : typeof v === "string" ? Number(v) : NaN;
  return Number.isFinite(n) ? n : null;
};
const str = (v: unknown): string | null => (typeof v === "string" && v.trim() !== "" ? v.trim() : null);

/** mediainfo writes dates as "2026-11-20 10:15:00 UTC" or ISO; anything else, or outside 1900–2100, is dropped. */
export function probeDate(text: string | null): string | null {
  if (!text) return null;
  const iso = text.replace(/^(\d{4}-\d{2}-\d{2}) (\d{2}:\d{2}:\d{2})(?:\.\d+)? UTC$/, "$1T$2Z");
  const time = Date.parse(iso);
  if (Number.isNaN(time) || !/^\d{4}-\d{2}-\d{2}T/.test(iso)) return null;
  const instant = new Date(time).toISOString();
  return isInstantInRange(instant) ? instant : null;
}

export function metadataFromProbe(tracks: ProbeTrack[]): ClipMetadata {
  const general = tracks.find((t) => t["@type"] === "General") ?? { "@type": "General" };
  const video = tracks.find((t) => t["@type"] === "Video");
  const timecodeTrack = tracks.find((t) => t["@type"] === "Other" && str(t.TimeCode_FirstFrame));

  const numerator = num(video?.FrameRate_Num);
  const denominator = num(video?.FrameRate_Den);
  const decimal = num(video?.FrameRate ?? general.FrameRate);
  let frameRate: ClipMetadata["frameRate"] = null;
  if (numerator && denominator && frameRateName({ numerator, denominator })) frameRate = { numerator, denominator };
  else if (decimal) {
    // Only the rates Kerf knows, matched to three decimals (29.970 → 30000/1001).
    const known = [24000 / 1001, 24, 25, 30000 / 1001, 30, 50, 60000 / 1001, 60];
    const fractions = [[24000, 1001], [24, 1], [25, 1], [30000, 1001], [30, 1], [50, 1], [60000, 1001], [60, 1]] as const;
    const index = known.findIndex((k) => Math.abs(k - decimal) < 0.001);
    if (index >= 0) frameRate = { numerator: fractions[index]![0], denominator: fractions[index]![1] };
  }

  const rawTimecode = str(timecodeTrack?.TimeCode_FirstFrame) ?? str(video?.TimeCode_FirstFrame) ?? str(general.TimeCode_FirstFrame);
  const dropFlag = str(timecodeTrack?.TimeCode_DropFrame ?? video?.Delay_DropFrame);
  let dropFrame = rawTimecode ? rawTimecode.includes(";") || dropFlag === "Yes" : false;
  if (!frameRate || labelsDroppedPerMinute(frameRate) === undefined) dropFrame = false;
  let startTimecode: string | null = null;
  if (rawTimecode && frameRate) {
    const label = dropFrame ? rawTimecode.replace(/[:;](\d{2})$/, ";$1") : rawTimecode.replace(/;(\d{2})$/, ":$1");
    if (checkTimecode(label, { rate: frameRate, dropFrame }).ok) startTimecode = label;
  }

  const durationSeconds = num(general.Duration ?? video?.Duration);
  const width = num(video?.Width);
  const height = num(video?.Height);
  const camera = [str(general.Encoded_Hardware_CompanyName) ?? str(general.Make), str(general.Encoded_Hardware_Name) ?? str(general.Model)].filter(Boolean).join(" ");
  return {
    ...emptyMetadata,
    durationMs: durationSeconds ? Math.round(durationSeconds * 1000) : 0,
    frameRate,
    dropFrame,
    width: width && width > 0 ? Math.round(width) : null,
    height: height && height > 0 ? Math.round(height) : null,
    codec: toPlainLine(str(video?.Format) ?? str(general.Format) ?? "", 80) || null,
    startTimecode,
    recordedAt: probeDate(str(general.Recorded_Date) ?? str(general.Encoded_Date) ?? str(general.Tagged_Date)),
    camera: toPlainLine(camera, 120),
  };
}
