import { runsCsv } from "../../shared/bench/runs-csv";
import type { PartRunView, RunInput, RunPartView, RunView } from "../../shared/bench/schemas";
import { evaluateRun, isOverRated, type PlanForRuns } from "../../shared/bench/runs";
import type { Database } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { type Queryable, episodeTitle } from "./bench.repository";
import { type RunRow, deleteRun, findRunRow, insertRun, listRunParts, listRunRows, updateRun } from "./runs.repository";
import { partsByIds, runsOfPart } from "./shelf.repository";
import { findPlan, listCriteria } from "./test-plan.repository";
import { toCriterionView } from "./test-plan.service";

/** The plan's airframe mass and criteria: what every run of the episode is judged against. */
export async function planForRuns(db: Queryable, channelId: string, episodeId: string): Promise<PlanForRuns> {
  const [plan, criteria] = await Promise.all([findPlan(db, channelId, episodeId), listCriteria(db, channelId, episodeId)]);
  return { airframeMass: plan?.airframeMass ?? null, criteria: criteria.map((row) => ({ id: row.id, criterion: row.definition })) };
}

/** Rows to views: their parts from the shelf, then each run judged against its own episode's plan. */
async function toRunViews(db: Queryable, channelId: string, rows: readonly RunRow[]): Promise<RunView[]> {
  const parts = await listRunParts(
    db,
    channelId,
    rows.map((row) => row.id),
  );
  const plans = new Map<string, PlanForRuns>();
  for (const episodeId of new Set(rows.map((row) => row.episodeId))) plans.set(episodeId, await planForRuns(db, channelId, episodeId));
  return rows.map((row) => {
    const runParts: RunPartView[] = parts.filter((part) => part.runId === row.id).map(({ runId: _runId, ...part }) => part);
    const supply = row.supply ?? null;
    const evaluation = evaluateRun({ supply, measurements: row.measurements, parts: runParts }, plans.get(row.episodeId)!);
    return {
      id: row.id,
      episodeId: row.episodeId,
      number: row.number,
      label: row.label,
      parts: runParts,
      supply,
      measurements: row.measurements,
      notes: row.notes,
      evaluation,
      createdAt: row.createdAt.toISOString(),
      updatedAt: row.updatedAt.toISOString(),
      version: row.version,
    };
  });
}

export async function episodeRuns(db: Database, channelId: string, episodeId: string) {
  return toRunViews(db, channelId, await listRunRows(db, channelId, { episodeId }));
}

export async function episodeRunsCsv(db: Database, channelId: string, episodeId: string) {
  const [title, runs, criteria] = await Promise.all([
    episodeTitle(db, channelId, episodeId),
    listRunRows(db, channelId, { episodeId }).then((rows) => toRunViews(db, channelId, rows)),
    listCriteria(db, channelId, episodeId),
  ]);
  return { title, csv: runsCsv(runs, criteria.map(toCriterionView)) };
}

async function runView(db: Queryable, channelId: string, episodeId: string, runId: string) {
  const row = await findRunRow(db, channelId, episodeId, runId);
  if (!row) throw notFound("Run");
  return (await toRunViews(db, channelId, [row]))[0]!;
}

/** Every part must be on this channel's shelf; an id from another channel reads as missing. */
async function checkParts(db: Queryable, channelId: string, input: RunInput) {
  const found = new Set((await partsByIds(db, channelId, input.parts.map((part) => part.partId))).map((part) => part.id));
  const fields: Record<string, string> = {};
  input.parts.forEach((part, index) => {
    if (!found.has(part.partId.toLowerCase())) fields[`parts.${index}.partId`] = "That part is not on this channel's shelf.";
  });
  if (Object.keys(fields).length > 0) throw new AppError("validation_failed", "Some fields need attention.", fields);
}

const lowerIds = (input: RunInput): RunInput => ({ ...input, parts: input.parts.map((part) => ({ ...part, partId: part.partId.toLowerCase() })) });

export async function createRun(db: Database, caller: Caller, episodeId: string, raw: RunInput) {
  const { channelId } = caller;
  const input = lowerIds(raw);
  await checkParts(db, channelId, input);
  return db.transaction(async (tx) => {
    const { id } = await insertRun(tx, channelId, episodeId, input, caller.userId);
    return runView(tx, channelId, episodeId, id);
  });
}

export async function changeRun(db: Database, channelId: string, episodeId: string, runId: string, version: number, raw: RunInput) {
  const input = lowerIds(raw);
  await checkParts(db, channelId, input);
  return db.transaction(async (tx) => {
    if (!(await updateRun(tx, channelId, episodeId, runId, version, input))) throw staleSave("run", await runView(tx, channelId, episodeId, runId));
    return runView(tx, channelId, episodeId, runId);
  });
}

export async function removeRun(db: Database, channelId: string, episodeId: string, runId: string) {
  if (!(await deleteRun(db, channelId, episodeId, runId))) throw notFound("Run");
}

/** The runs a shelf part was in, across the channel's episodes, each judged against its own plan. */
export async function runsWithPart(db: Database, channelId: string, partId: string): Promise<PartRunView[]> {
  const links = await runsOfPart(db, channelId, partId);
  const views = await toRunViews(db, channelId, await listRunRows(db, channelId, { runIds: links.map((link) => link.runId) }));
  const byId = new Map(views.map((view) => [view.id, view]));
  return links.flatMap((link) => {
    const view = byId.get(link.runId);
    if (!view) return [];
    return [
      {
        runId: view.id,
        runNumber: view.number,
        label: view.label,
        episodeId: link.episodeId,
        episodeTitle: link.episodeTitle,
        count: link.count,
        verdict: view.evaluation.verdict,
        thrustPerWatt: view.evaluation.figures.thrust_per_watt,
        overRated: isOverRated(view.evaluation),
        createdAt: view.createdAt,
      },
    ];
  });
}
