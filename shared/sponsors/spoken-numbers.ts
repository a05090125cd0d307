/**
 * A script says numbers as a host reads them ("eighty percent", "three hundred watts") while a sponsor's
 * talking points print them ("80%", "300 W"). This turns either into the same tokens: numbers as digits,
 * units and currencies by one name each, so "eighty percent" and "80%" compare equal. Each token keeps
 * the words it came from, to show what a script is missing in the point's own words.
 *
 * Number words, English, short scale (a million is 10^6, a billion 10^9), as The Chicago Manual of Style
 * (17th ed., 9.2–9.8, spelling out numbers; the hyphenation guide of chapter 7 for compounds such as
 * "twenty-five") writes them (from memory). "and" after a hundred or a thousand ("one hundred and five") as British usage says them;
 * "a hundred" for one hundred; "point" then digits for decimals. The cases in spoken-numbers.test.ts are the
 * test suite of the npm package words-to-numbers (finnfiddle/words-to-numbers, src/__tests__/index.js), which
 * Kerf does not use: its last release depends on babel-runtime 6 and core-js 2 (unmaintained), and it reads
 * "second" as 2 ("a second battery" becomes "1 2 battery"), where a script means the noun. Ordinals are left
 * as words for that reason.
 */
// Hand-written: words-to-numbers (above) and compromise (an NLP library: 4.7 MB, ~0.25 s per read of a
// long script here, and it reads "a second battery" as "0.5th battery") don't fit a check run at each keystroke.

export interface SpokenToken {
  /** The form compared: "80", "percent", "watt", or the word itself. */
  token: string;
  /** What the text said (in lower case), for messages: "eighty", "%", "w". */
  said: string;
}

const units = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"];
const teens = ["ten", "eleven", "twelve", "thirteen", "fourteen", "fifteen", "sixteen", "seventeen", "eighteen", "nineteen"];
const tens = ["", "", "twenty", "thirty", "forty", "fifty", "sixty", "seventy", "eighty", "ninety"];
const scales: Record<string, number> = { thousand: 1e3, million: 1e6, billion: 1e9, trillion: 1e12, quadrillion: 1e15, quintillion: 1e18 };

type Kind = "unit" | "teen" | "tens" | "hundred" | "scale";
function wordValue(word: string): { kind: Kind; value: number } | null {
  if (units.includes(word)) return { kind: "unit", value: units.indexOf(word) };
  if (teens.includes(word)) return { kind: "teen", value: 10 + teens.indexOf(word) };
  if (tens.indexOf(word) >= 2) return { kind: "tens", value: tens.indexOf(word) * 10 };
  if (word === "hundred") return { kind: "hundred", value: 100 };
  if (word in scales) return { kind: "scale", value: scales[word]! };
  return null;
}

/** Which word may follow which inside one number: "twenty five", "one hundred and five", not "one two". */
function mayFollow(previous: Kind, next: { kind: Kind; value: number }, smallestScale: number): boolean {
  if (next.kind === "scale") return next.value < smallestScale;
  if (next.kind === "hundred") return previous === "unit" || previous === "teen";
  if (previous === "tens") return next.kind === "unit" && next.value > 0;
  return previous === "hundred" || previous === "scale";
}

const isNumberText = (token: string) => /^\d+(\.\d+)?$/.test(token);
const tidy = (value: number) => String(Number(value.toPrecision(12)));

/** How a number may begin: digits ("1.5 million"), "a" or "an" before a hundred or a scale, or a number word. */
function numberStart(words: string[], i: number): { current: number; previous: Kind; length: number } | null {
  const word = words[i] ?? "";
  const next = wordValue(words[i + 1] ?? "");
  // Digits take a hundred or a scale word after them, as "nineteen" does ("3 hundred", "1.5 million").
  if (isNumberText(word)) return { current: Number(word), previous: "teen", length: 1 };
  if ((word === "a" || word === "an") && (next?.kind === "hundred" || next?.kind === "scale")) return { current: 1, previous: "unit", length: 1 };
  const own = wordValue(word);
  if (!own) return null;
  // "zero" stands alone; a bare "hundred" or "million" is one of them.
  if (own.kind === "hundred" || own.kind === "scale") return { current: 1, previous: "unit", length: 0 };
  return { current: own.value, previous: own.kind, length: 1 };
}

/**
 * Reads the number starting at `start`; answers its value and how many words it took, or null when no
 * number starts there.
 */
function readNumber(words: string[], start: number): { value: number; length: number } | null {
  const first = numberStart(words, start);
  if (!first) return null;
  let { current, previous } = first;
  let total = 0;
  let smallestScale = Infinity;
  let i = start + first.length;
  for (; i < words.length && !(previous === "unit" && current === 0); i++) {
    const and = words[i] === "and" && (previous === "hundred" || previous === "scale");
    const next = wordValue(words[and ? i + 1 : i]!);
    if (!next || (and && next.kind !== "unit" && next.kind !== "teen" && next.kind !== "tens") || !mayFollow(previous, next, smallestScale)) break;
    if (and) i++;
    if (next.kind === "hundred") current *= 100;
    else if (next.kind === "scale") {
      total += current * next.value;
      current = 0;
      smallestScale = next.value;
    } else current += next.value;
    previous = next.kind;
  }
  let value = total + current;
  // "forty two point five": the digits said after "point" are the decimals.
  if (words[i] === "point" && units.includes(words[i + 1] ?? "")) {
    let decimals = "";
    for (i++; units.includes(words[i] ?? ""); i++) decimals += String(units.indexOf(words[i]!));
    value = Number(`${tidy(value)}.${decimals}`);
  }
  return { value, length: i - start };
}

