import { addBusinessDays, differenceInCalendarDays, format, isValid, isWeekend } from "date-fns";

/**
 * Calendar dates as Kerf stores them: "YYYY-MM-DD", no time and no zone. Arithmetic runs on a Date
 * at local noon so that a daylight-saving shift in the process's zone can never move the day.
 */
export type IsoDate = string;

const isoDatePattern = /^(\d{4})-(\d{2})-(\d{2})$/;

export function parseIsoDate(date: IsoDate): Date {
  const match = isoDatePattern.exec(date);
  if (!match) throw new RangeError(`not a calendar date: ${date}`);
  const [, y, m, d] = match.map(Number) as [number, number, number, number];
  const day = new Date(y, m - 1, d, 12);
  if (!isValid(day) || day.getFullYear() !== y || day.getMonth() !== m - 1 || day.getDate() !== d) throw new RangeError(`not a calendar date: ${date}`);
  return day;
}

export function isIsoDate(value: string): boolean {
  try {
    parseIsoDate(value);
    return true;
  } catch {
    return false;
  }
}

export const formatIsoDate = (day: Date): IsoDate => format(day, "yyyy-MM-dd");

/** Monday to Friday. Kerf knows no public holidays (they differ by country); the lengths absorb them. */
export const isWorkingDay = (date: IsoDate) => !isWeekend(parseIsoDate(date));

export function lastWorkingDayOnOrBefore(date: IsoDate): IsoDate {
  const day = parseIsoDate(date);
  while (isWeekend(day)) day.setDate(day.getDate() - 1);
  return formatIsoDate(day);
}

/** `n` working days after (n > 0) or before (n < 0) a working day. */
export function addWorkingDays(date: IsoDate, n: number): IsoDate {
  return formatIsoDate(addBusinessDays(parseIsoDate(date), n));
}

export const nextWorkingDayAfter = (date: IsoDate) => addWorkingDays(lastWorkingDayOnOrBefore(date), 1);

export const calendarDaysBetween = (from: IsoDate, to: IsoDate) => differenceInCalendarDays(parseIsoDate(to), parseIsoDate(from));

const formatters = new Map<string, Intl.DateTimeFormat>();

function dayFormatter(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    try {
      formatter = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" });
    } catch {
      formatter = dayFormatter("UTC");
    }
    // Building a formatter costs far more than using one; a board asks for thousands of dates.
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** The calendar date an instant falls on in a time zone (an unknown zone reads as UTC). */
export function localDate(instant: Date, timeZone: string): IsoDate {
  const parts = Object.fromEntries(dayFormatter(timeZone).formatToParts(instant).map((p) => [p.type, p.value]));
  return `${parts.year}-${parts.month}-${parts.day}`;
}
