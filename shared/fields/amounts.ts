import { z } from "zod";

/**
 * Amounts of money as people type them: "1800.50", "1,800.50", "1 800,50", "1.800,50" or "1’800.50".
 * Grouping marks (comma, point, space, apostrophe) sit between groups of three digits; the decimal
 * mark is the last comma or point followed by one or two digits. A lone "1,800" or "1.800" reads as
 * one thousand eight hundred only when grouping makes sense (three digits after the mark) and the
 * other mark isn't used: that is how the locales that group by threes write it (CLDR number symbols,
 * checked against Intl.NumberFormat in amounts.test.ts). A point with three digits after it and
 * nothing else ("1.800") stays a decimal point, as the largest share of readers would read it.
 * Two decimals at most unless asked: amounts in currencies with three or four (ISO 4217's minor unit)
 * ask for more, and their currency then says how many it allows.
 */
export type AmountReading = { ok: true; text: string; value: number } | { ok: false; problem: "blank" | "negative" | "unreadable" | "decimals" };

const groupMarks = /[\s\u00a0\u202f'’]/g;

export function readAmount(raw: string, maxDecimals = 2): AmountReading {
  let text = raw.trim().replace(groupMarks, "");
  if (text === "") return { ok: false, problem: "blank" };
  if (/^[-−]/.test(text)) return { ok: false, problem: "negative" };
  if (text.startsWith("+")) text = text.slice(1);
  if (!/^[\d.,]+$/.test(text) || !/^\d/.test(text)) return { ok: false, problem: "unreadable" };
  const split = decimalSplit(text);
  if (!split) return { ok: false, problem: "unreadable" };
  const [whole, fraction] = split;
  if (fraction.length > maxDecimals) return { ok: false, problem: "decimals" };
  const normal = fraction ? `${whole}.${fraction}` : whole;
  return { ok: true, text: normal.replace(/^0+(?=\d)/, ""), value: Number(normal) };
}

/** The digits before and after the decimal mark, or null when the marks don't make one number. */
function decimalSplit(text: string): [string, string] | null {
  const lastMark = Math.max(text.lastIndexOf(","), text.lastIndexOf("."));
  if (lastMark === -1) return [text, ""];
  const mark = text.charAt(lastMark);
  const other = mark === "," ? "." : ",";
  const after = text.slice(lastMark + 1);
  const marksOfKind = text.split(mark).length - 1;
  const groupsOnly = !text.includes(other) && (marksOfKind > 1 || (mark === "," && after.length === 3));
  if (groupsOnly) return grouped(text, mark) ? [text.split(mark).join(""), ""] : null;
  if (marksOfKind > 1 || after.length === 0) return null;
  const whole = text.slice(0, lastMark);
  if (whole.includes(other) && !grouped(whole, other)) return null;
  return [whole.split(other).join(""), after];
}

/** "1,800,000": a first group of one to three digits, then groups of exactly three. */
function grouped(text: string, mark: string): boolean {
  const [first = "", ...rest] = text.split(mark);
  return /^\d{1,3}$/.test(first) && rest.every((group) => /^\d{3}$/.test(group));
}

const decimalWords = ["no", "one", "two", "three", "four"];

const amountMessages = (noun: string, maxDecimals = 2) => ({
  blank: `Enter the ${noun}.`,
  negative: `The ${noun} must be zero or more.`,
  unreadable: `Write the ${noun} as a number, e.g. 1800.50 or 1,800.50.`,
  decimals: `Use at most ${decimalWords[maxDecimals]} decimals for the ${noun}.`,
});

/**
 * An amount typed as text, checked; `plainAmount` turns it into plain decimal text ("1800.50") for a
 * numeric column. The two are apart because zod reports a union's messages only for a member that
 * doesn't transform (a pipe stops the union looking inside it), and optional amounts sit in a union.
 */
export function amountTextSchema(noun: string, maxWholeDigits = 9) {
  const problemOf = (raw: string) => {
    const reading = readAmount(raw);
    if (!reading.ok) return amountMessages(noun)[reading.problem];
    return (reading.text.split(".")[0] ?? "").length > maxWholeDigits ? `That ${noun} is too large.` : null;
  };
  // A refinement's issue doesn't abort, so a union around this schema still reports its message.
  return z
    .string()
    .superRefine((raw, ctx) => {
      const problem = problemOf(raw);
      if (problem) ctx.addIssue({ code: "custom", message: problem, continue: true });
    });
}

/** A checked amount as plain decimal text; anything else (blank, null) unchanged. */
export function plainAmount<T>(value: T): T | string {
  if (typeof value !== "string") return value;
  const reading = readAmount(value);
  return reading.ok ? reading.text : value;
}

/**
 * An amount sent as a number, or as the text the person typed, read the same way, up to `maxDecimals`;
 * answered as plain decimal text with its decimals as typed ("1.800" stays "1.800"), for the caller to
 * check against what the currency allows: a grouping point typed in a two-decimal currency is then
 * refused, not read as a decimal one.
 */
export function amountDecimalTextSchema(noun: string, max: number, maxDecimals: number) {
  const messages = amountMessages(noun, maxDecimals);
  const readingOf = (raw: number | string) => (typeof raw === "number" ? numberReading(raw, maxDecimals) : readAmount(raw, maxDecimals));
  return z
    .union([z.number(), z.string()], { error: messages.blank })
    .superRefine((raw, ctx) => {
      const reading = readingOf(raw);
      if (!reading.ok) ctx.addIssue({ code: "custom", message: messages[reading.problem], continue: true });
      else if (reading.value > max) ctx.addIssue({ code: "custom", message: `That ${noun} is too large.`, continue: true });
    })
    .transform((raw) => (readingOf(raw) as { text: string }).text);
}

function numberReading(value: number, maxDecimals: number): AmountReading {
  if (!Number.isFinite(value)) return { ok: false, problem: "unreadable" };
  if (value < 0) return { ok: false, problem: "negative" };
  // Written out in plain digits (never "1e-7"); a number that isn't that text within a rounding error has more decimals.
  const fixed = value.toFixed(maxDecimals);
  if (Math.abs(Number(fixed) - value) > Math.abs(value) * 1e-15) return { ok: false, problem: "decimals" };
  return { ok: true, text: fixed.includes(".") ? fixed.replace(/0+$/, "").replace(/\.$/, "") : fixed, value };
}
