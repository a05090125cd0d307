import { formatMinorUnits } from "@shared/money/minor-units";
import { formatBytes } from "@shared/rushes/limits";

// Dates and instants are written by the module the server's mails use too, so a page and a mail agree.
export { formatDay, formatInstant, formatInstantDay, formatInstantNamingZone } from "@shared/fields/written-dates";

/**
 * How Kerf writes dates, times, durations, sizes and money, the same way on every page. It is the
 * only module of the client that formats them: lint forbids `toLocale*String`, `Intl.DateTimeFormat`,
 * `Intl.NumberFormat` and date-fns' `format` everywhere else in src/.
 *
 * - A calendar date (a due date, a publish date; stored as "YYYY-MM-DD", the same day in every zone):
 *   "Fri 5 Mar 2027", or "Fri 5 Mar" where the year goes without saying.
 * - An instant (a comment, a move, an expiry), in the member's own time zone and always naming it,
 *   since the reader may be somewhere else: "Fri 5 Mar 2027, 14:05 UTC+1". Only its day, where the
 *   time of day doesn't matter: "Fri 5 Mar 2027". Where the reader may not know the zone (a
 *   signed-out page, an expiry read elsewhere) the zone's name too: "…, 18:00 UTC+1 (Europe/Berlin)".
 * - A duration, in its two largest units with the smaller one in two digits: "1 h 05 min",
 *   "4 min 07 s", "45 s", "3 d 4 h".
 * - A size in binary units, as storage counts them and as the server's messages write them, with
 *   one decimal below ten: "812 KiB", "8.5 MiB", "12 MiB", "3.1 GiB".
 * - Money with its currency: "€1,800.50", "US$250.00".
 * English words and 24-hour times for everyone, whatever the browser's language.
 */

let browserZone: string | undefined;

/**
 * The zone this browser is set to: the member's zone until they choose one in their settings. Read
 * once a page: every component that writes an instant asks for it, and each reading builds a formatter.
 */
export function browserTimeZone(): string {
  browserZone ??= new Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
  return browserZone;
}

/** A day in milliseconds, for a count of days written as a duration ("Late by 3 d"). */
export const DAY_MS = 86_400_000;

const units = [
  { symbol: "d", ms: 86_400_000 },
  { symbol: "h", ms: 3_600_000 },
  { symbol: "min", ms: 60_000 },
  { symbol: "s", ms: 1_000 },
] as const;

type DurationUnit = (typeof units)[number]["symbol"];

/**
 * A length of time in its two largest units: "1 h 05 min", "4 min 07 s", "45 s", "3 d 4 h". Minutes
 * and seconds after a larger unit take two digits, as on a clock; a zero second unit is left off
 * ("2 min"). `smallest` says how fine to go: a stay in a stage counts in hours ("under 1 h" below one).
 */
export function formatDuration(ms: number, { smallest = "s" }: { smallest?: DurationUnit } = {}): string {
  const sign = ms < 0 ? "−" : "";
  const floor = units.findIndex((u) => u.symbol === smallest);
  const step = units[floor]!.ms;
  let rest = smallest === "s" ? Math.round(Math.abs(ms) / step) * step : Math.floor(Math.abs(ms) / step) * step;
  if (rest === 0) return smallest === "s" ? "0 s" : `under 1 ${smallest}`;
  const first = units.findIndex((u, i) => i <= floor && rest >= u.ms);
  const words: string[] = [];
  for (const [i, unit] of units.entries()) {
    if (i < first || i > Math.min(first + 1, floor)) continue;
    const count = Math.floor(rest / unit.ms);
    rest -= count * unit.ms;
    if (i === first) words.push(`${count} ${unit.symbol}`);
    else if (count > 0) words.push(`${unit.symbol === "min" || unit.symbol === "s" ? String(count).padStart(2, "0") : count} ${unit.symbol}`);
  }
  return sign + words.join(" ");
}

/** Seconds, as a read or a cut is timed: formatSeconds(62) is "1 min 02 s". */
export const formatSeconds = (seconds: number) => formatDuration(seconds * 1000);

/** A file or a batch of files: "8.5 MiB" (the same words as the server's size limits). */
export const formatSize = (bytes: number) => formatBytes(bytes);

const moneyFormats = new Map<string, Intl.NumberFormat | null>();

/** An amount with its currency, "€1,800.50"; an unknown currency code is written after the amount. */
export function formatMoney(amount: number | string, currency: string): string {
  const value = typeof amount === "number" ? amount : Number(amount);
  if (!moneyFormats.has(currency)) {
    let format: Intl.NumberFormat | null;
    try {
      format = new Intl.NumberFormat("en-GB", { style: "currency", currency });
    } catch {
      format = null;
    }
    moneyFormats.set(currency, format);
  }
  const format = moneyFormats.get(currency);
  if (!Number.isFinite(value)) return `${amount} ${currency}`.trim();
  return format ? format.format(value) : `${value.toFixed(2)} ${currency}`.trim();
}

/** An amount held in the currency's minor unit (ISO 4217 exponent): formatMinorMoney(180050, "EUR") is "€1,800.50". */
export function formatMinorMoney(minor: number, currency: string): string {
  return formatMinorUnits(minor, currency, "en-GB");
}

/** A player's position, as a clock shows it to a tenth: formatClock(62.34) is "1:02.3". */
export function formatClock(seconds: number): string {
  const tenths = Math.max(0, Math.floor(seconds * 10 + 1e-6));
  const whole = Math.floor(tenths / 10);
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, "0")}.${tenths % 10}`;
}
