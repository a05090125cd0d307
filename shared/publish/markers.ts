// The browser build: it brings its own Buffer, so the chapter import runs in the page as in Node.
import { parse } from "csv-parse/browser/esm/sync";
import { parseTimecode, TimecodeError, framesToSeconds } from "../timecode/timecode";
import type { TimecodeFormat } from "../timecode/rates";
import type { Chapter } from "./chapters";

/**
 * Chapters from an editing program's markers. Two published shapes are read:
 * - a CSV marker list (RFC 4180), with a header row naming a time column and a name column;
 * - a CMX 3600 edit decision list, whose markers are `* LOC:` comment lines
 *   (`* LOC: 01:00:42:10 RED     Wiring the pack`), the form OpenTimelineIO's CMX 3600 adapter
 *   (opentimelineio/adapters/cmx_3600.py, its marker handling) reads.
 * Times count from the start of the programme: `start` (the timeline's first frame, often 01:00:00:00),
 * or, in an EDL, the first event's record in.
 */
export interface MarkerImport {
  chapters: Chapter[];
  problems: string[];
}

export interface MarkerOptions {
  format: TimecodeFormat;
  /** The timeline's first timecode; chapter times count from it. */
  start?: string;
}

const timeColumns = ["timecode", "start", "in", "record in", "time", "position", "source in"];
const nameColumns = ["name", "marker name", "title", "comment", "comments", "notes", "description"];

/** Seconds from a cell: a timecode at the list's rate, "H:MM:SS", "M:SS", or plain seconds. */
function secondsOf(cell: string, options: MarkerOptions, startFrame: number): number {
  const text = cell.trim();
  if (/^\d{2}:\d{2}:\d{2}[:;]\d{2}$/.test(text)) {
    return Math.floor(framesToSeconds(parseTimecode(text, options.format) - startFrame, options.format.rate));
  }
  const clock = /^(?:(\d+):)?(\d{1,2}):(\d{2})(?:\.\d+)?$/.exec(text);
  if (clock) return Number(clock[1] ?? 0) * 3600 + Number(clock[2]) * 60 + Number(clock[3]);
  if (/^\d+(?:\.\d+)?$/.test(text)) return Math.floor(Number(text));
  throw new TimecodeError("malformed", `"${text}" is not a time`);
}

const startFrameOf = (options: MarkerOptions) => (options.start ? parseTimecode(options.start, options.format) : 0);

function sorted(chapters: Chapter[]): Chapter[] {
  return [...chapters].sort((a, b) => a.startSeconds - b.startSeconds);
}

export function chaptersFromCsv(text: string, options: MarkerOptions): MarkerImport {
  let records: Record<string, string>[];
  try {
    records = parse(text, { columns: (header: string[]) => header.map((h) => h.trim().toLowerCase()), skip_empty_lines: true, bom: true, trim: true });
  } catch (error) {
    return { chapters: [], problems: [`The file is not a readable CSV list: ${(error as Error).message}`] };
  }
  const headers = Object.keys(records[0] ?? {});
  const timeColumn = timeColumns.find((c) => headers.includes(c));
  const nameColumn = nameColumns.find((c) => headers.includes(c));
  if (!timeColumn || !nameColumn) {
    return { chapters: [], problems: [`The list needs a time column (${timeColumns.join(", ")}) and a name column (${nameColumns.join(", ")}) in its first row.`] };
  }
  const chapters: Chapter[] = [];
  const problems: string[] = [];
  let startFrame = 0;
  try {
    startFrame = startFrameOf(options);
  } catch (error) {
    return { chapters: [], problems: [`The timeline start: ${(error as Error).message}.`] };
  }
  records.forEach((record, index) => {
    const title = record[nameColumn]?.trim() ?? "";
    try {
      const startSeconds = secondsOf(record[timeColumn] ?? "", options, startFrame);
      if (startSeconds < 0) throw new TimecodeError("out_of_range", "it is before the timeline's start");
      if (title) chapters.push({ startSeconds, title });
      else problems.push(`Row ${index + 2} has no name; it was left out.`);
    } catch (error) {
      problems.push(`Row ${index + 2}: ${(error as Error).message}; it was left out.`);
    }
  });
  return { chapters: sorted(chapters), problems };
}

