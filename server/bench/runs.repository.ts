import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { RunInput } from "../../shared/bench/schemas";
import { nextNumber } from "../db/counters";
import { nextVersion } from "../db/versions";
import { benchParts, benchRunParts, benchRuns } from "../db/schema/bench";
import type { Queryable } from "./bench.repository";

export type RunRow = typeof benchRuns.$inferSelect;

export async function listRunRows(db: Queryable, channelId: string, filter: { episodeId: string } | { runIds: readonly string[] }) {
  if ("runIds" in filter && filter.runIds.length === 0) return [];
  const scope = "episodeId" in filter ? eq(benchRuns.episodeId, filter.episodeId) : inArray(benchRuns.id, [...filter.runIds]);
  return db
    .select()
    .from(benchRuns)
    .where(and(eq(benchRuns.channelId, channelId), scope))
    .orderBy(asc(benchRuns.number));
}

/** The parts of these runs with what the shelf knows about them, in the order the run lists them. */
export async function listRunParts(db: Queryable, channelId: string, runIds: readonly string[]) {
  if (runIds.length === 0) return [];
  return db
    .select({
      runId: benchRunParts.runId,
      partId: benchParts.id,
      name: benchParts.name,
      kind: benchParts.kind,
      powered: benchParts.powered,
      count: benchRunParts.count,
      mass: benchParts.mass,
      ratedVoltage: benchParts.ratedVoltage,
    })
    .from(benchRunParts)
    .innerJoin(benchParts, and(eq(benchParts.id, benchRunParts.partId), eq(benchParts.channelId, channelId)))
    .where(and(eq(benchRunParts.channelId, channelId), inArray(benchRunParts.runId, [...runIds])))
    .orderBy(asc(benchRunParts.position));
}

export async function findRunRow(db: Queryable, channelId: string, episodeId: string, runId: string) {
  const rows = await db
    .select()
    .from(benchRuns)
    .where(and(eq(benchRuns.id, runId), eq(benchRuns.channelId, channelId), eq(benchRuns.episodeId, episodeId)))
    .limit(1);
  return rows[0] ?? null;
}

const runColumns = (input: RunInput) => ({ label: input.label, supply: input.supply, measurements: input.measurements, notes: input.notes });

async function replaceParts(db: Queryable, channelId: string, runId: string, parts: RunInput["parts"]) {
  await db.delete(benchRunParts).where(and(eq(benchRunParts.runId, runId), eq(benchRunParts.channelId, channelId)));
  if (parts.length === 0) return;
  await db.insert(benchRunParts).values(parts.map((part, position) => ({ runId, partId: part.partId, count: part.count, channelId, position })));
}

export async function insertRun(db: Queryable, channelId: string, episodeId: string, input: RunInput, userId: string) {
  const atLeast = sql`select coalesce(max(${benchRuns.number}), 0) + 1 from ${benchRuns} where ${benchRuns.episodeId} = ${episodeId}`;
  const next = await nextNumber(db, { scope: "bench_run", ownerId: episodeId, channelId, atLeast });
  const [row] = await db
    .insert(benchRuns)
    .values({ channelId, episodeId, number: next, createdBy: userId, ...runColumns(input) })
    .returning({ id: benchRuns.id });
  if (!row) throw new Error("run insert returned nothing");
  await replaceParts(db, channelId, row.id, input.parts);
  return row;
}

/** Saves a run if it is still at `version`; false when it isn't (or isn't this episode's). */
export async function updateRun(db: Queryable, channelId: string, episodeId: string, runId: string, version: number, input: RunInput) {
  const rows = await db
    .update(benchRuns)
    .set({ ...runColumns(input), version: nextVersion(benchRuns.version), updatedAt: new Date() })
    .where(and(eq(benchRuns.id, runId), eq(benchRuns.channelId, channelId), eq(benchRuns.episodeId, episodeId), eq(benchRuns.version, version)))
    .returning({ id: benchRuns.id });
  if (rows.length === 0) return false;
  await replaceParts(db, channelId, runId, input.parts);
  return true;
}

export async function deleteRun(db: Queryable, channelId: string, episodeId: string, runId: string) {
  const rows = await db
    .delete(benchRuns)
    .where(and(eq(benchRuns.id, runId), eq(benchRuns.channelId, channelId), eq(benchRuns.episodeId, episodeId)))
    .returning({ id: benchRuns.id });
  return rows.length > 0;
}
