import { describeFormat } from "../../timecode/rates";
import { type ExportClip, formatOf } from "./clip-ranges";
import { safeText, toCsv, type CsvCell } from "../../csv/csv";

export const footageCsvHeader = [
  "file_name",
  "episode",
  "shoot_day",
  "shot",
  "kind",
  "rating",
  "tags",
  "camera",
  "recorded_at",
  "duration_seconds",
  "frame_rate",
  "start_timecode",
  "size_bytes",
  "mark_in",
  "mark_out",
  "mark_note",
  "notes",
];

/** The header record, CRLF-ended: the first piece of a streamed CSV. */
export const footageCsvHead = () => toCsv([footageCsvHeader]);

// Every text cell is defused: names, notes and tags are people's text, and the rest never starts with a sign.
const safe = (cell: CsvCell) => (typeof cell === "string" ? safeText(cell) : cell);

/** One record per mark; a clip with no marks gets one record with the mark columns empty. No header. */
export function footageCsvRecords(clips: readonly ExportClip[]): string {
  const rows: CsvCell[][] = [];
  for (const clip of clips) {
    const format = formatOf(clip);
    const base = [
      clip.fileName,
      clip.episodeTitle,
      clip.shootDay,
      clip.shotDescription,
      clip.kind,
      clip.rating,
      clip.tags.join(";"),
      clip.camera,
      clip.recordedAt,
      (clip.durationMs / 1000).toFixed(3),
      format ? describeFormat(format) : "",
      clip.startTimecode,
      clip.size,
    ].map(safe);
    const notes = safe(clip.notes);
    if (clip.marks.length === 0) rows.push([...base, "", "", "", notes]);
    for (const mark of clip.marks) rows.push([...base, safe(mark.in), safe(mark.out), safe(mark.note), notes]);
  }
  return rows.length === 0 ? "" : toCsv(rows);
}

export const footageCsv = (clips: readonly ExportClip[]) => footageCsvHead() + footageCsvRecords(clips);
