import type { Queryable } from "../db/client";
import { dropEmptyKeys, fileGroup, fileUnder, ideasForKeys, ideasHoldingKeys, keysOf, type NewSuggestion } from "./grouping.repository";

/** The wording a new idea starts with: its first asker's words on one line, cut at 200 characters. */
export const firstWording = (text: string) => {
  const line = text.replace(/\s+/g, " ").trim();
  return line.length <= 200 ? line : `${line.slice(0, 199).trimEnd()}…`;
};

/**
 * Files one suggestion: under the open idea that already holds the same ask, else under a new idea of
 * its own. Call inside a transaction that holds the channel's grouping lock (lockChannelGrouping).
 * Returns null when the suggestion's fingerprint was imported before (a caller with fingerprints filters
 * them first, as importFile does, or an idea could open for nothing).
 */
export async function fileSuggestion(tx: Queryable, channelId: string, suggestion: NewSuggestion): Promise<{ suggestionId: string; ideaId: string; joined: boolean } | null> {
  const filed = await fileGroup(tx, channelId, firstWording(suggestion.text), [suggestion]);
  const suggestionId = filed.suggestionIds[0];
  return suggestionId ? { suggestionId, ideaId: filed.ideaId, joined: filed.joined } : null;
}

/**
 * Files many suggestions with the result of filing them one at a time, in order. Rows with the same
 * key would each go where the first of them went, so each distinct key is compared once, in the order
 * it first appears (ideasForKeys, one call), and then all rows are written in one statement. A key an
 * open idea already holds exactly is nearest to that idea wherever it comes in the file, so it needs no
 * comparing. A row whose key is empty (asking words only) opens an idea of its own. Same lock as
 * fileSuggestion; fingerprints filtered first. Returns how many were written.
 */
export async function fileSuggestions(tx: Queryable, channelId: string, suggestions: NewSuggestion[]): Promise<number> {
  const groups = [...(await byKey(tx, suggestions))];
  const realKey = (key: string) => (key.startsWith(NO_KEY) ? "" : key);
  const held = await ideasHoldingKeys(tx, channelId, groups.map(([key]) => realKey(key)).filter(Boolean));
  const fresh = groups.filter(([key]) => !held.has(key));
  const freshIdeas = await ideasForKeys(tx, channelId, fresh.map(([key]) => realKey(key)), fresh.map(([, rows]) => firstWording(rows[0]!.text)));
  const ideaOf = new Map([...held, ...fresh.map(([key], index): [string, string] => [key, freshIdeas[index]!])]);
  const added = await fileUnder(
    tx,
    channelId,
    groups.flatMap(([key, rows]) => rows.map(() => ideaOf.get(key)!)),
    groups.flatMap(([, rows]) => rows),
  );
  await dropEmptyKeys(tx, channelId, fresh.map(([key]) => realKey(key)).filter(Boolean));
  return added;
}

const NO_KEY = "\u0000";

/** The suggestions by grouping key, keys in the order they first appear; each empty key a group of its own under a key no text has. */
async function byKey(tx: Queryable, suggestions: NewSuggestion[]): Promise<Map<string, NewSuggestion[]>> {
  const keys = await keysOf(tx, suggestions.map((s) => s.text));
  const groups = new Map<string, NewSuggestion[]>();
  suggestions.forEach((suggestion, index) => {
    const key = keys[index] || `${NO_KEY}${index}`;
    const group = groups.get(key);
    if (group) group.push(suggestion);
    else groups.set(key, [suggestion]);
  });
  return groups;
}
