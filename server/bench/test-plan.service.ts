import type { Criterion } from "../../shared/bench/criteria";
import { CUSTOM_HAZARD, hazardCatalogue, hazardLabel, isCatalogueHazard } from "../../shared/bench/hazards";
import type { CriterionView, HazardChange, HazardInput, HazardView, TestPlanInput, TestPlanView } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { iso } from "./bench.repository";
import {
  deleteCriterion,
  deleteHazard,
  findHazard,
  findPlan,
  insertCriterion,
  insertHazard,
  listCriteria,
  listHazards,
  updateCriterion,
  updateHazard,
  savePlan,
} from "./test-plan.repository";

type CriterionRow = Awaited<ReturnType<typeof listCriteria>>[number];
type HazardRow = Awaited<ReturnType<typeof listHazards>>[number];

export const toCriterionView = (row: CriterionRow): CriterionView => ({ ...row.definition, id: row.id, position: row.position, version: row.version });

function toHazardView(row: HazardRow): HazardView {
  return {
    id: row.id,
    kind: row.kind,
    title: hazardLabel(row.kind, row.title),
    caution: isCatalogueHazard(row.kind) ? hazardCatalogue[row.kind].caution : null,
    mitigation: row.mitigation,
    checkedBy: row.checkedById ? { id: row.checkedById, name: row.checkedByName ?? "a former member" } : null,
    checkedAt: iso(row.checkedAt),
  };
}

/** The sheet as the episode page shows it; an episode without one gets an empty sheet. */
export async function testPlanView(db: Database, channelId: string, episodeId: string): Promise<TestPlanView> {
  const [plan, criteria, hazards] = await Promise.all([findPlan(db, channelId, episodeId), listCriteria(db, channelId, episodeId), listHazards(db, channelId, episodeId)]);
  return {
    episodeId,
    hypothesis: plan?.hypothesis ?? "",
    method: plan?.method ?? "",
    quantities: plan?.quantities ?? [],
    airframeMass: plan?.airframeMass ?? null,
    criteria: criteria.map(toCriterionView),
    hazards: hazards.map(toHazardView),
    updatedAt: iso(plan?.updatedAt ?? null),
    version: plan?.version ?? 0,
  };
}

export async function saveTestPlan(db: Database, caller: Caller, episodeId: string, version: number, input: TestPlanInput) {
  if (!(await savePlan(db, caller.channelId, episodeId, version, input, caller.userId))) throw staleSave("test plan", await testPlanView(db, caller.channelId, episodeId));
  return testPlanView(db, caller.channelId, episodeId);
}

export async function addCriterion(db: Database, channelId: string, episodeId: string, criterion: Criterion) {
  // Its number and its row together: a refused insert takes no number.
  return toCriterionView(await db.transaction((tx) => insertCriterion(tx, channelId, episodeId, criterion)));
}

export async function changeCriterion(db: Database, channelId: string, episodeId: string, criterionId: string, version: number, criterion: Criterion) {
  const row = await updateCriterion(db, channelId, episodeId, criterionId, version, criterion);
  if (row) return toCriterionView(row);
  const current = (await listCriteria(db, channelId, episodeId)).find((c) => c.id === criterionId);
  throw current ? staleSave("criterion", toCriterionView(current)) : notFound("Criterion");
}

export async function removeCriterion(db: Database, channelId: string, episodeId: string, criterionId: string) {
  if (!(await deleteCriterion(db, channelId, episodeId, criterionId))) throw notFound("Criterion");
}

async function hazardView(db: Database, channelId: string, episodeId: string, hazardId: string) {
  const row = (await listHazards(db, channelId, episodeId)).find((hazard) => hazard.id === hazardId);
  if (!row) throw notFound("Hazard");
  return toHazardView(row);
}

export async function addHazard(db: Database, channelId: string, episodeId: string, input: HazardInput) {
  const title = input.kind === CUSTOM_HAZARD ? (input.title ?? null) : null;
  const made = await insertHazard(db, { channelId, episodeId, kind: input.kind, title, mitigation: input.mitigation });
  if (!made) throw new AppError("conflict", "This hazard is already on the plan: change its precautions there.", { kind: "Already on the plan." });
  return hazardView(db, channelId, episodeId, made.id);
}

/**
 * A changed mitigation is a new plan nobody has checked yet, so it clears the check unless the
 * same request checks it again.
 */
export async function changeHazard(db: Database, caller: Caller, episodeId: string, hazardId: string, change: HazardChange) {
  const { channelId } = caller;
  const current = await findHazard(db, channelId, episodeId, hazardId);
  if (!current) throw notFound("Hazard");
  const set: Parameters<typeof updateHazard>[3] = {};
  if (change.title !== undefined && current.kind === CUSTOM_HAZARD) set.title = change.title;
  const mitigationChanged = change.mitigation !== undefined && change.mitigation !== current.mitigation;
  if (mitigationChanged) set.mitigation = change.mitigation;
  if (change.checked === true) Object.assign(set, { checkedBy: caller.userId, checkedAt: new Date() });
  else if (change.checked === false || mitigationChanged) Object.assign(set, { checkedBy: null, checkedAt: null });
  await updateHazard(db, channelId, hazardId, set);
  return hazardView(db, channelId, episodeId, hazardId);
}

export async function removeHazard(db: Database, channelId: string, episodeId: string, hazardId: string) {
  if (!(await deleteHazard(db, channelId, episodeId, hazardId))) throw notFound("Hazard");
}
