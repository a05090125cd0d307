import { and, asc, eq, gte, inArray, isNull, sql } from "drizzle-orm";
import type { Database } from "../db/client";
import { clips, shootDays, shots } from "../db/schema/rushes";
import { episodes } from "../db/schema/slate";

/** The home lists at most this many clips; the rushes page has the rest. */
export const UNRATED_LIMIT = 25;

/** Shoot days from `from` (YYYY-MM-DD) on, of episodes still on the slate, soonest first. */
export async function shootDaysFrom(db: Database, channelId: string, from: string, limit: number) {
  return db
    .select({ id: shootDays.id, day: shootDays.day, place: shootDays.place, callTime: shootDays.callTime, episodeId: episodes.id, episodeTitle: episodes.title })
    .from(shootDays)
    .innerJoin(episodes, eq(episodes.id, shootDays.episodeId))
    .where(and(eq(shootDays.channelId, channelId), gte(shootDays.day, from), isNull(episodes.archivedAt)))
    .orderBy(asc(shootDays.day), asc(shootDays.callTime), asc(shootDays.createdAt))
    .limit(limit);
}

/** Planned shots of these shoot days, in their list's order. */
export async function plannedShotsOf(db: Database, channelId: string, shootDayIds: string[]) {
  if (shootDayIds.length === 0) return [];
  return db
    .select({ id: shots.id, shootDayId: shots.shootDayId, description: shots.description, kind: shots.kind, priority: shots.priority })
    .from(shots)
    .where(and(eq(shots.channelId, channelId), inArray(shots.shootDayId, shootDayIds), eq(shots.status, "planned")))
    .orderBy(asc(shots.position));
}

/** Clips nobody has rated yet (select, maybe or reject), oldest recording first. */
export async function unratedClips(db: Database, channelId: string) {
  return db
    .select({ id: clips.id, fileName: clips.fileName, camera: clips.camera, recordedAt: clips.recordedAt, episodeId: episodes.id, episodeTitle: episodes.title })
    .from(clips)
    .innerJoin(episodes, eq(episodes.id, clips.episodeId))
    .where(and(eq(clips.channelId, channelId), isNull(clips.rating), isNull(episodes.archivedAt)))
    .orderBy(asc(clips.recordedAt), asc(clips.id))
    .limit(UNRATED_LIMIT);
}

/** How many clips are unrated in all, for "and N more". */
export async function unratedCount(db: Database, channelId: string): Promise<number> {
  const [row] = await db
    .select({ count: sql<number>`count(*)::int` })
    .from(clips)
    .innerJoin(episodes, eq(episodes.id, clips.episodeId))
    .where(and(eq(clips.channelId, channelId), isNull(clips.rating), isNull(episodes.archivedAt)));
  return row?.count ?? 0;
}
