import { and, asc, desc, eq, inArray, sql, type SQL } from "drizzle-orm";
import type { FootageQuery, Cursor } from "../../shared/rushes/footage-query";
import type { Database } from "../db/client";
import { benchRuns, buildIterations } from "../db/schema/bench";
import { clipMarks, clips, shootDays, shots } from "../db/schema/rushes";
import { episodes } from "../db/schema/slate";

type Executor = Pick<Database, "select" | "insert" | "update" | "delete" | "execute">;

/** Each sort: its column and the SQL type its cursor value is read back as. */
export const sortColumns = {
  recorded: { column: clips.recordedAt, type: sql`timestamptz` },
  uploaded: { column: clips.createdAt, type: sql`timestamptz` },
  name: { column: clips.fileName, type: sql`text` },
  duration: { column: clips.durationMs, type: sql`integer` },
  size: { column: clips.sizeBytes, type: sql`bigint` },
} as const;

const likeEscaped = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** The filter's conditions; always inside one channel. */
export function footageWhere(channelId: string, q: FootageQuery): SQL {
  const conditions: (SQL | undefined)[] = [
    eq(clips.channelId, channelId),
    q.episodeId ? eq(clips.episodeId, q.episodeId) : undefined,
    q.shootDayId ? eq(clips.shootDayId, q.shootDayId) : undefined,
    q.shotId ? eq(clips.shotId, q.shotId) : undefined,
    q.tag ? sql`${clips.tags} @> array[${q.tag}]::text[]` : undefined,
    q.rating === "unrated" ? sql`${clips.rating} is null` : q.rating ? eq(clips.rating, q.rating) : undefined,
    q.kind ? eq(clips.kind, q.kind) : undefined,
    q.hasMarks === "yes" ? sql`${clips.markCount} > 0` : q.hasMarks === "no" ? sql`${clips.markCount} = 0` : undefined,
    q.camera ? sql`${clips.camera} ilike ${likeEscaped(q.camera)}` : undefined,
    q.q
      ? sql`(${clips.notes} ilike ${`%${likeEscaped(q.q)}%`} or ${clips.fileName} ilike ${`%${likeEscaped(q.q)}%`}
           or exists (select 1 from clip_marks m where m.clip_id = "clips"."id" and m.note ilike ${`%${likeEscaped(q.q)}%`}))`
      : undefined,
  ];
  return and(...conditions)!;
}

const clipColumns = {
  id: clips.id,
  episodeId: clips.episodeId,
  episodeTitle: episodes.title,
  shootDayId: clips.shootDayId,
  shootDay: shootDays.day,
  shotId: clips.shotId,
  shotDescription: shots.description,
  benchRunId: clips.benchRunId,
  buildIterationId: clips.buildIterationId,
  objectKey: clips.objectKey,
  posterKey: clips.posterKey,
  fileName: clips.fileName,
  contentType: clips.contentType,
  size: clips.sizeBytes,
  storageEtag: clips.storageEtag,
  sha256: clips.sha256,
  durationMs: clips.durationMs,
  frameRateNumerator: clips.frameRateNumerator,
  frameRateDenominator: clips.frameRateDenominator,
  dropFrame: clips.dropFrame,
  width: clips.width,
  height: clips.height,
  codec: clips.codec,
  startTimecode: clips.startTimecode,
  camera: clips.camera,
  recordedAt: clips.recordedAt,
  kind: clips.kind,
  rating: clips.rating,
  tags: clips.tags,
  notes: clips.notes,
  markCount: clips.markCount,
  mediaState: clips.mediaState,
  mediaFailure: clips.mediaFailure,
  mediaAttempts: clips.mediaAttempts,
  mediaMismatches: clips.mediaMismatches,
  serverPosterKey: clips.serverPosterKey,
  proxyKey: clips.proxyKey,
  uploadedBy: clips.uploadedBy,
  createdAt: clips.createdAt,
};

export type ClipRow = NonNullable<Awaited<ReturnType<typeof findClip>>>;

export function baseSelect(db: Executor) {
  return db
    .select(clipColumns)
    .from(clips)
    .innerJoin(episodes, eq(episodes.id, clips.episodeId))
    .leftJoin(shots, eq(shots.id, clips.shotId))
    .leftJoin(shootDays, eq(shootDays.id, clips.shootDayId));
}

