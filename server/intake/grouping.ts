import type { Queryable } from "../db/client";
import { fileGroup, keysOf, type NewSuggestion } from "./grouping.repository";

/** The wording a new idea starts with: its first asker's words on one line, cut at 200 characters. */
export const firstWording = (text: string) => {
  const line = text.replace(/\s+/g, " ").trim();
  return line.length <= 200 ? line : `${line.slice(0, 199).trimEnd()}…`;
};

/**
 * Files one suggestion: under the open idea that already holds the same ask, else under a new idea of
 * its own. Call inside a transaction that holds the channel's grouping lock (lockChannelGrouping).
 * Returns null, and writes nothing, when the suggestion's fingerprint was imported before.
 */
export async function fileSuggestion(tx: Queryable, channelId: string, suggestion: NewSuggestion): Promise<{ suggestionId: string; ideaId: string; joined: boolean } | null> {
  const filed = await fileGroup(tx, channelId, firstWording(suggestion.text), [suggestion]);
  const suggestionId = filed.suggestionIds[0];
  return suggestionId ? { suggestionId, ideaId: filed.ideaId, joined: filed.joined } : null;
}

/**
 * Files many suggestions with the result of filing them one at a time, in order: rows with the same
 * key would each join the idea the first of them went to, so each distinct key is compared once, in the
 * order it first appears, and its rows are written together. A row whose key is empty (asking words
 * only) opens an idea of its own. Same lock as fileSuggestion; fingerprints filtered first. Returns
 * how many were written.
 */
export async function fileSuggestions(tx: Queryable, channelId: string, suggestions: NewSuggestion[]): Promise<number> {
  const keys = await keysOf(tx, suggestions.map((s) => s.text));
  const groups = new Map<string, NewSuggestion[]>();
  suggestions.forEach((suggestion, index) => {
    const key = keys[index] || `\u0000${index}`;
    const group = groups.get(key);
    if (group) group.push(suggestion);
    else groups.set(key, [suggestion]);
  });
  let added = 0;
  for (const group of groups.values()) added += (await fileGroup(tx, channelId, firstWording(group[0]!.text), group)).suggestionIds.length;
  return added;
}
