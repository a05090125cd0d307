import { formatDay } from "../fields/written-dates";
import type { CalendarEntry, CalendarMember, MovedEntry } from "./entries";

/** The key of a stage's due date on the calendar: one per episode and stage. */
export const stageDueKey = (episodeId: string, stage: string) => `stage_due:${episodeId}:${stage}`;

const isPublishing = (entry: CalendarEntry) => entry.kind === "publish" || entry.kind === "release";

function add(conflicts: Record<string, string[]>, key: string, message: string) {
  const list = (conflicts[key] ??= []);
  if (!list.includes(message)) list.push(message);
}

function groupBy<T>(items: T[], keyOf: (item: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const item of items) groups.set(keyOf(item), [...(groups.get(keyOf(item)) ?? []), item]);
  return groups;
}

/** Two different episodes going out on one day. */
function twoPublishes(entries: CalendarEntry[], conflicts: Record<string, string[]>) {
  for (const same of groupBy(entries.filter(isPublishing), (e) => e.day).values()) {
    const episodes = new Set(same.map((e) => e.episodeId));
    if (episodes.size < 2) continue;
    for (const entry of same) {
      const others = same.filter((e) => e.episodeId !== entry.episodeId).map((e) => `“${e.episodeTitle ?? e.title}”`);
      add(conflicts, entry.key, `Another episode publishes this day too: ${[...new Set(others)].join(", ")}.`);
    }
  }
}

/** A shoot day after its episode's shoot stage is due, or after the episode publishes. */
function shootPastDeadline(entries: CalendarEntry[], all: CalendarEntry[], conflicts: Record<string, string[]>) {
  const byKey = new Map(all.map((e) => [e.key, e]));
  for (const shoot of entries.filter((e) => e.kind === "shoot" && e.episodeId)) {
    const due = byKey.get(stageDueKey(shoot.episodeId!, "shoot"));
    if (due && shoot.day > due.day) add(conflicts, shoot.key, `Shoots after the shoot stage is due (${formatDay(due.day)}).`);
    const publish = all.find((e) => isPublishing(e) && e.episodeId === shoot.episodeId && shoot.day > e.day);
    if (publish) add(conflicts, shoot.key, `Shoots after the episode publishes (${formatDay(publish.day)}).`);
  }
}

/** One member on two shoot days of the same date. */
function bookedTwice(entries: CalendarEntry[], members: CalendarMember[], conflicts: Record<string, string[]>) {
  const names = new Map(members.map((m) => [m.id, m.name]));
  for (const same of groupBy(entries.filter((e) => e.kind === "shoot"), (e) => e.day).values()) {
    for (const entry of same) {
      for (const person of entry.people) {
        if (same.some((other) => other !== entry && other.people.includes(person))) {
          add(conflicts, entry.key, `${names.get(person) ?? "A member"} is booked on two shoot days this day.`);
        }
      }
    }
  }
}

/**
 * The clashes a producer wants to see at a glance, by entry key. `all` may hold entries outside the
 * ones shown (a stage due date past the range), so a shoot day is still checked against its deadline.
 */
export function findConflicts(entries: CalendarEntry[], members: CalendarMember[], all: CalendarEntry[] = entries): Record<string, string[]> {
  const conflicts: Record<string, string[]> = {};
  twoPublishes(entries, conflicts);
  shootPastDeadline(entries, all, conflicts);
  bookedTwice(entries, members, conflicts);
  return conflicts;
}

/** What a change of dates shifts: entries whose day changed, appeared or went, in date order. */
export function movedEntries(before: CalendarEntry[], after: CalendarEntry[]): MovedEntry[] {
  const was = new Map(before.map((e) => [e.key, e]));
  const now = new Map(after.map((e) => [e.key, e]));
  const moved: MovedEntry[] = [];
  for (const key of new Set([...was.keys(), ...now.keys()])) {
    const a = was.get(key);
    const b = now.get(key);
    if (a?.day === b?.day) continue;
    const entry = (b ?? a)!;
    moved.push({ key, kind: entry.kind, title: entry.title, from: a?.day ?? null, to: b?.day ?? null });
  }
  return moved.sort((x, y) => (x.to ?? x.from ?? "").localeCompare(y.to ?? y.from ?? ""));
}

/** Conflict messages present in `after` but not in `before`, once each. */
export function newConflictMessages(before: Record<string, string[]>, after: Record<string, string[]>): string[] {
  const had = new Set(Object.values(before).flat());
  return [...new Set(Object.values(after).flat())].filter((m) => !had.has(m));
}
