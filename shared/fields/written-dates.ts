/**
 * How Kerf writes dates and instants in words, on a page (through src/lib/format.ts, the client's
 * only format module) and in a mail (the server writes every time a mail states through this module).
 *
 * - A calendar date (stored as "YYYY-MM-DD", the same day in every zone): "Fri 5 Mar 2027".
 * - An instant in the reader's zone, always naming its offset: "Fri 5 Mar 2027, 14:05 UTC+1".
 * - Where the reader may not know which zone that is (a signed-out page, a mail): the offset and the
 *   zone's name, "Fri 5 Mar 2027, 14:05 UTC+1 (Europe/Berlin)"; UTC names itself.
 * English words and 24-hour times for everyone, whatever the browser's or server's language.
 */

const weekdays = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"] as const;
const months = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"] as const;

/** A moment's calendar and clock as seen in one time zone. */
interface Reading {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  offset: string;
  /** The zone the reading was made in: the one asked for, or UTC when that name is unknown. */
  zone: string;
}

const readers = new Map<string, Intl.DateTimeFormat>();

/** Building a formatter costs far more than using one; a page may show hundreds of times. */
function readerFor(timeZone: string): Intl.DateTimeFormat {
  let reader = readers.get(timeZone);
  if (!reader) {
    reader = new Intl.DateTimeFormat("en-GB", {
      timeZone,
      year: "numeric",
      month: "numeric",
      day: "numeric",
      hour: "numeric",
      minute: "numeric",
      hourCycle: "h23",
      timeZoneName: "shortOffset",
    });
    readers.set(timeZone, reader);
  }
  return reader;
}

/** The one place a moment becomes words: its parts in the zone, read by Intl, written in Kerf's order. */
function read(moment: Date, timeZone: string): Reading {
  let parts: Intl.DateTimeFormatPart[];
  let zone = timeZone;
  try {
    parts = readerFor(timeZone).formatToParts(moment);
  } catch {
    // An unknown zone name (a stale setting) must not blank the page: UTC, and it says so.
    parts = readerFor("UTC").formatToParts(moment);
    zone = "UTC";
  }
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? "";
  // Intl names the offset from GMT ("GMT+9", "GMT+0"); Kerf writes it from UTC, as ISO 8601 does.
  const offset = part("timeZoneName").replace(/^GMT/, "UTC").replace(/^UTC(\+0)?$/, "UTC") || "UTC";
  return { year: Number(part("year")), month: Number(part("month")), day: Number(part("day")), hour: Number(part("hour")), minute: Number(part("minute")), offset, zone };
}

function dayWords({ year, month, day }: Pick<Reading, "year" | "month" | "day">, withYear: boolean): string {
  // The weekday of a calendar day is the same in every zone: count it in UTC.
  const weekday = weekdays[new Date(Date.UTC(year, month - 1, day)).getUTCDay()];
  return `${weekday} ${day} ${months[month - 1]}${withYear ? ` ${year}` : ""}`;
}

const isoDate = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A calendar date ("2027-03-05") as people read it: "Fri 5 Mar 2027". Empty for no date. */
export function formatDay(date: string | null | undefined, { withYear = true }: { withYear?: boolean } = {}): string {
  if (!date) return "";
  const match = isoDate.exec(date);
  if (!match) return date;
  return dayWords({ year: Number(match[1]), month: Number(match[2]), day: Number(match[3]) }, withYear);
}

function clockWords(reading: Reading): string {
  const clock = `${String(reading.hour).padStart(2, "0")}:${String(reading.minute).padStart(2, "0")}`;
  return `${dayWords(reading, true)}, ${clock} ${reading.offset}`;
}

/** An instant with its time of day, in the reader's zone and naming its offset: "Fri 5 Mar 2027, 14:05 UTC+1". */
export function formatInstant(instant: string | Date, timeZone: string): string {
  return clockWords(read(new Date(instant), timeZone));
}

/**
 * An instant for a reader who may not know which zone it is written in (the sponsor's signed-out
 * page, a mail, an expiry someone elsewhere reads): the offset and the zone's name,
 * "Sat 12 Dec 2026, 18:00 UTC+1 (Europe/Berlin)". UTC needs no second name: "…, 17:00 UTC".
 */
export function formatInstantNamingZone(instant: string | Date, timeZone: string): string {
  const reading = read(new Date(instant), timeZone);
  const words = clockWords(reading);
  return reading.zone === "UTC" || reading.zone === "Etc/UTC" ? words : `${words} (${reading.zone})`;
}

/** The day an instant fell on in the reader's zone, where its time of day doesn't matter: "Fri 5 Mar 2027". */
export function formatInstantDay(instant: string | Date, timeZone: string): string {
  return dayWords(read(new Date(instant), timeZone), true);
}

const pad = (n: number) => String(n).padStart(2, "0");

/**
 * An instant as a wall clock in a zone reads it, to the minute, for machines that take a local time
 * and a zone name apart (an iCalendar DTSTART with its TZID): "2027-03-05T14:05:00".
 */
export function wallClockIn(instant: string | Date, timeZone: string): string {
  const r = read(new Date(instant), timeZone);
  return `${r.year}-${pad(r.month)}-${pad(r.day)}T${pad(r.hour)}:${pad(r.minute)}:00`;
}