/**
 * Units and currencies by one name. Symbols count only after a number ("5 V", "80 %"); names count anywhere.
 * Symbols as the SI Brochure (BIPM, 9th ed., 2019) writes them: Tables 2 and 4 (A, V, W, Hz, m, kg, s),
 * Table 8 (min, h), 5.4.3 (a number and its unit apart or together, a symbol never in the plural) and 5.4.7
 * (% for 0.01); the rest common practice (mAh, Wh, "amps", "kilos", the currencies).
 */
const unitNames: [name: string, symbols: string[], words: string[]][] = [
  ["percent", ["%", "pct"], ["percent", "per cent"]],
  ["dollar", ["$", "usd"], ["dollar", "dollars", "bucks"]],
  ["euro", ["€", "eur"], ["euro", "euros"]],
  ["pound-sterling", ["£", "gbp"], []],
  ["volt", ["v"], ["volt", "volts"]],
  ["millivolt", ["mv"], ["millivolt", "millivolts"]],
  ["ampere", ["a"], ["amp", "amps", "ampere", "amperes"]],
  ["milliampere", ["ma"], ["milliamp", "milliamps", "milliampere", "milliamperes"]],
  ["milliampere-hour", ["mah"], ["milliamp hour", "milliamp hours", "milliampere hour", "milliampere hours"]],
  ["watt", ["w"], ["watt", "watts"]],
  ["kilowatt", ["kw"], ["kilowatt", "kilowatts"]],
  ["watt-hour", ["wh"], ["watt hour", "watt hours"]],
  ["hertz", ["hz"], ["hertz"]],
  ["millimetre", ["mm"], ["millimetre", "millimetres", "millimeter", "millimeters"]],
  ["centimetre", ["cm"], ["centimetre", "centimetres", "centimeter", "centimeters"]],
  ["metre", ["m"], ["metre", "metres", "meter", "meters"]],
  ["kilometre", ["km"], ["kilometre", "kilometres", "kilometer", "kilometers"]],
  ["gram", ["g"], ["gram", "grams", "gramme", "grammes"]],
  ["kilogram", ["kg"], ["kilogram", "kilograms", "kilo", "kilos"]],
  ["second", ["s", "sec", "secs"], ["second", "seconds"]],
  ["minute", ["min", "mins"], ["minute", "minutes"]],
  ["hour", ["h", "hr", "hrs"], ["hour", "hours"]],
  ["degree-celsius", ["° c", "°c", "c"], ["celsius", "degree celsius", "degrees celsius"]],
];

/** Longest match first: "watt hours" before "watt", "° c" before nothing. */
const unitPhrases = unitNames
  .flatMap(([name, symbols, words]) => [...symbols.map((s) => ({ name, words: s.split(" "), symbol: true })), ...words.map((w) => ({ name, words: w.split(" "), symbol: false }))])
  .sort((a, b) => b.words.length - a.words.length);

function unitAt(words: string[], i: number, afterNumber: boolean): { name: string; length: number } | null {
  for (const phrase of unitPhrases) {
    if (phrase.symbol && !afterNumber) continue;
    if (phrase.words.every((w, k) => words[i + k] === w)) return { name: phrase.name, length: phrase.words.length };
  }
  return null;
}

/** Words as compared: lower case, accents off, numbers with their decimal point, thousands separators dropped. */
function wordsOf(text: string): string[] {
  const lowered = text.normalize("NFKD").replace(/[\u0300-\u036f]/g, "").toLowerCase();
  return [...lowered.matchAll(/\d{1,3}(?:,\d{3})+(?:\.\d+)?|\d+(?:\.\d+)?|\p{L}+|[%$€£°#]/gu)].map((m) => m[0]);
}

/** The text as compared tokens: numbers as digits, units and currencies by name, other words as they are. */
export function spokenTokens(text: string): SpokenToken[] {
  const said = wordsOf(text);
  const list = said.map((word) => word.replace(/,/g, ""));
  const out: SpokenToken[] = [];
  const saidOf = (from: number, length: number) => said.slice(from, from + length).join(" ");
  for (let i = 0; i < list.length; ) {
    const currency = /^[$€£]$/.test(list[i]!) ? unitAt(list, i, true) : null;
    const at = currency ? i + 1 : i;
    const number = readNumber(list, at);
    if (number) {
      out.push({ token: tidy(number.value), said: saidOf(at, number.length) });
      i = at + number.length;
      const unit = currency ?? unitAt(list, i, true);
      if (unit) out.push({ token: unit.name, said: currency ? said[at - 1]! : saidOf(i, unit.length) });
      if (unit && !currency) i += unit.length;
      continue;
    }
    const unit = unitAt(list, i, false);
    out.push(unit ? { token: unit.name, said: saidOf(i, unit.length) } : { token: list[i]!, said: said[i]! });
    i += unit?.length ?? 1;
  }
  return out;
}
