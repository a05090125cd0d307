/**
 * The video platform's text limits, as its data API reference states them for a video's snippet
 * (YouTube Data API v3, "Videos" resource, snippet.title and snippet.description): a title of at most
 * 100 characters, a description of at most 5,000 bytes, and neither may hold "<" or ">".
 */
export const TITLE_MAX_CHARACTERS = 100;
export const DESCRIPTION_MAX_BYTES = 5000;
export const REFUSED_CHARACTERS = ["<", ">"] as const;

/** Characters as a person counts them: code points, so an emoji is one, not two UTF-16 units. */
export const characterCount = (text: string) => Array.from(text).length;

/** Bytes of the text in UTF-8, the way the platform counts a description. */
export const utf8Bytes = (text: string) => new TextEncoder().encode(text).length;

export interface RefusedAt {
  character: string;
  /** 1-based line and column, for a person to find it. */
  line: number;
  column: number;
}

/** Every "<" and ">" in the text, where it is. */
export function refusedCharacters(text: string): RefusedAt[] {
  const found: RefusedAt[] = [];
  text.split("\n").forEach((content, index) => {
    Array.from(content).forEach((character, at) => {
      if ((REFUSED_CHARACTERS as readonly string[]).includes(character)) found.push({ character, line: index + 1, column: at + 1 });
    });
  });
  return found;
}

export interface TextCheck {
  used: number;
  limit: number;
  unit: "characters" | "bytes";
  problems: string[];
}

function refusedMessage(what: string, refused: RefusedAt[]): string[] {
  if (refused.length === 0) return [];
  const where = refused.slice(0, 3).map((r) => `"${r.character}" at line ${r.line}, column ${r.column}`).join("; ");
  const more = refused.length > 3 ? ` and ${refused.length - 3} more` : "";
  return [`The platform refuses "<" and ">" in a ${what}: ${where}${more}.`];
}

export function checkTitle(title: string): TextCheck {
  const used = characterCount(title);
  const problems: string[] = [];
  if (title.trim() === "") problems.push("The title is empty.");
  if (used > TITLE_MAX_CHARACTERS) problems.push(`The title has ${used} characters; the platform takes at most ${TITLE_MAX_CHARACTERS}.`);
  return { used, limit: TITLE_MAX_CHARACTERS, unit: "characters", problems: [...problems, ...refusedMessage("title", refusedCharacters(title))] };
}

export function checkDescription(description: string): TextCheck {
  const used = utf8Bytes(description);
  const problems: string[] = [];
  if (used > DESCRIPTION_MAX_BYTES) {
    problems.push(`The description takes ${used} bytes; the platform takes at most ${DESCRIPTION_MAX_BYTES} (counted in UTF-8 bytes: accented letters take 2, most emoji 4).`);
  }
  return { used, limit: DESCRIPTION_MAX_BYTES, unit: "bytes", problems: [...problems, ...refusedMessage("description", refusedCharacters(description))] };
}
