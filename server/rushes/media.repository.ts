import { and, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "../db/client";
import { clips } from "../db/schema/rushes";

type Executor = Pick<Database, "select" | "insert" | "update" | "delete" | "execute">;

/**
 * Takes a clip for making: waiting (or making, when a run before this one died mid-way) becomes
 * making, one attempt more. Null when the clip is gone or not waiting (made, failed, or deleted).
 */
export async function claimClip(db: Executor, channelId: string, clipId: string) {
  const rows = await db
    .update(clips)
    .set({ mediaState: "making", mediaAttempts: sql`${clips.mediaAttempts} + 1`, mediaFailure: null })
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId), inArray(clips.mediaState, ["waiting", "making"])))
    .returning({
      id: clips.id,
      channelId: clips.channelId,
      episodeId: clips.episodeId,
      objectKey: clips.objectKey,
      durationMs: clips.durationMs,
      frameRateNumerator: clips.frameRateNumerator,
      frameRateDenominator: clips.frameRateDenominator,
      dropFrame: clips.dropFrame,
      startTimecode: clips.startTimecode,
      width: clips.width,
      height: clips.height,
      codec: clips.codec,
      markCount: clips.markCount,
      serverPosterKey: clips.serverPosterKey,
      proxyKey: clips.proxyKey,
    });
  return rows[0] ?? null;
}
export type ClaimedClip = NonNullable<Awaited<ReturnType<typeof claimClip>>>;

/** Writes what was made, only if the clip is still being made (not deleted meanwhile); false otherwise. */
export async function finishClip(db: Executor, channelId: string, clipId: string, values: Partial<typeof clips.$inferInsert>): Promise<boolean> {
  const rows = await db
    .update(clips)
    .set({ ...values, mediaState: "ready", mediaFailure: null })
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId), eq(clips.mediaState, "making")))
    .returning({ id: clips.id });
  return rows.length === 1;
}

export async function failClip(db: Executor, channelId: string, clipId: string, reason: string): Promise<void> {
  await db
    .update(clips)
    .set({ mediaState: "failed", mediaFailure: reason })
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId), eq(clips.mediaState, "making")));
}

/** The clip's media state, its row held until the transaction ends. */
export async function lockMediaState(db: Executor, channelId: string, clipId: string) {
  const rows = await db
    .select({ mediaState: clips.mediaState })
    .from(clips)
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId)))
    .for("update");
  return rows[0]?.mediaState ?? null;
}

export async function requeueClip(db: Executor, channelId: string, clipId: string): Promise<void> {
  await db
    .update(clips)
    .set({ mediaState: "waiting", mediaFailure: null })
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId)));
}

/**
 * A clip whose media job pg-boss gave up on, held by the caller while still waiting or making (no run
 * finished it): it waits again while it has had fewer than `attemptsAllowed` runs, and fails with
 * `reason` after that. Answers what it became.
 */
export async function settleGivenUpClip(db: Executor, channelId: string, clipId: string, attemptsAllowed: number, reason: string) {
  const again = sql`${clips.mediaAttempts} < ${attemptsAllowed}`;
  const rows = await db
    .update(clips)
    .set({
      mediaState: sql`case when ${again} then 'waiting' else 'failed' end::clip_media_state`,
      mediaFailure: sql`case when ${again} then null else ${reason} end`,
    })
    .where(and(eq(clips.id, clipId), eq(clips.channelId, channelId)))
    .returning({ mediaState: clips.mediaState });
  return rows[0]!.mediaState;
}
