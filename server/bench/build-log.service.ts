import type { IterationInput, IterationView } from "../../shared/bench/schemas";
import { iterationThrustToWeight } from "../../shared/bench/runs";
import type { Database, Queryable } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { deleteIteration, insertIteration, listIterations, updateIteration } from "./build-log.repository";
import { type Storage, viaStorage } from "../storage/storage";
import { photoKeysOfIteration } from "./build-photos.repository";
import { findRunRow, listRunRows } from "./runs.repository";

/** The log, each iteration's thrust-to-weight recomputed from its own all-up mass and its chosen run. */
export async function buildLog(db: Queryable, channelId: string, episodeId: string): Promise<IterationView[]> {
  const [iterations, runs] = await Promise.all([listIterations(db, channelId, episodeId), listRunRows(db, channelId, { episodeId })]);
  const runsById = new Map(runs.map((run) => [run.id, run]));
  return iterations.map((row) => {
    const run = row.chosenRunId ? runsById.get(row.chosenRunId) : undefined;
    const thrust = run?.measurements.thrust ?? null;
    return {
      id: row.id,
      number: row.number,
      change: row.change,
      allUpMass: row.allUpMass ?? null,
      outcome: row.outcome,
      chosenRunId: row.chosenRunId,
      notes: row.notes,
      chosenRun: run ? { id: run.id, number: run.number, label: run.label, thrust } : null,
      thrustToWeight: iterationThrustToWeight(thrust, row.allUpMass ?? null),
      createdAt: row.createdAt.toISOString(),
      version: row.version,
    };
  });
}

/** The chosen run must be one of this episode's. */
async function normalise(db: Database, channelId: string, episodeId: string, input: IterationInput): Promise<IterationInput> {
  if (!input.chosenRunId) return input;
  const chosenRunId = input.chosenRunId.toLowerCase();
  if (!(await findRunRow(db, channelId, episodeId, chosenRunId))) {
    throw new AppError("validation_failed", "Some fields need attention.", { chosenRunId: "Pick one of this episode's runs." });
  }
  return { ...input, chosenRunId };
}

async function iterationView(db: Queryable, channelId: string, episodeId: string, iterationId: string) {
  const view = (await buildLog(db, channelId, episodeId)).find((iteration) => iteration.id === iterationId);
  if (!view) throw notFound("Iteration");
  return view;
}

export async function addIteration(db: Database, caller: Caller, episodeId: string, raw: IterationInput) {
  const { channelId } = caller;
  const input = await normalise(db, channelId, episodeId, raw);
  return db.transaction(async (tx) => {
    const { id } = await insertIteration(tx, channelId, episodeId, input, caller.userId);
    return iterationView(tx, channelId, episodeId, id);
  });
}

export async function changeIteration(db: Database, channelId: string, episodeId: string, iterationId: string, version: number, raw: IterationInput) {
  const input = await normalise(db, channelId, episodeId, raw);
  if (!(await updateIteration(db, channelId, episodeId, iterationId, version, input))) throw staleSave("iteration", await iterationView(db, channelId, episodeId, iterationId));
  return iterationView(db, channelId, episodeId, iterationId);
}

/** The iteration goes with its photos, rows and objects: a store that is down leaves all of it as it was (503). */
export async function removeIteration(db: Database, storage: Storage, channelId: string, episodeId: string, iterationId: string) {
  await db.transaction(async (tx) => {
    const keys = await photoKeysOfIteration(tx, channelId, iterationId);
    if (!(await deleteIteration(tx, channelId, episodeId, iterationId))) throw notFound("Iteration");
    for (const key of keys) await viaStorage(() => storage.remove(key));
  });
}
