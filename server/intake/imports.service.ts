import { createHash } from "node:crypto";
import { parse } from "csv-parse/sync";
import { guessMapping, missingColumns } from "../../shared/intake/columns";
import { mapRow, type ImportedRow } from "../../shared/intake/import-rows";
import { importSchema, type ColumnMapping, type ImportPreview } from "../../shared/intake/schemas";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { parseBody } from "../http/validate";
import { fileSuggestions } from "./grouping";
import { fingerprintsTaken, lockChannelGrouping, type NewSuggestion } from "./grouping.repository";
import { pageOf, savePage } from "./page.repository";

const PREVIEW_ROWS = 20;

interface ParsedFile {
  headers: string[];
  records: { line: number; cells: string[] }[];
}

const malformed = (line: number, problem: string) =>
  new AppError("unprocessable", `Line ${line} of the file is malformed: ${problem}. Nothing from this file was imported.`, undefined, { line });

/** RFC 4180 CSV (csv-parse), first line the headers; a ragged or broken record names its line. */
function parseFile(csv: string): ParsedFile {
  let records: { info: { lines: number }; record: string[] }[];
  try {
    records = parse(csv, { bom: true, info: true, skip_empty_lines: true, relax_column_count: false }) as never;
  } catch (error) {
    const line = Number((error as { lines?: number }).lines ?? 0);
    throw malformed(line, (error as Error).message.replace(/^[A-Z_]+: /, "").replace(/ on line \d+$/, "").toLowerCase());
  }
  const [head, ...rest] = records;
  if (!head) throw new AppError("unprocessable", "The file holds no rows.");
  return { headers: head.record.map((h) => h.trim()), records: rest.map((r) => ({ line: r.info.lines, cells: r.record })) };
}

function checkedRows(file: ParsedFile, mapping: ColumnMapping): ImportedRow[] {
  const missing = missingColumns(mapping, file.headers);
  if (missing.length > 0) throw new AppError("unprocessable", `The file has no column named ${missing.map((m) => `"${m}"`).join(", ")}. Map the columns again.`);
  return file.records.map(({ line, cells }) => {
    const outcome = mapRow(cells, file.headers, mapping, line);
    if ("problem" in outcome) throw malformed(outcome.line, outcome.problem);
    return outcome.row;
  });
}

/** Same comment, same fingerprint: the platform's comment id when there is one, else author, time and words. */
export const fingerprintOf = (row: Pick<ImportedRow, "commentId" | "author" | "postedAt" | "text">) =>
  createHash("sha256")
    .update(row.commentId ? `id\u0000${row.commentId}` : `row\u0000${row.author ?? ""}\u0000${row.postedAt ?? ""}\u0000${row.text}`)
    .digest("hex");

export async function previewImport(db: Database, caller: Caller, body: unknown): Promise<ImportPreview> {
  const input = parseBody(importSchema, body);
  const file = parseFile(input.csv);
  const saved = (await pageOf(db, caller.channelId))?.mapping ?? null;
  const usable = (m: ColumnMapping | null) => (m && missingColumns(m, file.headers).length === 0 ? m : null);
  const mapping = input.mapping ?? usable(saved) ?? guessMapping(file.headers);
  const base = { headers: file.headers, mapping, mappingSaved: !input.mapping && mapping !== null && mapping === saved, total: file.records.length };
  if (!mapping) return { ...base, rows: [], alreadyImported: 0 };
  const rows = checkedRows(file, mapping);
  const taken = await fingerprintsTaken(db, caller.channelId, rows.map(fingerprintOf));
  return { ...base, rows: rows.slice(0, PREVIEW_ROWS).map(({ commentId: _id, ...row }) => row), alreadyImported: rows.filter((r) => taken.has(fingerprintOf(r))).length };
}

/**
 * Imports a whole file or nothing: every row is checked before the first is written, and all are
 * written in one transaction, grouped as if filed one by one (fileSuggestions). Rows already imported
 * (by fingerprint) and repeats within the file are skipped. The mapping is kept for the channel's next file.
 */
export async function importFile(db: Database, caller: Caller, body: unknown): Promise<{ added: number; skipped: number }> {
  const input = parseBody(importSchema, body);
  if (!input.mapping) throw new AppError("validation_failed", "Map the columns first.", { mapping: "Map the columns first." });
  const mapping = input.mapping;
  const rows = checkedRows(parseFile(input.csv), mapping);
  return inTransaction(db, async (tx) => {
    await savePage(tx, caller.channelId, { mapping });
    await lockChannelGrouping(tx, caller.channelId);
    const fingerprints = rows.map(fingerprintOf);
    const taken = await fingerprintsTaken(tx, caller.channelId, fingerprints);
    const fresh: NewSuggestion[] = [];
    for (const [index, row] of rows.entries()) {
      const fingerprint = fingerprints[index]!;
      if (taken.has(fingerprint)) continue;
      taken.add(fingerprint);
      const personKey = row.author ? `author:${row.author.toLowerCase()}` : `import:${fingerprint}`;
      fresh.push({ text: row.text, source: "import", personKey, author: row.author, link: row.link, askedAt: row.postedAt ? new Date(row.postedAt) : undefined, fingerprint });
    }
    const added = await fileSuggestions(tx, caller.channelId, fresh);
    return { added, skipped: rows.length - added };
  });
}
