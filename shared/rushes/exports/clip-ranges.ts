import type { TimecodeFormat } from "../../timecode/rates";
import { parseTimecode } from "../../timecode/timecode";

/** What every export reads from a clip and its marks. */
export interface ExportClip {
  id: string;
  fileName: string;
  objectKey: string;
  episodeTitle: string;
  shootDay: string | null;
  shotDescription: string | null;
  kind: string | null;
  rating: string | null;
  tags: string[];
  camera: string;
  recordedAt: string;
  durationMs: number;
  frameRate: { numerator: number; denominator: number } | null;
  dropFrame: boolean;
  startTimecode: string | null;
  size: number;
  notes: string;
  marks: { in: string; out: string; inFrame: number; outFrame: number; note: string }[];
}

export function formatOf(clip: ExportClip): TimecodeFormat | null {
  return clip.frameRate ? { rate: clip.frameRate, dropFrame: clip.dropFrame } : null;
}

/** The clip's first frame in its own timecode count (0 when it has no start timecode). */
export function startFrameOf(clip: ExportClip, format: TimecodeFormat): number {
  return clip.startTimecode ? parseTimecode(clip.startTimecode, format) : 0;
}

export function durationFramesOf(clip: ExportClip, format: TimecodeFormat): number {
  return Math.round((clip.durationMs / 1000) * (format.rate.numerator / format.rate.denominator));
}

/**
 * The source ranges an export cuts from a clip, in the clip's own frames: each mark is one range
 * (the out point exclusive, as in an edit decision list); a clip with no marks is used whole.
 */
export function sourceRanges(clip: ExportClip, format: TimecodeFormat): { start: number; end: number; note: string }[] {
  if (clip.marks.length > 0) return clip.marks.map((m) => ({ start: m.inFrame, end: m.outFrame, note: m.note }));
  const start = startFrameOf(clip, format);
  return [{ start, end: start + Math.max(1, durationFramesOf(clip, format)), note: "" }];
}
