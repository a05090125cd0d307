import { z } from "zod";

/**
 * The one rule for text people type into Kerf. Every name, title and note in a request goes through
 * it, so what reaches a mail header, a CSV or EDL file or a file name is plain text:
 * - normalised to NFC (Unicode Standard Annex #15), so the same word is stored the same way;
 * - trimmed;
 * - no control characters (C0, DEL, C1), and no line breaks in one-line text; multi-line text keeps
 *   its line breaks (written as \n) and nothing else of that kind;
 * - no bidirectional embeddings, overrides or isolates (U+202A–U+202E, U+2066–U+2069, Unicode
 *   Standard Annex #9), which make text read in another order than it is stored;
 * - no broken UTF-16 (a lone surrogate);
 * - not blank once invisible characters are set aside (zero-width spaces and joiners, U+FEFF and the
 *   other default-ignorable code points, white space, the braille blank).
 */

// eslint-disable-next-line no-control-regex -- finding control characters is what this rule is for
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\t]/;
const LINE_BREAK = /[\n\r\u2028\u2029]/;
const BIDI_CONTROL = /[\u202A-\u202E\u2066-\u2069]/;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const INVISIBLE = /[\p{Default_Ignorable_Code_Point}\p{White_Space}\u2800]/gu;
// eslint-disable-next-line no-control-regex -- as above
const NOT_PLAIN = /[\u0000-\u001F\u007F-\u009F\u2028\u2029\u202A-\u202E\u2066-\u2069]+/g;
const LONE_SURROGATES = new RegExp(LONE_SURROGATE.source, "g");

// One formatter for every field: toLocaleString builds a new one per call, and schemas are built by the hundred at load.
const wholeNumber = new Intl.NumberFormat("en");

export const textMessages = {
  control: "Remove the control character (such as a tab or an escape code) from this text.",
  lineBreak: "Keep this to one line.",
  bidi: "Remove the hidden characters that change the text's direction.",
  broken: "This text holds a broken character; type it again.",
  invisible: "This holds only invisible characters: clear it or type some text.",
  tooLong: (max: number) => `Keep this under ${wholeNumber.format(max)} characters.`,
} as const;

/** Is there a character a reader can see? */
export const hasVisibleText = (text: string) => text.replace(INVISIBLE, "").length > 0;

export const hasControlCharacter = (text: string) => CONTROL.test(text);
export const hasLineBreak = (text: string) => LINE_BREAK.test(text);
export const hasBidiControl = (text: string) => BIDI_CONTROL.test(text);
export const isWellFormedText = (text: string) => !LONE_SURROGATE.test(text);

export interface TextOptions {
  /** Present for a required field: its message when the text is empty or shows nothing. */
  blank?: string;
  /** The message when the text is longer than `max` (after trimming). */
  tooLong?: string;
  /** The message when the value is not a string at all (defaults to `blank`). */
  error?: string;
}

function textRule(max: number, lines: "one" | "many", options: TextOptions) {
  const typeError = options.error ?? options.blank;
  let rule = z.string(typeError ? { error: typeError } : undefined).normalize("NFC");
  if (lines === "many") rule = rule.overwrite((text) => text.replace(/\r\n?|[\u2028\u2029]/g, "\n"));
  rule = rule
    .trim()
    .refine(isWellFormedText, textMessages.broken)
    .refine((text) => !hasControlCharacter(text), textMessages.control)
    .refine((text) => !hasBidiControl(text), textMessages.bidi);
  if (lines === "one") rule = rule.refine((text) => !hasLineBreak(text), textMessages.lineBreak);
  rule = options.blank
    ? rule.refine(hasVisibleText, options.blank)
    : rule.refine((text) => text === "" || hasVisibleText(text), textMessages.invisible);
  return rule.max(max, options.tooLong ?? textMessages.tooLong(max));
}

/** A name, title, label or any other one-line text. */
export const oneLine = (max: number, options: TextOptions = {}) => textRule(max, "one", options);

/** Notes, scripts, comments: line breaks kept (as \n), every other control character refused. */
export const multiLine = (max: number, options: TextOptions = {}) => textRule(max, "many", options);

/**
 * Text read by a machine (a file's own metadata: camera, codec), which the person can't correct:
 * made to pass the one-line rule rather than refused. Empty when nothing visible is left.
 */
export function toPlainLine(text: string, max: number): string {
  const plain = text.replace(LONE_SURROGATES, "\uFFFD").normalize("NFC").replace(NOT_PLAIN, " ").replace(/\s+/g, " ").trim();
  const cut = plain.slice(0, max).replace(/[\uD800-\uDBFF]$/, "").trim();
  return hasVisibleText(cut) ? cut : "";
}
