import { format } from "date-fns";
import { parseIsoDate } from "@shared/slate/dates";

/** A calendar date as people read it: "Fri 5 Mar 2027" (no zone: a date is the same day everywhere). */
export function formatDay(date: string | null, withYear = true): string {
  if (!date) return "";
  return format(parseIsoDate(date), withYear ? "EEE d MMM yyyy" : "EEE d MMM");
}

/** An instant in the member's own time zone, e.g. "5 Mar 2027, 14:05". */
export function formatInstant(instant: string, timeZone: string): string {
  try {
    return new Intl.DateTimeFormat("en-GB", { timeZone, day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" }).format(new Date(instant));
  } catch {
    return new Date(instant).toISOString().slice(0, 16).replace("T", " ");
  }
}
