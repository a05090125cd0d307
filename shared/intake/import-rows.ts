import { z } from "zod";
import { multiLine, toPlainLine } from "../fields/text";
import { hasHiddenCharacter } from "./hidden";
import { SUGGESTION_MAX, type ColumnMapping } from "./schemas";

export interface ImportedRow {
  line: number;
  text: string;
  author: string | null;
  link: string | null;
  postedAt: string | null;
  commentId: string | null;
}

export type RowOutcome = { row: ImportedRow } | { line: number; problem: string };

const commentText = multiLine(100_000, { blank: "the comment's text is empty" });
const link = z.url({ protocol: /^https?$/ });

/**
 * One CSV record, mapped and checked. A comment longer than a suggestion may be is cut to
 * SUGGESTION_MAX (a platform's comments run longer; the ask is at the start); text the rest of Kerf
 * refuses (control, direction or hidden characters, nothing visible) makes the row malformed, as do a
 * link that is not a web address and a date that cannot be read.
 */
export function mapRow(cells: readonly string[], headers: readonly string[], mapping: ColumnMapping, line: number): RowOutcome {
  const cell = (column: string | undefined) => (column ? (cells[headers.indexOf(column)] ?? "").trim() : "");
  const fail = (problem: string): RowOutcome => ({ line, problem });
  const text = commentText.safeParse(cell(mapping.text));
  if (!text.success) return fail(text.error.issues[0]?.message ?? "the comment's text can't be read");
  if (hasHiddenCharacter(text.data)) return fail("the comment holds invisible characters");
  const rawLink = cell(mapping.link);
  if (rawLink && !link.safeParse(rawLink).success) return fail(`"${rawLink.slice(0, 60)}" is not a web address`);
  const rawDate = cell(mapping.postedAt);
  const posted = rawDate ? new Date(rawDate) : null;
  if (posted && (Number.isNaN(posted.getTime()) || posted.getUTCFullYear() < 2000 || posted.getUTCFullYear() > 2100)) return fail(`"${rawDate.slice(0, 40)}" is not a date Kerf can read`);
  const cut = text.data.length > SUGGESTION_MAX ? `${text.data.slice(0, SUGGESTION_MAX - 1).trimEnd()}…` : text.data;
  return {
    row: { line, text: cut, author: toPlainLine(cell(mapping.author), 100) || null, link: rawLink || null, postedAt: posted?.toISOString() ?? null, commentId: toPlainLine(cell(mapping.commentId), 200) || null },
  };
}
