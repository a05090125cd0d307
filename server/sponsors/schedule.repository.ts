import { and, eq, sql } from "drizzle-orm";
import { users } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";
import { deals, deliverables } from "../db/schema/sponsors";
import { nextVersion } from "../db/versions";
import type { Db } from "./deals.repository";

/** A deal's items with how each is dated. */
export async function datingOfItems(db: Db, channelId: string, dealId: string) {
  return db
    .select({ id: deliverables.id, anchor: deliverables.anchor, offsetDays: deliverables.offsetDays, status: deliverables.status, dueDate: deliverables.dueDate })
    .from(deliverables)
    .where(and(eq(deliverables.dealId, dealId), eq(deliverables.channelId, channelId)));
}

export async function setDueDate(db: Db, deliverableId: string, dueDate: string | null) {
  await db.update(deliverables).set({ dueDate, version: nextVersion(deliverables.version), updatedAt: new Date() }).where(eq(deliverables.id, deliverableId));
}

export async function episodePublishDate(db: Db, channelId: string, episodeId: string) {
  const [episode] = await db
    .select({ publishDate: episodes.targetPublishDate })
    .from(episodes)
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)));
  return episode ?? null;
}

/**
 * Moves each of the episode's deals not yet dated from `publishDate` onto it, and answers those deals:
 * the claim that makes a date change re-date a deal's items once, however many callers race.
 */
export async function claimDealsForPublishDate(db: Db, channelId: string, episodeId: string, publishDate: string | null) {
  return db
    .update(deals)
    .set({ publishBasis: publishDate })
    .where(and(eq(deals.episodeId, episodeId), eq(deals.channelId, channelId), sql`${deals.publishBasis} is distinct from ${publishDate}`))
    .returning({ id: deals.id, channelId: deals.channelId, goLiveDate: deals.goLiveDate });
}

export async function userName(db: Db, userId: string): Promise<string | null> {
  const [user] = await db.select({ name: users.name }).from(users).where(eq(users.id, userId));
  return user?.name ?? null;
}

/** The deal's go-live date, set when the video goes live (the deal's version is left alone: a re-dating, not an edit). */
export async function setGoLiveDate(db: Db, channelId: string, dealId: string, goLiveDate: string) {
  await db.update(deals).set({ goLiveDate, updatedAt: new Date() }).where(and(eq(deals.id, dealId), eq(deals.channelId, channelId)));
}

/** The deal's go-live items, with their status. */
export async function goLiveItems(db: Db, channelId: string, dealId: string) {
  return db
    .select({ id: deliverables.id, status: deliverables.status })
    .from(deliverables)
    .where(and(eq(deliverables.dealId, dealId), eq(deliverables.channelId, channelId), eq(deliverables.kind, "go_live")));
}
