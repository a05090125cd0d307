import { and, asc, count, eq, gt, inArray } from "drizzle-orm";
import { clips } from "../db/schema/rushes";
import { deliverables, reviewPins } from "../db/schema/sponsors";
import type { Db } from "./deals.repository";

// The cut a sponsor reviews is a clip of the episode's footage (the rushes feature's table), read here
// by id and always within the channel.

const clipColumns = {
  id: clips.id,
  fileName: clips.fileName,
  durationMs: clips.durationMs,
  objectKey: clips.objectKey,
  contentType: clips.contentType,
  mediaState: clips.mediaState,
  proxyKey: clips.proxyKey,
  episodeId: clips.episodeId,
  frameRateNumerator: clips.frameRateNumerator,
  frameRateDenominator: clips.frameRateDenominator,
  dropFrame: clips.dropFrame,
  startTimecode: clips.startTimecode,
};

export type CutClipRow = Awaited<ReturnType<typeof findCutClips>>[number];

export async function findCutClips(db: Db, channelId: string, clipIds: string[]) {
  if (clipIds.length === 0) return [];
  return db
    .select(clipColumns)
    .from(clips)
    .where(and(eq(clips.channelId, channelId), inArray(clips.id, clipIds)));
}

export async function listEpisodeClips(db: Db, channelId: string, episodeIds: string[]) {
  if (episodeIds.length === 0) return [];
  return db
    .select(clipColumns)
    .from(clips)
    .where(and(eq(clips.channelId, channelId), inArray(clips.episodeId, episodeIds)))
    .orderBy(asc(clips.fileName))
    .limit(200);
}

export async function insertReviewPin(db: Db, row: typeof reviewPins.$inferInsert) {
  const [pin] = await db.insert(reviewPins).values(row).returning();
  return pin!;
}

/** How many comments a link has pinned, in all and since a moment. */
export async function countLinkPins(db: Db, linkId: string, since: Date) {
  const [all] = await db.select({ n: count() }).from(reviewPins).where(eq(reviewPins.linkId, linkId));
  const [recent] = await db
    .select({ n: count() })
    .from(reviewPins)
    .where(and(eq(reviewPins.linkId, linkId), gt(reviewPins.createdAt, since)));
  return { all: all?.n ?? 0, recent: recent?.n ?? 0 };
}

export async function listLinkPins(db: Db, linkId: string) {
  return db.select().from(reviewPins).where(eq(reviewPins.linkId, linkId)).orderBy(asc(reviewPins.offsetMs), asc(reviewPins.createdAt)).limit(500);
}

/** The pins of deals of one channel, with the item each was left on. */
export async function listDealPins(db: Db, channelId: string, dealIds: string[]) {
  if (dealIds.length === 0) return [];
  return db
    .select({ pin: reviewPins, deliverableTitle: deliverables.title })
    .from(reviewPins)
    .leftJoin(deliverables, eq(deliverables.id, reviewPins.deliverableId))
    .where(and(eq(reviewPins.channelId, channelId), inArray(reviewPins.dealId, dealIds)))
    .orderBy(asc(reviewPins.offsetMs), asc(reviewPins.createdAt))
    .limit(1000);
}
