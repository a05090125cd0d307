import type { FrameRate, TimecodeFormat } from "./rates";
import { formatTimecode, parseTimecode } from "./timecode";

// A player's position in frames. Frame n of a clip is shown from n × denominator / numerator seconds
// until the next frame begins (the presentation times of a constant-rate stream), so the frame on
// screen at a playback position is the whole number of frame periods behind it.

/** Frames in a clip of this running time, as the server counts them to bound a mark's out point. */
export function frameCount(durationMs: number, rate: FrameRate): number {
  return Math.round((durationMs / 1000) * (rate.numerator / rate.denominator));
}

/**
 * The frame on screen at a playback position in seconds. A millionth of a frame of slack keeps a
 * position computed as n / rate (which floating point may put a hair below n) on frame n.
 */
export function frameAtSeconds(seconds: number, rate: FrameRate): number {
  return Math.max(0, Math.floor((seconds * rate.numerator) / rate.denominator + 1e-6));
}

/**
 * Where to seek to show a frame: the middle of its period, so a decoder rounding the position either
 * way still lands on it (common practice for frame-exact seeking in a browser's media element).
 */
export function secondsForFrame(frame: number, rate: FrameRate): number {
  return ((frame + 0.5) * rate.denominator) / rate.numerator;
}

/** The source label of a frame counted from the clip's first frame, which carries `startTimecode`. */
export function sourceLabel(startTimecode: string | null, frame: number, format: TimecodeFormat): string {
  const first = startTimecode ? parseTimecode(startTimecode, format) : 0;
  return formatTimecode(first + frame, format);
}

/** The frame, counted from the clip's first frame, that a source label names. */
export function frameOfLabel(startTimecode: string | null, label: string, format: TimecodeFormat): number {
  const first = startTimecode ? parseTimecode(startTimecode, format) : 0;
  return parseTimecode(label, format) - first;
}
