import type { ColumnMapping } from "./schemas";

/**
 * A first guess at which column of an exported comments file holds what, from its header names, for
 * the person to check in the preview. Words are common English header words, not any platform's format.
 */
const guesses: Record<keyof ColumnMapping, RegExp> = {
  text: /^(comment|text|body|message|content|comment text)$/i,
  author: /^(author|name|user|username|author name|by|from)$/i,
  link: /^(link|url|permalink|comment link|comment url)$/i,
  postedAt: /^(date|posted|posted at|published|published at|time|timestamp|created|created at)$/i,
  commentId: /^(id|comment id|comment_id)$/i,
};

export function guessMapping(headers: readonly string[]): ColumnMapping | null {
  const find = (key: keyof ColumnMapping) => headers.find((h) => guesses[key].test(h.trim())) ?? "";
  const text = find("text");
  if (!text) return null;
  return { text, author: find("author"), link: find("link"), postedAt: find("postedAt"), commentId: find("commentId") };
}

/** The mapping's columns the file lacks, in the order the mapping names them. */
export function missingColumns(mapping: ColumnMapping, headers: readonly string[]): string[] {
  return Object.values(mapping).filter((column): column is string => !!column && !headers.includes(column));
}
