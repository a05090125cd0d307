import { and, asc, eq, isNull, lt, sql } from "drizzle-orm";
import type { FeedScope } from "../../shared/calendar/feeds";
import type { CalendarEntry } from "../../shared/calendar/entries";
import type { Queryable } from "../db/client";
import { channels, memberships, users } from "../db/schema/accounts";
import { calendarFeedItems, calendarFeeds } from "../db/schema/calendar";

/** Ends the member's live feed in the channel, if any: its address answers 404 from now on. */
export async function revokeLiveFeed(db: Queryable, channelId: string, userId: string): Promise<boolean> {
  const rows = await db
    .update(calendarFeeds)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(calendarFeeds.channelId, channelId), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)))
    .returning({ id: calendarFeeds.id });
  return rows.length > 0;
}

export async function insertFeed(db: Queryable, values: { channelId: string; userId: string; tokenHash: string; scope: FeedScope }) {
  const [row] = await db.insert(calendarFeeds).values(values).returning({ id: calendarFeeds.id, createdAt: calendarFeeds.createdAt });
  return row!;
}

/** Each channel the person is a member of, with their live feed there (if any). */
export async function feedsOfPerson(db: Queryable, userId: string) {
  return db
    .select({ channelId: channels.id, channelName: channels.name, scope: calendarFeeds.scope, createdAt: calendarFeeds.createdAt })
    .from(memberships)
    .innerJoin(channels, eq(channels.id, memberships.channelId))
    .leftJoin(calendarFeeds, and(eq(calendarFeeds.channelId, memberships.channelId), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(channels.name), asc(channels.id));
}

/**
 * The live feed a secret's hash names, with its owner as they are now a member (a feed of someone who
 * left the channel finds nothing), locked so two fetches at once record one change once.
 */
export async function liveFeedByHash(db: Queryable, tokenHash: string) {
  const rows = await db
    .select({
      id: calendarFeeds.id,
      scope: calendarFeeds.scope,
      channelId: calendarFeeds.channelId,
      channelName: channels.name,
      userId: users.id,
      name: users.name,
      email: users.email,
      emailVerified: sql<boolean>`${users.emailVerifiedAt} is not null`,
      timeZone: users.timeZone,
      role: memberships.role,
    })
    .from(calendarFeeds)
    .innerJoin(memberships, and(eq(memberships.channelId, calendarFeeds.channelId), eq(memberships.userId, calendarFeeds.userId)))
    .innerJoin(users, eq(users.id, calendarFeeds.userId))
    .innerJoin(channels, eq(channels.id, calendarFeeds.channelId))
    .where(and(eq(calendarFeeds.tokenHash, tokenHash), isNull(calendarFeeds.revokedAt)))
    .for("update", { of: calendarFeeds })
    .limit(1);
  return rows[0] ?? null;
}

export async function itemsOf(db: Queryable, feedId: string) {
  return db.select().from(calendarFeedItems).where(eq(calendarFeedItems.feedId, feedId));
}

export interface ItemWrite {
  key: string;
  digest: string;
  sequence: number;
  entry: CalendarEntry;
  cancelled: boolean;
}

/** Records the entries that changed, appeared or went since the feed was last fetched, in one statement. */
export async function writeItems(db: Queryable, feedId: string, writes: ItemWrite[]) {
  if (writes.length === 0) return;
  await db
    .insert(calendarFeedItems)
    .values(writes.map((w) => ({ feedId, key: w.key, digest: w.digest, sequence: w.sequence, entry: w.entry, cancelledAt: w.cancelled ? sql`now()` : null, changedAt: sql`now()` })))
    .onConflictDoUpdate({
      target: [calendarFeedItems.feedId, calendarFeedItems.key],
      set: {
        digest: sql`excluded.digest`,
        sequence: sql`excluded.sequence`,
        entry: sql`excluded.entry`,
        cancelledAt: sql`excluded.cancelled_at`,
        changedAt: sql`now()`,
      },
    });
}

/** Withdrawn entries are sent as cancelled for a while, then forgotten. */
export async function forgetCancelled(db: Queryable, feedId: string, before: Date) {
  await db.delete(calendarFeedItems).where(and(eq(calendarFeedItems.feedId, feedId), lt(calendarFeedItems.cancelledAt, before)));
}
