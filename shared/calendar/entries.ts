import { z } from "zod";
import { calendarDateSchema } from "../fields/dates";

/** What the calendar shows, in Kerf's words: each kind comes from one feature through the calendar seam. */
export const calendarKinds = ["publish", "release", "shoot", "deliverable", "stage_due", "figures"] as const;
export type CalendarKind = (typeof calendarKinds)[number];

export const calendarKindLabels: Record<CalendarKind, string> = {
  publish: "Publish day",
  release: "Release time",
  shoot: "Shoot day",
  deliverable: "Sponsor item",
  stage_due: "Stage due",
  figures: "Figures day",
};

/** A fee shown beside a money item, only to roles that may see money. */
export interface CalendarFee {
  amount: string;
  currency: string;
}

/**
 * One thing on the calendar. `day` is the calendar date it sits on in the reader's zone; a timed entry
 * also has its instant (`at`) and the zone it was set in (`zone`). `key` is stable across changes
 * (the feed's UID is made from it); `people` are the members it is theirs (owner, crew, item owner).
 */
export interface CalendarEntry {
  key: string;
  kind: CalendarKind;
  title: string;
  detail: string;
  day: string;
  at: string | null;
  zone: string | null;
  episodeId: string | null;
  episodeTitle: string | null;
  sponsorId: string | null;
  sponsorName: string | null;
  people: string[];
  href: string;
  fee: CalendarFee | null;
  /** A publish day that may be moved from the calendar carries the episode's version for the save. */
  episodeVersion: number | null;
}

export interface CalendarConflict {
  key: string;
  message: string;
}

export interface CalendarMember {
  id: string;
  name: string;
}

export interface CalendarView {
  from: string;
  to: string;
  today: string;
  timeZone: string;
  entries: CalendarEntry[];
  /** Conflict messages by entry key. */
  conflicts: Record<string, string[]>;
  members: CalendarMember[];
}

/** The longest range one request may ask for: a six-week month grid and then some. */
export const MAX_RANGE_DAYS = 93;

export const calendarRangeSchema = z
  .strictObject({ from: calendarDateSchema, to: calendarDateSchema })
  .refine((r) => r.from <= r.to, { message: "The range must end on or after its start.", path: ["to"] })
  .refine((r) => (Date.parse(r.to) - Date.parse(r.from)) / 86_400_000 < MAX_RANGE_DAYS, {
    message: `Ask for at most ${MAX_RANGE_DAYS} days at a time.`,
    path: ["to"],
  });
export type CalendarRange = z.infer<typeof calendarRangeSchema>;

export const publishMoveSchema = z.strictObject({
  episodeId: z.uuid({ error: "Pick an episode." }),
  date: calendarDateSchema,
});
export type PublishMoveInput = z.infer<typeof publishMoveSchema>;

/** One entry a publish-date move shifts: where it was and where it would go (null: it would leave the calendar). */
export interface MovedEntry {
  key: string;
  kind: CalendarKind;
  title: string;
  from: string | null;
  to: string | null;
}

export interface PublishMovePreview {
  episodeId: string;
  from: string | null;
  to: string;
  moved: MovedEntry[];
  /** Conflicts the move would make that are not there now. */
  newConflicts: string[];
}
