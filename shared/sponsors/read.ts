import { durationFrames, framesToSeconds } from "../timecode/timecode";
import type { TimecodeFormat } from "../timecode/rates";
import { type SpokenToken, spokenTokens } from "./spoken-numbers";

/**
 * A host's default speaking rate for a read, in words per minute. About 150 wpm is the figure given
 * for conversational US English (attributed to the National Center for Voice and Speech); S. E. Lucas,
 * "The Art of Public Speaking", gives 125–150 wpm for speeches, and narration often runs 150–160 wpm.
 * Each host sets their own rate; this is only where Kerf starts.
 */
export const DEFAULT_WORDS_PER_MINUTE = 150;
export const SPEAKING_RATE_SOURCE =
  "about 150 words a minute for conversational English (National Center for Voice and Speech); 125–150 for speeches (S. E. Lucas, The Art of Public Speaking)";
export const MIN_WORDS_PER_MINUTE = 60;
export const MAX_WORDS_PER_MINUTE = 300;

/** A word is a run of non-space characters holding at least one letter or digit ("—" alone is not). */
export function countWords(script: string): number {
  return script.split(/\s+/u).filter((token) => /[\p{L}\p{N}]/u.test(token)).length;
}

/** Seconds a script takes at a speaking rate: words ÷ (words per minute) × 60. */
export function readSeconds(words: number, wordsPerMinute: number): number {
  if (!(wordsPerMinute > 0)) throw new RangeError("The speaking rate must be above zero words a minute.");
  return (words / wordsPerMinute) * 60;
}

/** How every time on the read is shown (formatSeconds): to the nearest second, a half second up. */
export const READ_TIME_ROUNDING = "rounded to the nearest second (a half second rounds up)";

/** The sum behind the read time, in words: "180 words ÷ 150 words a minute = 72.0 s, rounded to …" (a no-break space before "s"). */
export function readTimeWorking(words: number, wordsPerMinute: number): string {
  const exact = readSeconds(words, wordsPerMinute);
  return `${words} ${words === 1 ? "word" : "words"} ÷ ${wordsPerMinute} words a minute = ${exact.toFixed(1)}\u00a0s, ${READ_TIME_ROUNDING}`;
}

/** 0:00 style, rounded to the nearest second, a half second away from zero (Math.round of the size). */
export function formatSeconds(seconds: number): string {
  const total = Math.round(Math.abs(seconds));
  const sign = seconds < 0 && total > 0 ? "−" : "";
  return `${sign}${Math.floor(total / 60)}:${String(total % 60).padStart(2, "0")}`;
}

