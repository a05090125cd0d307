import { roleMay } from "../../shared/access/roles";
import { findConflicts, movedEntries, newConflictMessages } from "../../shared/calendar/conflicts";
import type { CalendarEntry, CalendarRange, CalendarView, PublishMovePreview } from "../../shared/calendar/entries";
import { EARLIEST_DATE, LATEST_DATE } from "../../shared/fields/dates";
import { localDate } from "../../shared/slate/dates";
import type { Database, Queryable } from "../db/client";
import type { Caller } from "../http/route-table";
import type { CalendarSource, CalendarWindow, PublishDateMover } from "../seams/calendar-sources";
import { membersOf } from "./calendar.repository";

/** What the calendar is built from: every feature's source, and the slate's publish-date move. */
export interface CalendarPlugs {
  sources: readonly CalendarSource[];
  movePublishDate: PublishDateMover;
}

const byDay = (a: CalendarEntry, b: CalendarEntry) => a.day.localeCompare(b.day) || (a.at ?? "").localeCompare(b.at ?? "") || a.key.localeCompare(b.key);

/** Every source the caller's role may read, each asked once for the window. */
export async function gatherEntries(db: Queryable, sources: readonly CalendarSource[], caller: Caller, window: CalendarWindow): Promise<CalendarEntry[]> {
  const asked = sources.filter((source) => roleMay(caller.role, source.area, "R"));
  const lists = await Promise.all(asked.map((source) => source.entriesFor(db, caller, window)));
  return lists.flat().sort(byDay);
}

const shiftDay = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
const clampDay = (date: string) => (date < EARLIEST_DATE ? EARLIEST_DATE : date > LATEST_DATE ? LATEST_DATE : date);

/** How far back a shoot day's deadline may lie before the days shown: a shoot stage rarely ends earlier. */
const DEADLINE_LOOKBACK_DAYS = 62;

/** The days asked for, with their conflicts checked against deadlines that fall before them. */
export async function calendarView(db: Database, plugs: CalendarPlugs, caller: Caller, range: CalendarRange, now = new Date()): Promise<CalendarView> {
  const widened = { from: clampDay(shiftDay(range.from, -DEADLINE_LOOKBACK_DAYS)), to: range.to };
  const [all, members] = await Promise.all([gatherEntries(db, plugs.sources, caller, widened), membersOf(db, caller.channelId)]);
  const entries = all.filter((e) => e.day >= range.from && e.day <= range.to);
  return {
    ...range,
    today: localDate(now, caller.timeZone),
    timeZone: caller.timeZone,
    entries,
    conflicts: findConflicts(entries, members, all),
    members,
  };
}

/** The window a move's conflicts are checked in: both dates, and the deadlines before them. */
function moveWindow(from: string | null, to: string): CalendarWindow {
  const first = from && from < to ? from : to;
  const last = from && from > to ? from : to;
  return { from: clampDay(shiftDay(first, -DEADLINE_LOOKBACK_DAYS)), to: clampDay(shiftDay(last, 7)) };
}

class Preview extends Error {
  constructor(readonly preview: PublishMovePreview) {
    super("preview");
  }
}

/**
 * What moving an episode's publish date would move (its stage due dates, the sponsor items counted
 * from it) and which conflicts it would make, found by making the move with every follower in a
 * transaction that is then rolled back: the preview is the real rules, and nothing is saved.
 */
export async function previewPublishMove(db: Database, plugs: CalendarPlugs, caller: Caller, episodeId: string, date: string): Promise<PublishMovePreview> {
  const whole = { from: EARLIEST_DATE, to: LATEST_DATE, episodeId };
  const members = await membersOf(db, caller.channelId);
  try {
    await db.transaction(async (tx) => {
      const mine = await gatherEntries(tx, plugs.sources, caller, whole);
      const from = mine.find((e) => e.key === `publish:${episodeId}`)?.day ?? null;
      const window = moveWindow(from, date);
      const around = await gatherEntries(tx, plugs.sources, caller, window);
      await plugs.movePublishDate(tx, { channelId: caller.channelId, episodeId, actorId: caller.userId, date });
      const [mineAfter, aroundAfter] = [await gatherEntries(tx, plugs.sources, caller, whole), await gatherEntries(tx, plugs.sources, caller, window)];
      const newConflicts = newConflictMessages(findConflicts(around, members), findConflicts(aroundAfter, members));
      throw new Preview({ episodeId, from, to: date, moved: movedEntries(mine, mineAfter), newConflicts });
    });
  } catch (error) {
    if (error instanceof Preview) return error.preview;
    throw error;
  }
  throw new Error("the preview's transaction ended without its answer");
}