/** One page of the list in keyset order: rows strictly after the cursor's (sort value, id). */
export function listClips(db: Executor, channelId: string, q: FootageQuery, cursor: Cursor | null) {
  const sort = sortColumns[q.sort];
  const direction = q.dir === "asc" ? asc : desc;
  const after = cursor
    ? q.dir === "asc"
      ? sql`(${sort.column}, ${clips.id}) > (${String(cursor.v)}::${sort.type}, ${cursor.id}::uuid)`
      : sql`(${sort.column}, ${clips.id}) < (${String(cursor.v)}::${sort.type}, ${cursor.id}::uuid)`
    : undefined;
  return db
    .select({ ...clipColumns, sortValue: sql<string>`(${sort.column})::text` })
    .from(clips)
    .innerJoin(episodes, eq(episodes.id, clips.episodeId))
    .leftJoin(shots, eq(shots.id, clips.shotId))
    .leftJoin(shootDays, eq(shootDays.id, clips.shootDayId))
    .where(and(footageWhere(channelId, q), after))
    .orderBy(direction(sort.column), direction(clips.id))
    .limit(q.limit + 1);
}

export async function footageTotals(db: Executor, channelId: string, q: FootageQuery) {
  const rows = await db
    .select({
      clips: sql<number>`count(*)::int`,
      durationMs: sql<string>`coalesce(sum(${clips.durationMs}), 0)::bigint`,
      bytes: sql<string>`coalesce(sum(${clips.sizeBytes}), 0)::bigint`,
    })
    .from(clips)
    .where(footageWhere(channelId, q));
  const row = rows[0]!;
  return { clips: row.clips, durationMs: Number(row.durationMs), bytes: Number(row.bytes) };
}

export async function findClip(db: Executor, channelId: string, clipId: string) {
  const rows = await baseSelect(db)
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function updateClip(db: Executor, channelId: string, clipId: string, values: Partial<typeof clips.$inferInsert>) {
  if (Object.keys(values).length === 0) return;
  await db
    .update(clips)
    .set(values)
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId)));
}

export async function deleteClip(db: Executor, channelId: string, clipId: string) {
  await db.delete(clips).where(and(eq(clips.id, clipId), eq(clips.channelId, channelId)));
}

export async function marksOf(db: Executor, clipIds: string[]) {
  if (clipIds.length === 0) return [];
  return db
    .select()
    .from(clipMarks)
    .where(inArray(clipMarks.clipId, clipIds))
    .orderBy(asc(clipMarks.clipId), asc(clipMarks.inFrame), asc(clipMarks.createdAt));
}

export async function findMark(db: Executor, channelId: string, clipId: string, markId: string) {
  const rows = await db
    .select()
    .from(clipMarks)
    .where(and(eq(clipMarks.id, markId), eq(clipMarks.clipId, clipId), eq(clipMarks.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function insertMark(db: Executor, values: typeof clipMarks.$inferInsert) {
  const [row] = await db.insert(clipMarks).values(values).returning();
  return row!;
}

export async function updateMark(db: Executor, markId: string, values: Partial<typeof clipMarks.$inferInsert>) {
  const [row] = await db.update(clipMarks).set(values).where(eq(clipMarks.id, markId)).returning();
  return row!;
}

export async function deleteMark(db: Executor, markId: string) {
  await db.delete(clipMarks).where(eq(clipMarks.id, markId));
}

export async function refreshMarkCount(db: Executor, clipId: string) {
  await db.execute(sql`update clips set mark_count = (select count(*) from clip_marks where clip_id = ${clipId}) where id = ${clipId}`);
}

/** The episode of a channel's bench run, or null when the channel has no such run; the run is held until the transaction ends. */
export async function benchRunEpisode(db: Executor, channelId: string, runId: string): Promise<string | null> {
  const rows = await db
    .select({ episodeId: benchRuns.episodeId })
    .from(benchRuns)
    .where(and(eq(benchRuns.channelId, channelId), eq(benchRuns.id, runId)))
    .for("share");
  return rows[0]?.episodeId ?? null;
}

/** The episode of a channel's build iteration, or null when the channel has no such iteration; held likewise. */
export async function buildIterationEpisode(db: Executor, channelId: string, iterationId: string): Promise<string | null> {
  const rows = await db
    .select({ episodeId: buildIterations.episodeId })
    .from(buildIterations)
    .where(and(eq(buildIterations.channelId, channelId), eq(buildIterations.id, iterationId)))
    .for("share");
  return rows[0]?.episodeId ?? null;
}
