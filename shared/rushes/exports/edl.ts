import type { TimecodeFormat } from "../../timecode/rates";
import { formatTimecode, parseTimecode } from "../../timecode/timecode";
import { type ExportClip, formatOf, sourceRanges } from "./clip-ranges";
import { type EdlRate, edlRateLabel, edlRateOf, formatOfEdlRate } from "./edl-rates";
import { uniqueReels } from "./edl-reels";
import { oneLine } from "./one-line";

/**
 * Edit decision lists in CMX 3600 form (SMPTE 258M; layout as in OpenTimelineIO's CMX 3600 adapter and its
 * sample files): a TITLE: and an FCM: line, then one cut event per range: event number, reel, channel,
 * transition, source in, source out, record in, record out, out points exclusive, and `*` comment lines
 * naming the clip. Every mark becomes an event laid end to end on the record side from 01:00:00:00
 * (common practice for a programme's start).
 *
 * A source timecode is never rewritten: every event is written in its clip's own rate and drop-frame labels,
 * so it names frames that exist in the camera file. A list has one rate (see edl-rates.ts), so clips of
 * other rates go in lists of their own, and each list says so in its closing comments. Those comments come
 * after the events: some readers refuse anything but TITLE: and FCM: before the first event.
 */
// Hand-written: no maintained npm package writes CMX 3600; the format is a page of fixed columns.
export const MAX_EDL_EVENTS = 999;

export class EdlError extends Error {}

export interface EdlList {
  rate: EdlRate;
  clips: number;
  events: number;
  text: string;
}

const tcLine = (frame: number, format: TimecodeFormat) => formatTimecode(frame, format);

/** The clips of the list, by rate, in the order of the rate's first clip; clips with no usable rate apart. */
export function clipsByRate(clips: readonly ExportClip[]): { byRate: Map<EdlRate, ExportClip[]>; withoutRate: ExportClip[] } {
  const byRate = new Map<EdlRate, ExportClip[]>();
  const withoutRate: ExportClip[] = [];
  for (const clip of clips) {
    const rate = edlRateOf(formatOf(clip));
    if (rate === null) withoutRate.push(clip);
    else byRate.set(rate, [...(byRate.get(rate) ?? []), clip]);
  }
  return { byRate, withoutRate };
}

interface ListContext {
  title: string;
  /** Each clip's file name as downloaded (media-names.ts): the same in the zip, the timeline and here. */
  names: Map<string, string>;
  otherRates: { rate: EdlRate; clips: number }[];
  withoutRate: ExportClip[];
}

function eventCount(clips: readonly ExportClip[]): number {
  return clips.reduce((sum, clip) => sum + Math.max(1, clip.marks.length), 0);
}

/** One list: the clips of one rate, source and record timecodes all in that rate. */
export function writeEdl(rate: EdlRate, clips: readonly ExportClip[], context: ListContext): EdlList {
  const format = formatOfEdlRate(rate);
  const events = eventCount(clips);
  if (events > MAX_EDL_EVENTS) {
    throw new EdlError(`The ${edlRateLabel(rate)} list would hold ${events} events, and an edit decision list holds at most ${MAX_EDL_EVENTS}; narrow the filter.`);
  }
  const nameOf = (clip: ExportClip) => context.names.get(clip.id) ?? oneLine(clip.fileName);
  const reels = uniqueReels(clips.map((clip) => ({ id: clip.id, fileName: nameOf(clip) })));
  const lines = [`TITLE: ${oneLine(context.title).slice(0, 70) || "KERF"}`, `FCM: ${format.dropFrame ? "DROP FRAME" : "NON-DROP FRAME"}`];
  let record = parseTimecode(format.dropFrame ? "01:00:00;00" : "01:00:00:00", format);
  let event = 0;
  for (const clip of clips) {
    for (const range of sourceRanges(clip, format)) {
      event++;
      const length = Math.max(1, range.end - range.start);
      const times = [range.start, range.start + length, record, record + length].map((f) => tcLine(f, format));
      lines.push("", `${String(event).padStart(3, "0")}  ${reels.get(clip.id)!.padEnd(8)} V     C        ${times.join(" ")}`);
      lines.push(`* FROM CLIP NAME: ${nameOf(clip)}`);
      const note = oneLine(range.note);
      if (note) lines.push(`* COMMENT: ${note}`);
      record += length;
    }
  }
  lines.push("", `* FRAME RATE: ${edlRateLabel(rate)}, every timecode of this list (CMX 3600 does not say the rate: set it on import)`);
  if (context.otherRates.length > 0) {
    const others = context.otherRates.map((o) => `${edlRateLabel(o.rate)} (${o.clips} ${o.clips === 1 ? "clip" : "clips"})`).join(", ");
    lines.push(`* OTHER RATES: this filter also holds ${others}, each in a list of its own. A CMX 3600 list holds one frame rate, and Kerf never converts a clip's timecode.`);
  }
  for (const clip of context.withoutRate) lines.push(`* LEFT OUT (no frame rate Kerf can time): ${nameOf(clip)}`);
  for (const clip of clips) lines.push(`* REEL ${reels.get(clip.id)}: ${nameOf(clip)}`);
  return { rate, clips: clips.length, events, text: lines.join("\r\n") + "\r\n" };
}

/**
 * The lists the clips need, one per rate, most clips first (or only the list of `only`); throws EdlError when
 * none has a rate, or none has the rate asked for.
 */
export function footageEdls(title: string, clips: readonly ExportClip[], names: Map<string, string>, only?: EdlRate): EdlList[] {
  const { byRate, withoutRate } = clipsByRate(clips);
  if (byRate.size === 0) throw new EdlError("None of these clips has a frame rate, so they can't go in an edit decision list.");
  if (only !== undefined && !byRate.has(only)) throw new EdlError(`None of these clips is at ${edlRateLabel(only)}.`);
  const rates = [...byRate.entries()].map(([rate, list]) => ({ rate, clips: list.length })).sort((a, b) => b.clips - a.clips);
  return rates
    .filter(({ rate }) => only === undefined || rate === only)
    .map(({ rate }) => writeEdl(rate, byRate.get(rate)!, { title, names, otherRates: rates.filter((o) => o.rate !== rate), withoutRate }));
}
