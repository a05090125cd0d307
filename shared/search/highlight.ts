import type { TextRun } from "./schemas";

const WORD = /[\p{L}\p{N}]+/gu;

/** Lower case without accents, as the database folds text for search ("Crème" → "creme"). */
export function fold(text: string): string {
  return text.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();
}

/** The folded words a query looks for: not those it excludes ("-word") nor the words "or" and "and". */
export function queryWords(query: string): string[] {
  const kept = query.split(/\s+/).filter((token) => !token.startsWith("-"));
  const words = fold(kept.join(" ")).match(WORD) ?? [];
  return [...new Set(words.filter((w) => w !== "or" && w !== "and"))];
}

/** pg_trgm's trigrams of one word: two spaces before it, one after (PostgreSQL manual, F.35.1 "pg_trgm Concepts"). */
function trigrams(word: string): Set<string> {
  const padded = `  ${word} `;
  const grams = new Set<string>();
  for (let i = 0; i + 3 <= padded.length; i++) grams.add(padded.slice(i, i + 3));
  return grams;
}

/** pg_trgm's similarity: shared trigrams over all trigrams of the two words. */
export function trigramSimilarity(a: string, b: string): number {
  const x = trigrams(a);
  const y = trigrams(b);
  const shared = [...x].filter((g) => y.has(g)).length;
  return shared / (x.size + y.size - shared);
}

const commonPrefix = (a: string, b: string) => {
  let i = 0;
  while (i < a.length && i < b.length && a[i] === b[i]) i++;
  return i;
};

/**
 * Whether a word of the text answers a searched word: the same word, a longer word that starts with it
 * (a partial word), one with the same stem (a shared start missing at most three letters at the end:
 * "swelled", "swelling"), or a near spelling (a typo).
 */
export function wordAnswers(textWord: string, searched: string): boolean {
  const word = fold(textWord);
  if (word.startsWith(searched)) return true;
  const prefix = commonPrefix(word, searched);
  if (prefix >= 4 && prefix >= Math.max(word.length, searched.length) - 3) return true;
  return searched.length >= 4 && trigramSimilarity(word, searched) >= 0.45;
}

/**
 * The text as runs, the words answering the search marked. With `around`, only a window of about that
 * many characters around the first match is kept, cut at word boundaries and marked with "…".
 */
export function highlight(text: string, words: string[], around?: number): TextRun[] {
  const spans: { start: number; end: number }[] = [];
  for (const m of text.matchAll(WORD)) {
    if (words.some((w) => wordAnswers(m[0], w))) spans.push({ start: m.index, end: m.index + m[0].length });
  }
  const [from, to] = around && text.length > around ? windowOf(text, spans[0]?.start ?? 0, around) : [0, text.length];
  const runs: TextRun[] = [];
  let at = from;
  const push = (end: number, match: boolean) => end > at && runs.push({ text: text.slice(at, end), match });
  for (const span of spans.filter((s) => s.start >= from && s.end <= to)) {
    push(span.start, false);
    at = span.start;
    push(span.end, true);
    at = span.end;
  }
  push(to, false);
  if (from > 0) runs.unshift({ text: "…", match: false });
  if (to < text.length) runs.push({ text: "…", match: false });
  return runs;
}

function windowOf(text: string, first: number, size: number): [number, number] {
  let from = Math.max(0, Math.min(first - Math.floor(size / 4), text.length - size));
  let to = Math.min(text.length, from + size);
  if (from > 0) from = text.indexOf(" ", from) + 1 || from;
  if (to < text.length) to = text.lastIndexOf(" ", to) > from ? text.lastIndexOf(" ", to) : to;
  return [from, to];
}
