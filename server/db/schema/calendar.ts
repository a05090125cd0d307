import { sql } from "drizzle-orm";
import { index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { feedScopes } from "../../../shared/calendar/feeds";
import type { CalendarEntry } from "../../../shared/calendar/entries";
import { channelRef, users } from "./accounts";
import { createdAt, id } from "./columns";

export const feedScopeEnum = pgEnum("calendar_feed_scope", feedScopes);

/** A member's private iCalendar address for one channel: only the SHA-256 of its secret is kept. */
export const calendarFeeds = pgTable(
  "calendar_feeds",
  {
    id: id(),
    channelId: channelRef(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    scope: feedScopeEnum("scope").notNull(),
    createdAt: createdAt(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [
    // Led by the member: the account page lists a member's feeds across their channels; a channel's
    // lookup names both columns.
    uniqueIndex("calendar_feeds_one_live_idx").on(t.userId, t.channelId).where(sql`${t.revokedAt} is null`),
  ],
);

/**
 * What a feed last sent of each entry: its digest, its SEQUENCE (raised whenever the entry changes) and
 * the entry itself, so an entry that left the calendar is still sent, once more changed, as cancelled.
 */
export const calendarFeedItems = pgTable(
  "calendar_feed_items",
  {
    feedId: uuid("feed_id")
      .notNull()
      .references(() => calendarFeeds.id, { onDelete: "cascade" }),
    key: text("key").notNull(),
    digest: text("digest").notNull(),
    sequence: integer("sequence").notNull().default(0),
    entry: jsonb("entry").$type<CalendarEntry>().notNull(),
    changedAt: timestamp("changed_at", { withTimezone: true }).notNull().defaultNow(),
    cancelledAt: timestamp("cancelled_at", { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.feedId, t.key] }), index("calendar_feed_items_cancelled_idx").on(t.feedId, t.cancelledAt)],
);
