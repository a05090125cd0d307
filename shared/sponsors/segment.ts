import { frameAtSeconds, frameOfLabel, sourceLabel } from "../timecode/playhead";
import { frameRateName, frameRates, type FrameRate, type FrameRateName, type TimecodeFormat } from "../timecode/rates";
import { checkTimecode } from "../timecode/timecode";

// The part of a file the sponsor reviews. A segment is either a range of a clip (the editor's in and
// out, written in the clip's own timecode: its start timecode, or 00:00:00:00 when the camera wrote
// none) or a whole file (a draft cut uploaded for the review). In and out are frame boundaries; the
// out is exclusive, as the cut's measured length counts it.

/** What the segment needs to know of its clip. */
export interface SegmentClip {
  durationMs: number;
  frameRate: FrameRate | null;
  dropFrame: boolean;
  startTimecode: string | null;
}

export interface SegmentTiming {
  inTimecode: string;
  outTimecode: string;
  frameRate: string;
  dropFrame: boolean;
}

/** Where in the file the segment runs, in seconds of the file's own playback time. */
export interface SegmentRange {
  startSeconds: number;
  endSeconds: number;
  /** True when the whole file is the segment (no in and out). */
  wholeFile: boolean;
}

/** The clip's own timecode format, when it knows its frame rate. */
export function clipFormat(clip: SegmentClip): TimecodeFormat | null {
  return clip.frameRate && frameRateName(clip.frameRate) ? { rate: clip.frameRate, dropFrame: clip.dropFrame } : null;
}

/** The format the cut's labels are read in: the clip's own when it has one, else the one the editor gave. */
export function cutFormat(clip: SegmentClip | null, timing: Pick<SegmentTiming, "frameRate" | "dropFrame">): TimecodeFormat | null {
  const own = clip ? clipFormat(clip) : null;
  if (own) return own;
  const rate = frameRates[timing.frameRate as FrameRateName];
  return rate ? { rate, dropFrame: timing.dropFrame } : null;
}

const secondsOf = (frame: number, rate: FrameRate) => (frame * rate.denominator) / rate.numerator;

/** The segment's range in the file; null when its labels don't fit the clip's timecode. */
export function segmentRange(clip: SegmentClip, timing: SegmentTiming | null): SegmentRange | null {
  const fileSeconds = clip.durationMs / 1000;
  if (!timing) return { startSeconds: 0, endSeconds: fileSeconds, wholeFile: true };
  const format = cutFormat(clip, timing);
  if (!format) return null;
  try {
    const first = frameOfLabel(clip.startTimecode, timing.inTimecode, format);
    const end = frameOfLabel(clip.startTimecode, timing.outTimecode, format);
    if (first < 0 || end <= first) return null;
    return { startSeconds: secondsOf(first, format.rate), endSeconds: secondsOf(end, format.rate), wholeFile: false };
  } catch {
    return null;
  }
}

/**
 * Why the editor's in and out don't fit this clip, in the form's words (keyed by field), or null when
 * they do: the labels are the clip's own frame rate, start at or after its first frame and end by its last.
 */
export function segmentProblems(clip: SegmentClip, timing: SegmentTiming): Record<string, string> | null {
  const own = clipFormat(clip);
  if (own && (frameRates[timing.frameRate as FrameRateName] === undefined || frameRateName(own.rate) !== timing.frameRate || own.dropFrame !== timing.dropFrame)) {
    const name = frameRateName(own.rate)!;
    return { "timing.frameRate": `This clip runs at ${name} fps${own.dropFrame ? " drop-frame" : ""}: the in and out are counted in its frames.` };
  }
  const format = cutFormat(clip, timing);
  if (!format) return { "timing.frameRate": "Pick the cut's frame rate." };
  const firstLabel = clip.startTimecode ?? "00:00:00:00";
  const inCheck = checkTimecode(timing.inTimecode, format);
  const outCheck = checkTimecode(timing.outTimecode, format);
  if (!inCheck.ok || !outCheck.ok) return null; // the schema has said what is wrong with the labels
  const range = segmentRange(clip, timing);
  if (!range) return { "timing.inTimecode": `The clip starts at ${firstLabel}: the in point can't come before it.` };
  // A millisecond of slack: durations are stored in whole milliseconds, frame boundaries are not.
  if (clip.durationMs > 0 && range.endSeconds * 1000 > clip.durationMs + 1) {
    const last = sourceLabel(clip.startTimecode, Math.max(0, Math.round((clip.durationMs / 1000) * (format.rate.numerator / format.rate.denominator))), format);
    return { "timing.outTimecode": `The clip ends at ${last}: the out point can't come after it.` };
  }
  return null;
}

/** A moment of the segment (seconds from its in point) as the clip's timecode label of the frame then on screen. */
export function pinTimecode(clip: SegmentClip, timing: SegmentTiming | null, range: SegmentRange, offsetSeconds: number): string | null {
  const format = timing ? cutFormat(clip, timing) : clipFormat(clip);
  if (!format) return null;
  return sourceLabel(clip.startTimecode, frameAtSeconds(range.startSeconds + offsetSeconds, format.rate), format);
}
