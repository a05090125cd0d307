import { and, asc, desc, eq, isNotNull, or } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { benchRuns, buildIterations } from "../db/schema/bench";
import { clipMarks, clips } from "../db/schema/rushes";

/*
 * What the episode's footage shows. Runs and iterations are read here by id, number and title only,
 * straight from their tables: rushes imports nothing of the bench feature.
 */

export function episodeRuns(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select({ id: benchRuns.id, number: benchRuns.number, title: benchRuns.label })
    .from(benchRuns)
    .where(and(eq(benchRuns.channelId, channelId), eq(benchRuns.episodeId, episodeId)))
    .orderBy(asc(benchRuns.number));
}

export function episodeIterations(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select({ id: buildIterations.id, number: buildIterations.number, title: buildIterations.change })
    .from(buildIterations)
    .where(and(eq(buildIterations.channelId, channelId), eq(buildIterations.episodeId, episodeId)))
    .orderBy(asc(buildIterations.number));
}

const clipLinkColumns = {
  id: clips.id,
  fileName: clips.fileName,
  posterKey: clips.posterKey,
  serverPosterKey: clips.serverPosterKey,
  benchRunId: clips.benchRunId,
  buildIterationId: clips.buildIterationId,
};

/** The episode's clips, newest first, at most `limit`. */
export function episodeClips(db: Queryable, channelId: string, episodeId: string, limit: number) {
  return db
    .select(clipLinkColumns)
    .from(clips)
    .where(and(eq(clips.channelId, channelId), eq(clips.episodeId, episodeId)))
    .orderBy(desc(clips.recordedAt), desc(clips.id))
    .limit(limit);
}

/** The episode's clips linked to a run or an iteration, in recording order. */
export function linkedClips(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select(clipLinkColumns)
    .from(clips)
    .where(and(eq(clips.channelId, channelId), eq(clips.episodeId, episodeId), or(isNotNull(clips.benchRunId), isNotNull(clips.buildIterationId))))
    .orderBy(asc(clips.recordedAt), asc(clips.id));
}

/** The marks of the episode's clips linked to a run or an iteration, in recording order, then by in point. */
export function linkedMarks(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select({
      id: clipMarks.id,
      inLabel: clipMarks.inLabel,
      outLabel: clipMarks.outLabel,
      note: clipMarks.note,
      benchRunId: clipMarks.benchRunId,
      buildIterationId: clipMarks.buildIterationId,
      clipId: clips.id,
      fileName: clips.fileName,
      posterKey: clips.posterKey,
  serverPosterKey: clips.serverPosterKey,
    })
    .from(clipMarks)
    .innerJoin(clips, eq(clips.id, clipMarks.clipId))
    .where(and(eq(clips.channelId, channelId), eq(clips.episodeId, episodeId), or(isNotNull(clipMarks.benchRunId), isNotNull(clipMarks.buildIterationId))))
    .orderBy(asc(clips.recordedAt), asc(clips.id), asc(clipMarks.inFrame));
}
