import { type TimecodeFormat, describeFormat, frameRateName } from "../../timecode/rates";
import { formatTimecode, parseTimecode } from "../../timecode/timecode";
import { type ExportClip, formatOf, sourceRanges } from "./clip-ranges";

/**
 * An edit decision list in CMX 3600 form (SMPTE 258M; layout as in OpenTimelineIO's CMX 3600
 * adapter and its sample files): a TITLE: and an FCM: line, then one cut event per range:
 * event number, reel, channel, transition, source in, source out, record in, record out, out points
 * exclusive, and `*` comment lines naming the clip. Every mark becomes an event laid end to end on
 * the record side from 01:00:00:00 (common practice for a programme's start).
 */
// Hand-written: no maintained npm package writes CMX 3600; the format is a page of fixed columns.
export const MAX_EDL_EVENTS = 999;

export class EdlError extends Error {}

const sameFormat = (a: TimecodeFormat, b: TimecodeFormat) =>
  a.dropFrame === b.dropFrame && a.rate.numerator * b.rate.denominator === b.rate.numerator * a.rate.denominator;

/** The list's format: the one most of the clips share (ties go to the first seen). */
export function edlFormat(clips: ExportClip[]): TimecodeFormat | null {
  const counts: { format: TimecodeFormat; count: number }[] = [];
  for (const clip of clips) {
    const format = formatOf(clip);
    if (!format) continue;
    const seen = counts.find((c) => sameFormat(c.format, format));
    if (seen) seen.count++;
    else counts.push({ format, count: 1 });
  }
  return counts.reduce<(typeof counts)[number] | null>((best, c) => (!best || c.count > best.count ? c : best), null)?.format ?? null;
}

/** CMX reels are at most 8 characters of letters, digits and underscores. */
export function reelName(fileName: string): string {
  const stem = fileName.replace(/\.[^.]*$/, "").toUpperCase().replace(/[^A-Z0-9_]/g, "");
  return (stem || "AX").slice(0, 8);
}

const commentSafe = (text: string) => text.replace(/[\r\n]+/g, " ").trim();

/** A frame at one rate expressed at another, by real time (for clips shot at another rate). */
function convertFrame(frame: number, from: TimecodeFormat, to: TimecodeFormat): number {
  if (sameFormat(from, to)) return frame;
  const seconds = (frame * from.rate.denominator) / from.rate.numerator;
  return Math.round((seconds * to.rate.numerator) / to.rate.denominator);
}

export function footageEdl(title: string, clips: ExportClip[]): string {
  const format = edlFormat(clips);
  if (!format) throw new EdlError("None of these clips has a frame rate, so they can't go in an edit decision list.");
  const lines = [`TITLE: ${commentSafe(title).slice(0, 70) || "KERF"}`, `FCM: ${format.dropFrame ? "DROP FRAME" : "NON-DROP FRAME"}`];
  let record = parseTimecode(format.dropFrame ? "01:00:00;00" : "01:00:00:00", format);
  let event = 0;
  const skipped: string[] = [];
  for (const clip of clips) {
    const own = formatOf(clip);
    if (!own) {
      skipped.push(clip.fileName);
      continue;
    }
    for (const range of sourceRanges(clip, own)) {
      event++;
      if (event > MAX_EDL_EVENTS) throw new EdlError(`An edit decision list holds at most ${MAX_EDL_EVENTS} events; narrow the filter.`);
      const start = convertFrame(range.start, own, format);
      const end = Math.max(start + 1, convertFrame(range.end, own, format));
      const length = end - start;
      const tc = (f: number) => formatTimecode(f, format);
      lines.push("");
      lines.push(`${String(event).padStart(3, "0")}  ${reelName(clip.fileName).padEnd(8)} V     C        ${tc(start)} ${tc(end)} ${tc(record)} ${tc(record + length)}`);
      lines.push(`* FROM CLIP NAME: ${commentSafe(clip.fileName)}`);
      if (!sameFormat(own, format)) lines.push(`* SOURCE FORMAT: ${describeFormat(own)}, times converted to ${frameRateName(format.rate)} fps`);
      if (range.note) lines.push(`* COMMENT: ${commentSafe(range.note)}`);
      record += length;
    }
  }
  for (const name of skipped) lines.push("", `* SKIPPED (no frame rate): ${commentSafe(name)}`);
  return lines.join("\r\n") + "\r\n";
}

export interface ParsedEdlEvent {
  event: number;
  reel: string;
  channel: string;
  transition: string;
  sourceIn: string;
  sourceOut: string;
  recordIn: string;
  recordOut: string;
  comments: string[];
}

/** Reads a CMX 3600 list back (for the tests, and to check what another program wrote). */
export function parseEdl(text: string): { title: string; dropFrame: boolean; events: ParsedEdlEvent[] } {
  let title = "";
  let dropFrame = false;
  const events: ParsedEdlEvent[] = [];
  const eventLine = /^(\d{3,})\s+(\S+)\s+(\S+)\s+(C|D\s+\d+|W\d+\s+\d+)\s+(\d\d:\d\d:\d\d[:;]\d\d)\s+(\d\d:\d\d:\d\d[:;]\d\d)\s+(\d\d:\d\d:\d\d[:;]\d\d)\s+(\d\d:\d\d:\d\d[:;]\d\d)\s*$/;
  for (const raw of text.split(/\r?\n/)) {
    const line = raw.trimEnd();
    if (line.startsWith("TITLE:")) title = line.slice(6).trim();
    else if (line.startsWith("FCM:")) dropFrame = line.slice(4).trim() === "DROP FRAME";
    else if (line.startsWith("*")) events.at(-1)?.comments.push(line.slice(1).trim());
    else if (line.trim() !== "") {
      const m = eventLine.exec(line);
      if (!m) throw new Error(`not a CMX 3600 event line: ${line}`);
      events.push({ event: Number(m[1]), reel: m[2]!, channel: m[3]!, transition: m[4]!, sourceIn: m[5]!, sourceOut: m[6]!, recordIn: m[7]!, recordOut: m[8]!, comments: [] });
    }
  }
  return { title, dropFrame, events };
}
