import { getVtimezoneComponent } from "@touch4it/ical-timezones";
import ical, { ICalEventStatus } from "ical-generator";
import type { CalendarEntry } from "../../shared/calendar/entries";
import { wallClockIn } from "../../shared/fields/written-dates";

/** An entry as the feed last sent it: its SEQUENCE, when it last changed (DTSTAMP), and whether it was withdrawn. */
export interface FeedItem {
  entry: CalendarEntry;
  sequence: number;
  changedAt: Date;
  cancelled: boolean;
}

/** The UID of an entry: the same entry keeps it in every fetch of every feed of this channel. */
export const uidOf = (channelId: string, key: string) => `${key.replaceAll(":", "-")}.${channelId}@kerf`;

/**
 * A "YYYY-MM-DD" day as ical-generator's all-day value: it writes an all-day date from the Date's UTC
 * fields, so the Date is UTC midnight of that day, the same day whatever TZ the server runs in.
 */
const utcMidnight = (day: string, addDays = 0) => new Date(Date.parse(`${day}T00:00:00Z`) + addDays * 86_400_000);

/** How long a timed entry lasts in a calendar app: the entries are moments, shown as half an hour. */
const TIMED_MINUTES = 30;

/** The zone a timed entry was set in, when the VTIMEZONE data knows it; null for UTC (written with "Z"). */
const zoneOf = (entry: CalendarEntry) => (entry.zone && getVtimezoneComponent(entry.zone) ? entry.zone : null);

const plusMinutes = (instant: string, minutes: number) => new Date(Date.parse(instant) + minutes * 60_000).toISOString();

function timesOf(entry: CalendarEntry) {
  if (entry.at === null) return { start: utcMidnight(entry.day), end: utcMidnight(entry.day, 1), allDay: true };
  const zone = zoneOf(entry);
  const end = plusMinutes(entry.at, TIMED_MINUTES);
  if (zone === null) return { start: new Date(entry.at), end: new Date(end) };
  // ical-generator writes a plain Date with a zone from the server process's own clock: it is handed the zone's wall clock as text.
  return { start: wallClockIn(entry.at, zone), end: wallClockIn(end, zone), timezone: zone };
}

const describe = (entry: CalendarEntry, appUrl: string) =>
  [entry.detail, entry.fee ? `Fee: ${entry.fee.amount} ${entry.fee.currency}.` : "", `Open in Kerf: ${appUrl}${entry.href}`].filter(Boolean).join("\n");

/**
 * The iCalendar text (RFC 5545) of one feed: all-day entries as DATE with the next day as the
 * (exclusive) end, timed ones in the zone they were set in with that zone's VTIMEZONE, withdrawn ones
 * as STATUS:CANCELLED. ical-generator folds lines at 75 octets and ends lines with CRLF.
 */
export function renderFeed(input: { name: string; channelId: string; appUrl: string; items: FeedItem[] }): string {
  const calendar = ical({ name: input.name, prodId: { company: "Kerf", product: "Calendar feed", language: "EN" }, timezone: { name: null, generator: getVtimezoneComponent } });
  for (const { entry, sequence, changedAt, cancelled } of input.items) {
    calendar.createEvent({
      id: uidOf(input.channelId, entry.key),
      sequence,
      stamp: changedAt,
      summary: entry.title,
      description: describe(entry, input.appUrl),
      url: `${input.appUrl}${entry.href}`,
      status: cancelled ? ICalEventStatus.CANCELLED : ICalEventStatus.CONFIRMED,
      ...timesOf(entry),
    });
  }
  // RFC 5545 ends every line, the last one too, with CRLF; ical-generator leaves the last one off.
  return `${calendar.toString()}\r\n`;
}
