/** Someone who can be mentioned: a member of the channel. */
export interface Mentionable {
  id: string;
  name: string;
}

const wordChar = /[\p{L}\p{N}_]/u;

/**
 * The members a comment mentions, written as "@" and their name ("@Noor Halvorsen"), in order of
 * first mention. The longest name wins ("@Ana Lee" over "@Ana"); an "@" inside a word (an e-mail
 * address) mentions no one; case does not matter.
 */
export function mentionedIn(body: string, people: Mentionable[]): string[] {
  const byLength = [...people].filter((p) => p.name.trim().length > 0).sort((a, b) => b.name.length - a.name.length);
  const lower = body.toLowerCase();
  const found: string[] = [];
  for (let at = lower.indexOf("@"); at !== -1; at = lower.indexOf("@", at + 1)) {
    if (at > 0 && wordChar.test(body[at - 1]!)) continue;
    const person = byLength.find((p) => {
      const name = p.name.trim().toLowerCase();
      const after = body[at + 1 + name.length];
      return lower.startsWith(name, at + 1) && (after === undefined || !wordChar.test(after));
    });
    if (person && !found.includes(person.id)) found.push(person.id);
  }
  return found;
}

/** The "@…" being typed just before the caret: where its "@" is and what follows it so far. */
export function mentionAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const start = before.lastIndexOf("@");
  if (start === -1 || (start > 0 && wordChar.test(before[start - 1]!))) return null;
  const query = before.slice(start + 1);
  // Names have spaces, so the query may too; a line break, a second "@" or a long run ends it.
  if (/[\n@]/.test(query) || query.length > 40 || query.startsWith(" ")) return null;
  return { start, query };
}

/**
 * Members whose name starts with the query, then those with a later word that does; case and
 * accents don't matter ("noor h" and "Noor H" find "Noor Halvorsen"; "alv" finds nobody).
 */
export function mentionSuggestions<P extends Mentionable>(query: string, people: readonly P[], limit = 6): P[] {
  const fold = (text: string) => text.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();
  const wanted = fold(query);
  const first = people.filter((p) => fold(p.name).startsWith(wanted));
  const later = people.filter((p) => !first.includes(p) && fold(p.name).split(/\s+/).some((word) => word.startsWith(wanted)));
  return [...first, ...later].slice(0, limit);
}

/** The text with the "@…" being typed replaced by the chosen name and a space, and where the caret goes. */
export function completeMention(text: string, caret: number, name: string): { text: string; caret: number } {
  const typing = mentionAt(text, caret);
  const start = typing?.start ?? caret;
  const rest = text.slice(caret);
  // A space to go on typing, unless a space or punctuation follows already.
  const inserted = /^[\s,.;:!?)]/.test(rest) ? `@${name}` : `@${name} `;
  return { text: text.slice(0, start) + inserted + rest, caret: start + inserted.length };
}