const eventLine = /^\s*(\d{3,6})\s+(\S+)\s+(\S+)\s+(C|D\s+\d+|W\d+\s+\d+|K\s*B?\s*\d*)\s+(\d{2}:\d{2}:\d{2}[:;]\d{2})\s+(\d{2}:\d{2}:\d{2}[:;]\d{2})\s+(\d{2}:\d{2}:\d{2}[:;]\d{2})\s+(\d{2}:\d{2}:\d{2}[:;]\d{2})\s*$/;
const locLine = /^\s*\*\s*LOC:\s+(\d{2}:\d{2}:\d{2}[:;]\d{2})\s+(\S+)\s+(.*?)\s*$/i;

/** Chapters from the `* LOC:` markers of a CMX 3600 list; the programme starts at the first event's record in. */
export function chaptersFromEdl(text: string, options: MarkerOptions): MarkerImport {
  const lines = text.split(/\r?\n/);
  // FCM names the list's counting; without it the person's choice stands.
  const fcm = lines.find((l) => /^\s*FCM:/i.test(l));
  const format: TimecodeFormat = fcm ? { ...options.format, dropFrame: !/NON-DROP/i.test(fcm) && /DROP FRAME/i.test(fcm) } : options.format;
  const firstEvent = lines.map((l) => eventLine.exec(l)).find((m) => m !== null);
  const problems: string[] = [];
  let startFrame: number;
  try {
    startFrame = firstEvent?.[7] ? parseTimecode(firstEvent[7], format) : startFrameOf({ ...options, format });
  } catch (error) {
    return { chapters: [], problems: [`The list's start: ${(error as Error).message}.`] };
  }
  const chapters: Chapter[] = [];
  lines.forEach((line, index) => {
    const match = locLine.exec(line);
    if (!match) return;
    const [, timecode = "", , name = ""] = match;
    try {
      const frames = parseTimecode(timecode, format) - startFrame;
      if (frames < 0) throw new TimecodeError("out_of_range", `${timecode} is before the list's first event`);
      if (name) chapters.push({ startSeconds: Math.floor(framesToSeconds(frames, format.rate)), title: name });
      else problems.push(`Line ${index + 1}: the marker has no name; it was left out.`);
    } catch (error) {
      problems.push(`Line ${index + 1}: ${(error as Error).message}; it was left out.`);
    }
  });
  if (chapters.length === 0 && problems.length === 0) problems.push('The list has no markers ("* LOC:" lines) to make chapters from.');
  return { chapters: sorted(chapters), problems };
}

/** One of Kerf's own clip marks, as the footage export lays it on the timeline: its length and its note. */
export interface MarkSpan {
  frames: number;
  rate: { numerator: number; denominator: number };
  note: string;
}

/**
 * Chapters from the episode's marks, laid end to end from 0:00 in the order the footage's edit decision
 * list places them (each mark one event on the record side): a mark with a note starts a chapter named
 * by it, a mark without one runs on in the chapter before it.
 */
export function chaptersFromMarks(spans: readonly MarkSpan[]): MarkerImport {
  const chapters: Chapter[] = [];
  const problems: string[] = [];
  let at = 0;
  spans.forEach((span, index) => {
    const title = span.note.trim();
    if (title) chapters.push({ startSeconds: Math.floor(at + 1e-9), title });
    else if (index === 0) problems.push("The first mark has no note, so the first chapter starts at the first mark with one.");
    at += (span.frames * span.rate.denominator) / span.rate.numerator;
  });
  if (spans.length === 0) problems.push("The episode's footage has no marks yet: mark the moments in its footage part first.");
  else if (chapters.length === 0) problems.push("None of the marks has a note to name a chapter.");
  return { chapters, problems };
}
