import { and, asc, eq, sql } from "drizzle-orm";
import type { IterationInput } from "../../shared/bench/schemas";
import { nextNumber } from "../db/counters";
import { nextVersion } from "../db/versions";
import { buildIterations } from "../db/schema/bench";
import type { Queryable } from "./bench.repository";

export async function listIterations(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select()
    .from(buildIterations)
    .where(and(eq(buildIterations.channelId, channelId), eq(buildIterations.episodeId, episodeId)))
    .orderBy(asc(buildIterations.number));
}

export async function insertIteration(db: Queryable, channelId: string, episodeId: string, input: IterationInput, userId: string) {
  const atLeast = sql`select coalesce(max(${buildIterations.number}), 0) + 1 from ${buildIterations} where ${buildIterations.episodeId} = ${episodeId}`;
  const next = await nextNumber(db, { scope: "build_iteration", ownerId: episodeId, channelId, atLeast });
  const [row] = await db
    .insert(buildIterations)
    .values({ channelId, episodeId, number: next, createdBy: userId, ...input })
    .returning({ id: buildIterations.id });
  if (!row) throw new Error("iteration insert returned nothing");
  return row;
}

/** Saves an iteration if it is still at `version`; false when it isn't (or isn't this episode's). */
export async function updateIteration(db: Queryable, channelId: string, episodeId: string, iterationId: string, version: number, input: IterationInput) {
  const rows = await db
    .update(buildIterations)
    .set({ ...input, version: nextVersion(buildIterations.version), updatedAt: new Date() })
    .where(and(eq(buildIterations.id, iterationId), eq(buildIterations.channelId, channelId), eq(buildIterations.episodeId, episodeId), eq(buildIterations.version, version)))
    .returning({ id: buildIterations.id });
  return rows.length > 0;
}

export async function deleteIteration(db: Queryable, channelId: string, episodeId: string, iterationId: string) {
  const rows = await db
    .delete(buildIterations)
    .where(and(eq(buildIterations.id, iterationId), eq(buildIterations.channelId, channelId), eq(buildIterations.episodeId, episodeId)))
    .returning({ id: buildIterations.id });
  return rows.length > 0;
}
