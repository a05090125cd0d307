import { and, asc, eq, sql } from "drizzle-orm";
import type { Criterion } from "../../shared/bench/criteria";
import type { TestPlanInput } from "../../shared/bench/schemas";
import { nextNumber } from "../db/counters";
import { nextVersion } from "../db/versions";
import { users } from "../db/schema/accounts";
import { safetyHazards, testCriteria, testPlans } from "../db/schema/bench";
import type { Queryable } from "./bench.repository";

export async function findPlan(db: Queryable, channelId: string, episodeId: string) {
  const rows = await db
    .select()
    .from(testPlans)
    .where(and(eq(testPlans.channelId, channelId), eq(testPlans.episodeId, episodeId)))
    .limit(1);
  return rows[0] ?? null;
}

/**
 * Saves the episode's sheet if it is still at `version` (0: not saved yet, so it is made); false
 * when someone saved it since.
 */
export async function savePlan(db: Queryable, channelId: string, episodeId: string, version: number, input: TestPlanInput, userId: string) {
  const values = { ...input, airframeMass: input.airframeMass, updatedBy: userId, updatedAt: new Date() };
  const rows =
    version === 0
      ? await db.insert(testPlans).values({ channelId, episodeId, ...values }).onConflictDoNothing({ target: testPlans.episodeId }).returning({ version: testPlans.version })
      : await db
          .update(testPlans)
          .set({ ...values, version: nextVersion(testPlans.version) })
          .where(and(eq(testPlans.episodeId, episodeId), eq(testPlans.channelId, channelId), eq(testPlans.version, version)))
          .returning({ version: testPlans.version });
  return rows.length > 0;
}

export async function listCriteria(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select({ id: testCriteria.id, position: testCriteria.position, definition: testCriteria.definition, version: testCriteria.version })
    .from(testCriteria)
    .where(and(eq(testCriteria.channelId, channelId), eq(testCriteria.episodeId, episodeId)))
    .orderBy(asc(testCriteria.position), asc(testCriteria.createdAt));
}

export async function insertCriterion(db: Queryable, channelId: string, episodeId: string, definition: Criterion) {
  const atLeast = sql`select coalesce(max(${testCriteria.position}), 0) + 1 from ${testCriteria} where ${testCriteria.channelId} = ${channelId} and ${testCriteria.episodeId} = ${episodeId}`;
  const next = await nextNumber(db, { scope: "test_criterion", ownerId: episodeId, channelId, atLeast });
  const [row] = await db.insert(testCriteria).values({ channelId, episodeId, definition, position: next }).returning();
  if (!row) throw new Error("criterion insert returned nothing");
  return row;
}

/** Saves a criterion if it is still at `version`; null when it isn't (or isn't this episode's). */
export async function updateCriterion(db: Queryable, channelId: string, episodeId: string, criterionId: string, version: number, definition: Criterion) {
  const rows = await db
    .update(testCriteria)
    .set({ definition, version: nextVersion(testCriteria.version), updatedAt: new Date() })
    .where(and(eq(testCriteria.id, criterionId), eq(testCriteria.channelId, channelId), eq(testCriteria.episodeId, episodeId), eq(testCriteria.version, version)))
    .returning();
  return rows[0] ?? null;
}

export async function deleteCriterion(db: Queryable, channelId: string, episodeId: string, criterionId: string) {
  const rows = await db
    .delete(testCriteria)
    .where(and(eq(testCriteria.id, criterionId), eq(testCriteria.channelId, channelId), eq(testCriteria.episodeId, episodeId)))
    .returning({ id: testCriteria.id });
  return rows.length > 0;
}

export async function listHazards(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select({
      id: safetyHazards.id,
      kind: safetyHazards.kind,
      title: safetyHazards.title,
      mitigation: safetyHazards.mitigation,
      checkedById: safetyHazards.checkedBy,
      checkedByName: users.name,
      checkedAt: safetyHazards.checkedAt,
    })
    .from(safetyHazards)
    .leftJoin(users, eq(users.id, safetyHazards.checkedBy))
    .where(and(eq(safetyHazards.channelId, channelId), eq(safetyHazards.episodeId, episodeId)))
    .orderBy(asc(safetyHazards.createdAt), asc(safetyHazards.id));
}

/** The new hazard's row id, or null when that listed hazard is already on the episode's plan. */
export async function insertHazard(db: Queryable, values: { channelId: string; episodeId: string; kind: string; title: string | null; mitigation: string }) {
  const [row] = await db.insert(safetyHazards).values(values).onConflictDoNothing().returning({ id: safetyHazards.id });
  return row ?? null;
}

export async function findHazard(db: Queryable, channelId: string, episodeId: string, hazardId: string) {
  const rows = await db
    .select()
    .from(safetyHazards)
    .where(and(eq(safetyHazards.id, hazardId), eq(safetyHazards.channelId, channelId), eq(safetyHazards.episodeId, episodeId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function updateHazard(
  db: Queryable,
  channelId: string,
  hazardId: string,
  set: Partial<{ title: string | null; mitigation: string; checkedBy: string | null; checkedAt: Date | null }>,
) {
  await db
    .update(safetyHazards)
    .set({ ...set, updatedAt: new Date() })
    .where(and(eq(safetyHazards.id, hazardId), eq(safetyHazards.channelId, channelId)));
}

export async function deleteHazard(db: Queryable, channelId: string, episodeId: string, hazardId: string) {
  const rows = await db
    .delete(safetyHazards)
    .where(and(eq(safetyHazards.id, hazardId), eq(safetyHazards.channelId, channelId), eq(safetyHazards.episodeId, episodeId)))
    .returning({ id: safetyHazards.id });
  return rows.length > 0;
}
