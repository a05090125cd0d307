import { z } from "zod";
import { isIsoDate } from "../slate/dates";

/**
 * The one rule for dates and instants the API accepts.
 *
 * Calendar dates (publish dates, stage due dates, shoot days, go-live dates, deliverable dates,
 * invoice and payment dates) lie between 2000-01-01 and 2100-12-31: Kerf plans and records a video
 * channel's work, which began after 2000 and is not planned past 2100. The bounds also keep every date
 * Kerf derives from one (up to a year either side: stage lengths, deliverable offsets, payment terms,
 * reminders) inside four-digit years, where date arithmetic and ISO formatting are exact; a year such as
 * 9999 once overflowed a derived date.
 *
 * Recorded instants (when a clip was filmed, from the camera's own metadata) lie between 1900 and
 * 2100: archive footage and cameras whose clock was never set report old years (1904 is QuickTime's
 * zero, 1970 Unix time's), which are kept as written; year 0 or 9999 is no recording.
 */
export const EARLIEST_DATE = "2000-01-01";
export const LATEST_DATE = "2100-12-31";
export const EARLIEST_INSTANT = "1900-01-01T00:00:00.000Z";
export const LATEST_INSTANT = "2100-12-31T23:59:59.999Z";

export const dateMessages = {
  shape: "Write the date as YYYY-MM-DD.",
  missing: "That date doesn't exist.",
  range: "Pick a date between 2000 and 2100.",
  instant: "Give the time as an ISO 8601 date and time with its offset.",
  instantRange: "Give a time between 1900 and 2100.",
} as const;

export const isDateInRange = (date: string) => date >= EARLIEST_DATE && date <= LATEST_DATE;

/** Is this ISO 8601 instant within the recorded range? */
export function isInstantInRange(instant: string): boolean {
  const time = Date.parse(instant);
  return time >= Date.parse(EARLIEST_INSTANT) && time <= Date.parse(LATEST_INSTANT);
}

/** A calendar date, "YYYY-MM-DD", that exists and lies in Kerf's range. */
export const calendarDateSchema = z
  .string({ error: "Pick a date." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, dateMessages.shape)
  .refine((date) => !/^\d{4}-\d{2}-\d{2}$/.test(date) || isIsoDate(date), dateMessages.missing)
  .refine((date) => !isIsoDate(date) || isDateInRange(date), dateMessages.range);

/** A moment with its offset (ISO 8601), within the recorded range. */
export const recordedInstantSchema = z.iso.datetime({ offset: true, error: dateMessages.instant }).refine(isInstantInRange, dateMessages.instantRange);
