/**
 * An independent reader of CMX 3600 lists, for tests: it follows the reading rules of OpenTimelineIO's CMX 3600
 * adapter (OpenTimelineIO/otio-cmx3600-adapter, src/otio_cmx3600_adapter/edl_parser.py, statements_from_lines;
 * edl_statement.py, NoteFormStatement; cmx_3600_reader.py, EDLReader.load_from_statements and EventComments),
 * not Kerf's own strict reader: lines cut as Python's str.splitlines cuts them, stripped, blanks skipped; a line
 * starting with an edit number is an event (6 to 8 fields, times taken from the end), a "*" line a comment of the
 * event it follows, any other line a note (TITLE, FCM, …); statements before the first event join its comments.
 * No npm package reads CMX 3600, and OpenTimelineIO is not installable here, so its rules are restated.
 */
export interface OtioRulesEvent {
  editNumber: string;
  reel: string;
  channels: string;
  editType: string;
  sourceIn: string;
  sourceOut: string;
  recordIn: string;
  recordOut: string;
  /** The "FROM CLIP NAME" comment's data, as EventComments keeps it. */
  clipName: string | null;
  /** Every other comment of the event (the adapter's "unhandled" metadata). */
  comments: string[];
}

// Python's str.splitlines boundaries (Python documentation, "Built-in Types", str.splitlines): LF, CR, CR LF,
// VT, FF, the file, group and record separators, NEL, and the line and paragraph separators.
const boundaries = new Set([0x0a, 0x0d, 0x0b, 0x0c, 0x1c, 0x1d, 0x1e, 0x85, 0x2028, 0x2029]);

function pythonSplitlines(text: string): string[] {
  const lines: string[] = [];
  let start = 0;
  for (let i = 0; i < text.length; i++) {
    if (!boundaries.has(text.charCodeAt(i))) continue;
    lines.push(text.slice(start, i));
    if (text[i] === "\r" && text[i + 1] === "\n") i++;
    start = i + 1;
  }
  if (start < text.length) lines.push(text.slice(start));
  return lines;
}
const editNumberRe = /^(\d+[a-zA-Z]?)(>)?(>!)?\s+/;
const commentRe = /^\*\s*(.*)$/s;

export function readLikeOtio(text: string): { title: string | null; events: OtioRulesEvent[] } {
  let title: string | null = null;
  const events: OtioRulesEvent[] = [];
  let pending: string[] = [];
  for (const raw of pythonSplitlines(text)) {
    const line = raw.trim();
    if (!line) continue;
    const edit = editNumberRe.exec(line);
    const rest = edit ? line.slice(edit[0].length) : line;
    const comment = commentRe.exec(rest);
    if (!edit || comment) {
      const data = comment ? comment[1]!.trim() : rest;
      if (comment && !data) continue;
      if (!comment && data.startsWith("TITLE")) title = data.replace(/^TITLE:?/, "").trim();
      else if (!comment && data.startsWith("FCM")) continue;
      else if (events.length === 0) pending.push(data);
      else events.at(-1)!.comments.push(data);
      continue;
    }
    const fields = rest.split(/\s+/).filter(Boolean);
    if (fields.length < 6 || fields.length > 8) throw new Error(`incorrect number of fields [${fields.length}]: ${line}`);
    const [reel, channels, editType] = fields;
    const [sourceIn, sourceOut, recordIn, recordOut] = fields.slice(-4);
    events.push({ editNumber: edit[1]!.replace(/^0+/, ""), reel: reel!, channels: channels!, editType: editType!, sourceIn: sourceIn!, sourceOut: sourceOut!, recordIn: recordIn!, recordOut: recordOut!, clipName: null, comments: pending });
    pending = [];
  }
  for (const event of events) {
    const clipName = event.comments.find((c) => c.startsWith("FROM CLIP NAME"));
    event.clipName = clipName === undefined ? null : clipName.slice("FROM CLIP NAME".length).replace(/^:/, "").trim();
    event.comments = event.comments.filter((c) => c !== clipName);
  }
  return { title, events };
}
