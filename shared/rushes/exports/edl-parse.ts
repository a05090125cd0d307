import type { TimecodeFormat } from "../../timecode/rates";
import { parseTimecode } from "../../timecode/timecode";
import { isOneLine } from "./one-line";

export interface ParsedEdlEvent {
  event: number;
  reel: string;
  channel: string;
  transition: string;
  sourceIn: string;
  sourceOut: string;
  recordIn: string;
  recordOut: string;
  /** The `*` lines right under the event, without the star. */
  comments: string[];
}

export interface ParsedEdl {
  title: string;
  dropFrame: boolean;
  events: ParsedEdlEvent[];
  /** The `*` lines after the last event's block (after a blank line), without the star. */
  notes: string[];
}

export class EdlParseError extends Error {
  constructor(
    readonly line: number,
    message: string,
  ) {
    super(`line ${line}: ${message}`);
  }
}

// Fixed columns, as Kerf writes them: event number, two spaces, reel padded to 8, channel V, cut, four timecodes.
const eventLine = /^(\d{3}) {2}([A-Z0-9_][A-Z0-9_ ]{7}) (V) {5}(C) {8}(\S{11}) (\S{11}) (\S{11}) (\S{11})$/;

/**
 * Reads a CMX 3600 list strictly, refusing anything Kerf would not write: lines end in CRLF and hold no other
 * line break or control character; TITLE:, then FCM:, then blank-line-separated events numbered from 001;
 * every timecode written with the FCM line's separator. Given the list's format, it also checks every label
 * exists at that rate, each event runs forward, and the record side runs on without gaps from 01:00:00:00.
 */
export function parseEdl(text: string, format?: TimecodeFormat): ParsedEdl {
  if (!text.endsWith("\r\n")) throw new EdlParseError(1, "the list does not end with CRLF");
  const lines = text.slice(0, -2).split("\r\n");
  lines.forEach((line, i) => {
    if (!isOneLine(line)) throw new EdlParseError(i + 1, "holds a line break or control character other than CRLF");
  });
  const title = /^TITLE: (.*)$/.exec(lines[0] ?? "");
  if (!title) throw new EdlParseError(1, 'the list must start with "TITLE: "');
  const fcm = /^FCM: (DROP FRAME|NON-DROP FRAME)$/.exec(lines[1] ?? "");
  if (!fcm) throw new EdlParseError(2, 'the second line must be "FCM: DROP FRAME" or "FCM: NON-DROP FRAME"');
  const dropFrame = fcm[1] === "DROP FRAME";
  const label = dropFrame ? /^\d\d:\d\d:\d\d;\d\d$/ : /^\d\d:\d\d:\d\d:\d\d$/;

  const result: ParsedEdl = { title: title[1]!, dropFrame, events: [], notes: [] };
  let place: "blank" | "event" | "notes" = "event";
  let record = format ? parseTimecode(dropFrame ? "01:00:00;00" : "01:00:00:00", format) : 0;
  for (const [index, line] of lines.entries()) {
    const n = index + 1;
    if (n <= 2) continue;
    if (line === "") {
      place = place === "notes" ? "notes" : "blank";
      continue;
    }
    if (line.startsWith("* ")) {
      const last = result.events.at(-1);
      if (place === "event" && !last) throw new EdlParseError(n, "a comment before the first event");
      if (place === "event") last!.comments.push(line.slice(2));
      else {
        place = "notes";
        result.notes.push(line.slice(2));
      }
      continue;
    }
    const m = eventLine.exec(line);
    if (!m) throw new EdlParseError(n, `not a CMX 3600 event line: ${line}`);
    if (place !== "blank") throw new EdlParseError(n, place === "notes" ? "an event after the closing notes" : "an event not set apart by a blank line");
    const reel = m[2]!.trimEnd();
    if (!/^[A-Z0-9_]+$/.test(reel)) throw new EdlParseError(n, `reel "${m[2]}" is not 8 columns of letters, digits and underscores`);
    const event: ParsedEdlEvent = { event: Number(m[1]), reel, channel: m[3]!, transition: m[4]!, sourceIn: m[5]!, sourceOut: m[6]!, recordIn: m[7]!, recordOut: m[8]!, comments: [] };
    if (event.event !== result.events.length + 1) throw new EdlParseError(n, `event ${m[1]} is out of sequence`);
    const times = [event.sourceIn, event.sourceOut, event.recordIn, event.recordOut];
    const wrong = times.find((t) => !label.test(t));
    if (wrong) throw new EdlParseError(n, `${wrong} is not written as ${dropFrame ? "drop-frame" : "non-drop-frame"}, as the FCM line says`);
    if (format) record = checkTimes(n, times, format, record);
    result.events.push(event);
    place = "event";
  }
  return result;
}

function checkTimes(n: number, times: string[], format: TimecodeFormat, record: number): number {
  const [sourceIn, sourceOut, recordIn, recordOut] = times.map((t) => {
    try {
      return parseTimecode(t, format);
    } catch (error) {
      throw new EdlParseError(n, (error as Error).message);
    }
  }) as [number, number, number, number];
  if (sourceOut <= sourceIn) throw new EdlParseError(n, "the source out is not after the source in");
  if (recordIn !== record) throw new EdlParseError(n, "the record in does not follow the previous event");
  if (recordOut - recordIn !== sourceOut - sourceIn) throw new EdlParseError(n, "the record and source lengths differ");
  return recordOut;
}
