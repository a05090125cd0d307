import type { Area } from "../../shared/access/roles";
import type { CalendarEntry } from "../../shared/calendar/entries";
import type { Queryable } from "../db/client";
import type { Caller } from "../http/route-table";

/** The days asked for (inclusive), and optionally one episode only (a publish-date preview). */
export interface CalendarWindow {
  from: string;
  to: string;
  episodeId?: string;
}

/**
 * The calendar seam: a feature with dated things (publish days, shoot days, sponsor items) exports
 * `CalendarSource`s from its `<feature>.calendar.ts`; server/app.ts lists them and hands the list to the
 * calendar. A source answers one window of one channel in one query (never one per episode) and returns
 * only what the viewer's role may read; it is asked only when the role may read its `area`.
 */
export interface CalendarSource {
  name: string;
  area: Area;
  entriesFor(db: Queryable, viewer: Caller, window: CalendarWindow): Promise<CalendarEntry[]>;
}

/**
 * Moves an episode's target publish date with everything that follows it (the slate's publish-date
 * followers), inside the transaction it is handed: the calendar runs it in a transaction it rolls back
 * to show what would move, before anyone saves.
 */
export type PublishDateMover = (db: Queryable, move: { channelId: string; episodeId: string; actorId: string; date: string }) => Promise<void>;
