import { durationFrames, framesToSeconds } from "../timecode/timecode";
import type { TimecodeFormat } from "../timecode/rates";

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

/** 0:00 style, rounded to the nearest second. */
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

function keywords(text: string): string[] {
  return [...new Set(normalise(text).split(" ").filter((word) => word.length > 0 && !stopWords.has(word)))];
}

function sentences(script: string): string[] {
  return script.split(/(?<=[.!?])\s+|\n+/u).filter((s) => s.trim().length > 0);
}

export interface PointCheck {
  point: string;
  /** "phrase": the point's words appear in order; "words": every keyword appears in one sentence. */
  covered: "phrase" | "words" | null;
  /** Keywords of the point missing from the sentence that covers most of them. */
  missing: string[];
}

/**
 * A talking point is ticked when the script says it: the whole phrase, or all of its keywords within
 * one sentence (so "free shipping over 50 euros" ticks on "shipping is free on orders over 50 euros").
 */
export function checkTalkingPoint(point: string, script: string): PointCheck {
  const phrase = normalise(point);
  if (phrase.length === 0) return { point, covered: null, missing: [] };
  if (` ${normalise(script)} `.includes(` ${phrase} `)) return { point, covered: "phrase", missing: [] };
  const wanted = keywords(point);
  let best: string[] = wanted;
  for (const sentence of sentences(script)) {
    const said = new Set(normalise(sentence).split(" "));
    const missing = wanted.filter((word) => !said.has(word));
    if (missing.length < best.length) best = missing;
  }
  return { point, covered: wanted.length > 0 && best.length === 0 ? "words" : null, missing: best };
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
