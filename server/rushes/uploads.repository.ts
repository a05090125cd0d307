import { and, asc, eq, gt, inArray, lt, sql } from "drizzle-orm";
import type { UploadStatus } from "../../shared/rushes/vocabulary";
import type { Database } from "../db/client";
import { clips, uploadParts, uploads } from "../db/schema/rushes";
import { episodes } from "../db/schema/slate";

export type Executor = Pick<Database, "select" | "insert" | "update" | "delete">;

export async function episodeInChannel(db: Executor, channelId: string, episodeId: string) {
  const rows = await db
    .select({ id: episodes.id, title: episodes.title })
    .from(episodes)
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

export type NewUpload = typeof uploads.$inferInsert;
export type UploadRow = typeof uploads.$inferSelect;

export async function insertUpload(db: Executor, values: NewUpload): Promise<UploadRow> {
  const [row] = await db.insert(uploads).values(values).returning();
  if (!row) throw new Error("upload insert returned nothing");
  return row;
}

export async function findUpload(db: Executor, channelId: string, uploadId: string) {
  const rows = await db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

/** The same row, locked for the rest of the transaction (completion and cancel must not cross). */
export async function lockUpload(db: Executor, channelId: string, uploadId: string) {
  const rows = await db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.channelId, channelId)))
    .for("update")
    .limit(1);
  return rows[0] ?? null;
}

export async function partsOf(db: Executor, uploadId: string) {
  return db
    .select({ partNumber: uploadParts.partNumber, etag: uploadParts.etag, size: uploadParts.sizeBytes })
    .from(uploadParts)
    .where(eq(uploadParts.uploadId, uploadId))
    .orderBy(asc(uploadParts.partNumber));
}

export async function partsOfMany(db: Executor, uploadIds: string[]) {
  if (uploadIds.length === 0) return [];
  return db
    .select({ uploadId: uploadParts.uploadId, partNumber: uploadParts.partNumber, etag: uploadParts.etag, size: uploadParts.sizeBytes })
    .from(uploadParts)
    .where(inArray(uploadParts.uploadId, uploadIds))
    .orderBy(asc(uploadParts.uploadId), asc(uploadParts.partNumber));
}

/**
 * Parts stored, in one statement. A part stored again (a retry) replaces its first record: the store
 * keeps the last one too. The upload's row is touched first, so a completion or a cancel under way
 * (which hold it locked) finishes before, and then the upload is no longer open: nothing is recorded.
 */
export async function recordParts(db: Executor, uploadId: string, parts: { partNumber: number; etag: string; size: number }[]): Promise<boolean> {
  const open = await db
    .update(uploads)
    .set({ lastActivityAt: sql`now()` })
    .where(and(eq(uploads.id, uploadId), eq(uploads.status, "uploading")))
    .returning({ id: uploads.id });
  if (open.length === 0) return false;
  await db
    .insert(uploadParts)
    .values(parts.map((p) => ({ uploadId, partNumber: p.partNumber, etag: p.etag, sizeBytes: p.size })))
    .onConflictDoUpdate({
      target: [uploadParts.uploadId, uploadParts.partNumber],
      set: { etag: sql`excluded.etag`, sizeBytes: sql`excluded.size_bytes`, recordedAt: sql`now()` },
    });
  return true;
}

export async function touchUpload(db: Executor, uploadId: string) {
  await db.update(uploads).set({ lastActivityAt: sql`now()` }).where(eq(uploads.id, uploadId));
}

export async function openUploads(db: Executor, channelId: string, filter: { episodeId?: string; createdBy?: string }) {
  return db
    .select()
    .from(uploads)
    .where(
      and(
        eq(uploads.channelId, channelId),
        eq(uploads.status, "uploading"),
        filter.episodeId ? eq(uploads.episodeId, filter.episodeId) : undefined,
        filter.createdBy ? eq(uploads.createdBy, filter.createdBy) : undefined,
      ),
    )
    .orderBy(asc(uploads.createdAt));
}

export async function finishUpload(db: Executor, uploadId: string, status: Exclude<UploadStatus, "uploading">, clipId: string | null = null) {
  await db.update(uploads).set({ status, clipId, finishedAt: sql`now()` }).where(eq(uploads.id, uploadId));
}

export async function insertClip(db: Executor, values: typeof clips.$inferInsert) {
  const [row] = await db.insert(clips).values(values).returning({ id: clips.id });
  if (!row) throw new Error("clip insert returned nothing");
  return row;
}

/** Uploads with no part recorded (nor started) since the cut-off, across every channel, a page after `after`. */
export async function staleUploads(db: Executor, before: Date, after: string | null, limit = 200) {
  return db
    .select({ id: uploads.id, channelId: uploads.channelId })
    .from(uploads)
    .where(and(eq(uploads.status, "uploading"), lt(uploads.lastActivityAt, before), after ? gt(uploads.id, after) : undefined))
    .orderBy(asc(uploads.id))
    .limit(limit);
}

/** One stale upload, locked; none when it finished or moved since (or another sweep holds it). */
export async function lockStaleUpload(db: Executor, uploadId: string, before: Date) {
  const rows = await db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.status, "uploading"), lt(uploads.lastActivityAt, before)))
    .for("update", { skipLocked: true })
    .limit(1);
  return rows[0] ?? null;
}


/** The oldest clip of the channel with this SHA-256, and its episode's title. */
export async function clipWithChecksum(db: Executor, channelId: string, sha256: string) {
  const rows = await db
    .select({ id: clips.id, fileName: clips.fileName, episodeId: clips.episodeId, episodeTitle: episodes.title })
    .from(clips)
    .innerJoin(episodes, eq(episodes.id, clips.episodeId))
    .where(and(eq(clips.channelId, channelId), eq(clips.sha256, sha256)))
    .orderBy(asc(clips.createdAt))
    .limit(1);
  return rows[0] ?? null;
}
