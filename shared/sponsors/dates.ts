import { addDays, differenceInCalendarDays, format, isValid, parseISO } from "date-fns";
import { localDate } from "../slate/dates";

/**
 * Calendar dates as ISO strings ("2027-03-02"), the way PostgreSQL's `date` columns arrive.
 * date-fns works on local-time Date objects; parsing and formatting both in local time keeps a
 * date a date, whatever the process's time zone and across daylight-saving changes.
 */
export type IsoDate = string;

const isoDatePattern = /^\d{4}-\d{2}-\d{2}$/;

export function isIsoDate(text: string): boolean {
  if (!isoDatePattern.test(text)) return false;
  const parsed = parseISO(text);
  return isValid(parsed) && format(parsed, "yyyy-MM-dd") === text;
}

function toDate(date: IsoDate): Date {
  if (!isIsoDate(date)) throw new RangeError(`"${date}" is not a calendar date (YYYY-MM-DD)`);
  return parseISO(date);
}

export function shiftDate(date: IsoDate, days: number): IsoDate {
  return format(addDays(toDate(date), days), "yyyy-MM-dd");
}

/** Whole calendar days from `from` to `to` (positive when `to` is later). */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return differenceInCalendarDays(toDate(to), toDate(from));
}

/** The calendar date it is at `instant` in an IANA time zone ("Europe/Oslo"); UTC when the zone is unknown. */
export const dateInZone = (instant: Date, timeZone: string): IsoDate => localDate(instant, timeZone);
