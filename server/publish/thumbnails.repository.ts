import { and, asc, eq } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { publishThumbnails } from "../db/schema/publish";

export type ThumbnailRow = typeof publishThumbnails.$inferSelect;

export async function listThumbnails(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select()
    .from(publishThumbnails)
    .where(and(eq(publishThumbnails.channelId, channelId), eq(publishThumbnails.episodeId, episodeId)))
    .orderBy(asc(publishThumbnails.createdAt), asc(publishThumbnails.id));
}

export async function findThumbnail(db: Queryable, channelId: string, episodeId: string, thumbnailId: string) {
  const [row] = await db
    .select()
    .from(publishThumbnails)
    .where(and(eq(publishThumbnails.id, thumbnailId), eq(publishThumbnails.channelId, channelId), eq(publishThumbnails.episodeId, episodeId)));
  return row ?? null;
}

export async function insertThumbnail(db: Queryable, values: typeof publishThumbnails.$inferInsert) {
  const [row] = await db.insert(publishThumbnails).values(values).returning();
  if (!row) throw new Error("thumbnail insert returned nothing");
  return row;
}

export async function deleteThumbnail(db: Queryable, channelId: string, episodeId: string, thumbnailId: string) {
  const [row] = await db
    .delete(publishThumbnails)
    .where(and(eq(publishThumbnails.id, thumbnailId), eq(publishThumbnails.channelId, channelId), eq(publishThumbnails.episodeId, episodeId)))
    .returning();
  return row ?? null;
}
