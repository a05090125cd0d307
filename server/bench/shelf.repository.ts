import { and, asc, count, desc, eq, inArray, sql } from "drizzle-orm";
import type { PartInput } from "../../shared/bench/schemas";
import { benchParts, benchRunParts, benchRuns } from "../db/schema/bench";
import { episodes } from "../db/schema/slate";
import { nextVersion } from "../db/versions";
import type { Queryable } from "./bench.repository";

export type PartRow = typeof benchParts.$inferSelect;

const runCounts = (channelId: string) =>
  sql<number>`(select count(*)::int from ${benchRunParts} where ${benchRunParts.partId} = ${benchParts.id} and ${benchRunParts.channelId} = ${channelId})`;

export async function listParts(db: Queryable, channelId: string) {
  return db
    .select({ part: benchParts, runCount: runCounts(channelId) })
    .from(benchParts)
    .where(eq(benchParts.channelId, channelId))
    .orderBy(asc(benchParts.name), asc(benchParts.id));
}

export async function findPart(db: Queryable, channelId: string, partId: string) {
  const rows = await db
    .select({ part: benchParts, runCount: runCounts(channelId) })
    .from(benchParts)
    .where(and(eq(benchParts.id, partId), eq(benchParts.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

/** Only the channel's own parts: an id from elsewhere is simply not found. */
export async function partsByIds(db: Queryable, channelId: string, partIds: readonly string[]) {
  if (partIds.length === 0) return [];
  return db
    .select()
    .from(benchParts)
    .where(and(eq(benchParts.channelId, channelId), inArray(benchParts.id, [...partIds])));
}

function columns(input: PartInput) {
  return {
    name: input.name,
    kind: input.kind,
    powered: input.powered,
    mass: input.mass,
    ratedVoltage: input.ratedVoltage,
    ratedCurrent: input.ratedCurrent,
    priceAmount: input.price?.amount ?? null,
    priceCurrency: input.price?.currency ?? null,
    supplier: input.supplier,
    notes: input.notes,
  };
}

export async function insertPart(db: Queryable, channelId: string, input: PartInput) {
  const [row] = await db
    .insert(benchParts)
    .values({ channelId, ...columns(input) })
    .returning({ id: benchParts.id });
  if (!row) throw new Error("part insert returned nothing");
  return row;
}

/** Saves a part if it is still at `version`; false when it isn't (or isn't this channel's). */
export async function updatePart(db: Queryable, channelId: string, partId: string, version: number, input: PartInput) {
  const rows = await db
    .update(benchParts)
    .set({ ...columns(input), version: nextVersion(benchParts.version), updatedAt: new Date() })
    .where(and(eq(benchParts.id, partId), eq(benchParts.channelId, channelId), eq(benchParts.version, version)))
    .returning({ id: benchParts.id });
  return rows.length > 0;
}

export async function countRunsOfPart(db: Queryable, channelId: string, partId: string) {
  const [row] = await db
    .select({ n: count() })
    .from(benchRunParts)
    .where(and(eq(benchRunParts.channelId, channelId), eq(benchRunParts.partId, partId)));
  return row?.n ?? 0;
}

export async function deletePart(db: Queryable, channelId: string, partId: string) {
  const rows = await db
    .delete(benchParts)
    .where(and(eq(benchParts.id, partId), eq(benchParts.channelId, channelId)))
    .returning({ id: benchParts.id });
  return rows.length > 0;
}

/** Every run the part was in, newest first, with the episode it belongs to. */
export async function runsOfPart(db: Queryable, channelId: string, partId: string) {
  return db
    .select({ runId: benchRuns.id, episodeId: benchRuns.episodeId, episodeTitle: episodes.title, count: benchRunParts.count, createdAt: benchRuns.createdAt })
    .from(benchRunParts)
    .innerJoin(benchRuns, and(eq(benchRuns.id, benchRunParts.runId), eq(benchRuns.channelId, channelId)))
    .innerJoin(episodes, and(eq(episodes.id, benchRuns.episodeId), eq(episodes.channelId, channelId)))
    .where(and(eq(benchRunParts.channelId, channelId), eq(benchRunParts.partId, partId)))
    .orderBy(desc(benchRuns.createdAt), desc(benchRuns.number));
}

/** The parts the episode's runs used, once each, with where they were bought: the description's parts list. */
export async function partsUsedInEpisode(db: Queryable, channelId: string, episodeId: string) {
  return db
    .selectDistinct({ name: benchParts.name, supplier: benchParts.supplier })
    .from(benchRunParts)
    .innerJoin(benchRuns, eq(benchRuns.id, benchRunParts.runId))
    .innerJoin(benchParts, eq(benchParts.id, benchRunParts.partId))
    .where(and(eq(benchRunParts.channelId, channelId), eq(benchRuns.episodeId, episodeId)))
    .orderBy(asc(benchParts.name));
}
