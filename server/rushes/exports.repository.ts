import { and, asc, desc, eq, inArray } from "drizzle-orm";
import type { Cursor, FootageQuery } from "../../shared/rushes/footage-query";
import type { Database } from "../db/client";
import { clipMarks, clips } from "../db/schema/rushes";
import { baseSelect, footageWhere, listClips, sortColumns } from "./clips.repository";

type Executor = Pick<Database, "select">;

/** The first `cap` clips of the filter in the list's order, ids, names and formats only: what a list must know before it starts. */
export function filterOutline(db: Executor, channelId: string, q: FootageQuery, cap: number) {
  const sort = sortColumns[q.sort];
  const direction = q.dir === "asc" ? asc : desc;
  return db
    .select({ id: clips.id, episodeId: clips.episodeId, fileName: clips.fileName, frameRateNumerator: clips.frameRateNumerator, frameRateDenominator: clips.frameRateDenominator, dropFrame: clips.dropFrame })
    .from(clips)
    .where(footageWhere(channelId, q))
    .orderBy(direction(sort.column), direction(clips.id))
    .limit(cap);
}

export type ExportRow = Awaited<ReturnType<typeof listClips>>[number];
export type MarkRow = Awaited<ReturnType<typeof exportMarks>>[number];

/** The marks of some clips, by clip and in point: only what an export writes (no dates to parse by the thousand). */
export function exportMarks(db: Executor, clipIds: string[]) {
  return db
    .select({ clipId: clipMarks.clipId, inFrame: clipMarks.inFrame, outFrame: clipMarks.outFrame, inLabel: clipMarks.inLabel, outLabel: clipMarks.outLabel, note: clipMarks.note })
    .from(clipMarks)
    .where(inArray(clipMarks.clipId, clipIds))
    .orderBy(asc(clipMarks.clipId), asc(clipMarks.inFrame), asc(clipMarks.createdAt));
}

/**
 * The filter's clips in the list's order with their marks, `size` clips at a time, up to `cap`: keyset reads
 * (the list's own page query), each a short query that gives its connection back, so a long export neither
 * holds a connection while the download is slow nor sorts the whole filter in one go.
 */
export async function* clipBatches(db: Database, channelId: string, q: FootageQuery, size: number, cap: number): AsyncGenerator<{ rows: ExportRow[]; marks: MarkRow[] }> {
  let cursor: Cursor | null = null;
  for (let read = 0; read < cap; ) {
    const wanted = Math.min(size, cap - read);
    const rows = await listClips(db, channelId, { ...q, limit: wanted }, cursor);
    const page = rows.slice(0, wanted);
    if (page.length === 0) return;
    yield { rows: page, marks: await exportMarks(db, page.map((row) => row.id)) };
    read += page.length;
    if (rows.length <= wanted) return;
    cursor = { v: page.at(-1)!.sortValue, id: page.at(-1)!.id };
  }
}

/** Chosen clips of one channel, with their marks (for the zip and its timeline). */
export async function clipsWithMarks(db: Database, channelId: string, ids: string[]) {
  const rows = ids.length === 0 ? [] : await baseSelect(db).where(and(eq(clips.channelId, channelId), inArray(clips.id, ids)));
  return { rows, marks: rows.length === 0 ? [] : await exportMarks(db, rows.map((row) => row.id)) };
}

/** The marks of an episode's footage with their clips' rates, clip by clip as recorded, each clip's by in point. */
export function episodeMarks(db: Executor, channelId: string, episodeId: string, cap: number) {
  return db
    .select({ inFrame: clipMarks.inFrame, outFrame: clipMarks.outFrame, note: clipMarks.note, numerator: clips.frameRateNumerator, denominator: clips.frameRateDenominator })
    .from(clipMarks)
    .innerJoin(clips, eq(clips.id, clipMarks.clipId))
    .where(and(eq(clips.channelId, channelId), eq(clips.episodeId, episodeId)))
    .orderBy(asc(clips.recordedAt), asc(clips.id), asc(clipMarks.inFrame), asc(clipMarks.createdAt))
    .limit(cap);
}
