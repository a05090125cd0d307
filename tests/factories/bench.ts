import { criterionSchema, type Criterion } from "../../shared/bench/criteria";
import type { HazardChoice } from "../../shared/bench/hazards";
import { type IterationInput, type PartInput, type RunInput, type TestPlanInput, runInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../../server/db/client";
import { insertIteration } from "../../server/bench/build-log.repository";
import { insertRun } from "../../server/bench/runs.repository";
import { insertPart } from "../../server/bench/shelf.repository";
import { findPlan, insertCriterion, insertHazard, savePlan, updateHazard } from "../../server/bench/test-plan.repository";

export const q = (value: number, unit: string) => ({ value, unit });

/** A part on the channel's shelf; every figure is invented. */
export async function createPart(db: Database, channelId: string, overrides: Partial<PartInput> = {}) {
  const input: PartInput = {
    name: "Test motor",
    kind: "motor",
    powered: true,
    mass: q(68, "g"),
    ratedVoltage: q(16.8, "V"),
    ratedCurrent: q(25, "A"),
    price: { amount: "24.90", currency: "EUR" },
    supplier: "",
    notes: "",
    ...overrides,
  };
  const { id } = await insertPart(db, channelId, input);
  return { id, ...input };
}

export async function saveTestPlan(db: Database, channelId: string, episodeId: string, userId: string, overrides: Partial<TestPlanInput> = {}) {
  const input: TestPlanInput = { hypothesis: "It lifts itself.", method: "Clamp it and read the scale.", quantities: [], airframeMass: q(420, "g"), ...overrides };
  const current = await findPlan(db, channelId, episodeId);
  await savePlan(db, channelId, episodeId, current?.version ?? 0, input, userId);
  return input;
}

export async function createCriterion(db: Database, channelId: string, episodeId: string, fields: Partial<Criterion> & Record<string, unknown> = {}) {
  const criterion = criterionSchema.parse({ metric: "thrust_to_weight", comparator: "gte", threshold: q(1, "1"), required: true, ...fields });
  return insertCriterion(db, channelId, episodeId, criterion);
}

export async function createHazard(
  db: Database,
  channelId: string,
  episodeId: string,
  fields: { kind?: HazardChoice; title?: string; mitigation?: string; checkedBy?: string } = {},
) {
  const row = await insertHazard(db, { channelId, episodeId, kind: fields.kind ?? "spinning_blades", title: fields.title ?? null, mitigation: fields.mitigation ?? "Guard fitted." });
  if (!row) throw new Error(`the episode already lists the hazard ${fields.kind ?? "spinning_blades"}`);
  if (fields.checkedBy) await updateHazard(db, channelId, row.id, { checkedBy: fields.checkedBy, checkedAt: new Date() });
  return row;
}

export async function createRun(db: Database, channelId: string, episodeId: string, userId: string, fields: Partial<RunInput> = {}) {
  const input = runInputSchema.parse({ label: "Test run", parts: [], supply: null, measurements: {}, notes: "", ...fields });
  return db.transaction((tx) => insertRun(tx, channelId, episodeId, input, userId));
}

export async function createIteration(db: Database, channelId: string, episodeId: string, userId: string, fields: Partial<IterationInput> = {}) {
  const input: IterationInput = { change: "First build", allUpMass: q(640, "g"), outcome: "pending", chosenRunId: null, notes: "", ...fields };
  return insertIteration(db, channelId, episodeId, input, userId);
}