/** Lower case, punctuation to spaces, single spaces: the form phrases are compared in. */
export function normalise(text: string): string {
  return text
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[^\p{L}\p{N}%$€£#]+/gu, " ")
    .trim();
}

// Short words that carry no meaning of their own in a talking point.
const stopWords = new Set(
  "a an and are as at be but by for from has have in is it its of on or our so that the their this to was we with you your".split(" "),
);

/** The point's tokens that must be said, once each, without the short words. */
function keywords(tokens: SpokenToken[]): SpokenToken[] {
  const seen = new Set<string>();
  return tokens.filter((t) => !stopWords.has(t.token) && !seen.has(t.token) && seen.add(t.token));
}

function sentences(script: string): string[] {
  return script.split(/(?<=[.!?])\s+|\n+/u).filter((s) => s.trim().length > 0);
}

function containsRun(haystack: string[], needle: string[]): boolean {
  outer: for (let i = 0; i + needle.length <= haystack.length; i++) {
    for (let k = 0; k < needle.length; k++) if (haystack[i + k] !== needle[k]) continue outer;
    return true;
  }
  return false;
}

export interface PointCheck {
  point: string;
  /** "phrase": the point's words appear in order; "words": every keyword appears in one sentence. */
  covered: "phrase" | "words" | null;
  /** Keywords of the point missing from the sentence that covers most of them, as the point says them. */
  missing: string[];
}

/**
 * A talking point is ticked when the script says it: the whole phrase, or all of its keywords within
 * one sentence (so "free shipping over 50 euros" ticks on "shipping is free on orders over fifty euros").
 * Numbers and units compare by value and name (spoken-numbers.ts): "eighty percent" says "80%".
 */
export function checkTalkingPoint(point: string, script: string): PointCheck {
  const wanted = spokenTokens(point);
  if (wanted.length === 0) return { point, covered: null, missing: [] };
  const said = spokenTokens(script).map((t) => t.token);
  if (containsRun(said, wanted.map((t) => t.token))) return { point, covered: "phrase", missing: [] };
  const needed = keywords(wanted);
  let best = needed;
  for (const sentence of sentences(script)) {
    const heard = new Set(spokenTokens(sentence).map((t) => t.token));
    const missing = needed.filter((k) => !heard.has(k.token));
    if (missing.length < best.length) best = missing;
  }
  return { point, covered: needed.length > 0 && best.length === 0 ? "words" : null, missing: best.map((k) => k.said) };
}

/** A link as people say and print it: no scheme, no "www.", no trailing slash, lower case. */
export function bareLink(link: string): string {
  return link
    .trim()
    .toLowerCase()
    .replace(/^[a-z][a-z0-9+.-]*:\/\//, "")
    .replace(/^www\./, "")
    .replace(/\/+$/, "");
}

/** True when the text carries the link, with or without its scheme and "www.". */
export function mentionsLink(text: string, link: string): boolean {
  const bare = bareLink(link);
  return bare.length > 0 && text.toLowerCase().includes(bare);
}

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** True when the promo code stands as a word of its own, in any case ("gantry10" in "code GANTRY10."). */
export function mentionsCode(text: string, code: string): boolean {
  const trimmed = code.trim();
  if (trimmed.length === 0) return false;
  return new RegExp(`(^|[^\\p{L}\\p{N}])${escapeRegExp(trimmed)}(?=$|[^\\p{L}\\p{N}])`, "iu").test(text);
}

export interface ReadInput {
  script: string;
  wordsPerMinute: number;
  contractedSeconds: number | null;
  talkingPoints: readonly string[];
  link: string | null;
  promoCode: string | null;
}

export interface ReadReport {
  words: number;
  wordsPerMinute: number;
  estimatedSeconds: number;
  contractedSeconds: number | null;
  /** Estimated minus contracted: positive means the read runs long. */
  overBySeconds: number | null;
  points: PointCheck[];
  pointsCovered: number;
  /** null when the deal has no link (or no code) to check. */
  linkInScript: boolean | null;
  codeInScript: boolean | null;
}

/** Everything the read panel shows about a script against its deal. */
export function analyseRead(input: ReadInput): ReadReport {
  const words = countWords(input.script);
  const estimatedSeconds = readSeconds(words, input.wordsPerMinute);
  const points = input.talkingPoints.map((point) => checkTalkingPoint(point, input.script));
  return {
    words,
    wordsPerMinute: input.wordsPerMinute,
    estimatedSeconds,
    contractedSeconds: input.contractedSeconds,
    overBySeconds: input.contractedSeconds === null ? null : estimatedSeconds - input.contractedSeconds,
    points,
    pointsCovered: points.filter((p) => p.covered !== null).length,
    linkInScript: input.link ? mentionsLink(input.script, input.link) : null,
    codeInScript: input.promoCode ? mentionsCode(input.script, input.promoCode) : null,
  };
}

/**
 * The segment's real length in the cut, from its in and out timecodes at the cut's frame rate (out
 * exclusive, as in an edit decision list). Throws TimecodeError on a bad label.
 */
export function measuredSeconds(inLabel: string, outLabel: string, format: TimecodeFormat): number {
  return framesToSeconds(durationFrames(inLabel, outLabel, format), format.rate);
}
