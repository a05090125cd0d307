import type { PartInput, PartView } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import { type PartRow, countRunsOfPart, deletePart, findPart, insertPart, listParts, updatePart } from "./shelf.repository";
import { runsWithPart } from "./runs.service";

function toPartView(part: PartRow, runCount: number): PartView {
  return {
    id: part.id,
    name: part.name,
    kind: part.kind,
    powered: part.powered,
    mass: part.mass ?? null,
    ratedVoltage: part.ratedVoltage ?? null,
    ratedCurrent: part.ratedCurrent ?? null,
    price: part.priceAmount && part.priceCurrency ? { amount: part.priceAmount, currency: part.priceCurrency } : null,
    supplier: part.supplier,
    notes: part.notes,
    runCount,
    updatedAt: part.updatedAt.toISOString(),
    version: part.version,
  };
}

export async function shelf(db: Database, channelId: string) {
  return (await listParts(db, channelId)).map((row) => toPartView(row.part, row.runCount));
}

async function partView(db: Database, channelId: string, partId: string) {
  const row = await findPart(db, channelId, partId);
  if (!row) throw notFound("Part");
  return toPartView(row.part, row.runCount);
}

/** A part's page: the part and every run it was in. */
export async function partPage(db: Database, channelId: string, partId: string) {
  const part = await partView(db, channelId, partId);
  return { part, runs: await runsWithPart(db, channelId, partId) };
}

export async function addPart(db: Database, channelId: string, input: PartInput) {
  const { id } = await insertPart(db, channelId, input);
  return partView(db, channelId, id);
}

export async function changePart(db: Database, channelId: string, partId: string, version: number, input: PartInput) {
  if (!(await updatePart(db, channelId, partId, version, input))) throw staleSave("part", await partView(db, channelId, partId));
  return partView(db, channelId, partId);
}

/** A measured part stays: its runs' figures depend on it. */
export async function removePart(db: Database, channelId: string, partId: string) {
  const part = await partView(db, channelId, partId);
  const runs = await countRunsOfPart(db, channelId, partId);
  if (runs > 0) {
    throw new AppError("conflict", `${part.name} is in ${runs} ${runs === 1 ? "run" : "runs"}, so it stays on the shelf: take it out of those runs first.`);
  }
  if (!(await deletePart(db, channelId, partId))) throw notFound("Part");
}
