import { and, asc, count, eq } from "drizzle-orm";
import { buildIterations, buildPhotos } from "../db/schema/bench";
import type { Queryable } from "./bench.repository";

export type BuildPhotoRow = typeof buildPhotos.$inferSelect;

/** The iteration, if it is this episode's (the route's guard has checked the channel). */
export async function iterationOfEpisode(db: Queryable, channelId: string, episodeId: string, iterationId: string) {
  const [row] = await db
    .select({ id: buildIterations.id })
    .from(buildIterations)
    .where(and(eq(buildIterations.id, iterationId), eq(buildIterations.channelId, channelId), eq(buildIterations.episodeId, episodeId)));
  return row ?? null;
}

export async function countPhotos(db: Queryable, channelId: string, iterationId: string) {
  const [row] = await db
    .select({ n: count() })
    .from(buildPhotos)
    .where(and(eq(buildPhotos.channelId, channelId), eq(buildPhotos.iterationId, iterationId)));
  return row?.n ?? 0;
}

export async function insertPhoto(db: Queryable, values: typeof buildPhotos.$inferInsert) {
  const [row] = await db.insert(buildPhotos).values(values).returning();
  if (!row) throw new Error("photo insert returned nothing");
  return row;
}

export async function listPhotos(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select()
    .from(buildPhotos)
    .where(and(eq(buildPhotos.channelId, channelId), eq(buildPhotos.episodeId, episodeId)))
    .orderBy(asc(buildPhotos.createdAt), asc(buildPhotos.id));
}

export async function photoKeysOfIteration(db: Queryable, channelId: string, iterationId: string) {
  const rows = await db
    .select({ objectKey: buildPhotos.objectKey })
    .from(buildPhotos)
    .where(and(eq(buildPhotos.channelId, channelId), eq(buildPhotos.iterationId, iterationId)));
  return rows.map((row) => row.objectKey);
}

/** Deletes the photo if it is this episode's; its row as it was, or null. */
export async function deletePhoto(db: Queryable, channelId: string, episodeId: string, photoId: string) {
  const [row] = await db
    .delete(buildPhotos)
    .where(and(eq(buildPhotos.id, photoId), eq(buildPhotos.channelId, channelId), eq(buildPhotos.episodeId, episodeId)))
    .returning();
  return row ?? null;
}
