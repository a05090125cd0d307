import type { Queryable } from "../db/client";
import { closestOpenIdea, insertIdea, insertSuggestion, type NewSuggestion } from "./grouping.repository";

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
  const closest = await closestOpenIdea(tx, channelId, suggestion.text);
  const ideaId = closest?.ideaId ?? (await insertIdea(tx, channelId, firstWording(suggestion.text)));
  const suggestionId = await insertSuggestion(tx, channelId, ideaId, suggestion);
  if (!suggestionId) return null;
  return { suggestionId, ideaId, joined: closest !== null };
}
