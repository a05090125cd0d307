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
