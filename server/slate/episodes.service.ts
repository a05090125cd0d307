import { localDate } from "../../shared/slate/dates";
import type { GateProblem } from "../../shared/slate/gates";
import { timeInStages } from "../../shared/slate/history";
import {
  emptyEpisodeFields,
  episodeFieldsSchema,
  type EpisodeChanges,
  type EpisodeDetail,
  type EpisodeFields,
  type EpisodeHistory,
  type EpisodeRecord,
  type EpisodeSummary,
  type MoveEpisodeInput,
} from "../../shared/slate/schemas";
import { countBack, type DueOverrides } from "../../shared/slate/schedule";
import type { Stage } from "../../shared/slate/stages";
import { isMember } from "../db/channel-scope";
import type { Database, Queryable } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { parseBody } from "../http/validate";
import { collectFlags, type BoardFlagSource } from "../seams/board-flags";
import type { PublishDateFollower } from "../seams/episode-dates";
import type { EpisodeMaker } from "../seams/episode-makers";
import { gateProblems, type StageGate } from "../seams/stage-gates";
import {
  findEpisode,
  historyOf,
  insertEpisode,
  moveEpisode,
  overridesOf,
  setDueOverride,
  skippingMoves,
  updateEpisode,
  type EpisodeRow,
  type EpisodeValues,
  type Versioned,
} from "./episodes.repository";
import { slateFlags } from "./slate-flags";
import { slateStateOf } from "./slate.repository";

export const toSummary = (row: EpisodeRow): EpisodeSummary => ({
  id: row.id,
  title: row.title,
  question: row.question,
  stage: row.stage,
  rank: row.rank,
  version: row.version,
  ownerId: row.ownerId,
  ownerName: row.ownerName,
  targetPublishDate: row.targetPublishDate,
  archivedAt: row.archivedAt?.toISOString() ?? null,
});

export const toRecord = (row: EpisodeRow): EpisodeRecord => ({
  ...toSummary(row),
  origin: row.origin,
  originLink: row.originLink,
  whyWorthIt: row.whyWorthIt,
  tags: row.tags,
  budgetAmount: row.budgetAmount,
  budgetCurrency: row.budgetCurrency,
  stageEnteredAt: row.stageEnteredAt.toISOString(),
  createdAt: row.createdAt.toISOString(),
  updatedAt: row.updatedAt.toISOString(),
});

const conflict = (current: EpisodeRow) => staleSave("episode", toSummary(current));

/** Turns a versioned write's outcome into the row, a 409 with the current state, or a 404. */
async function settled(db: Queryable, channelId: string, episodeId: string, outcome: Versioned<unknown>): Promise<EpisodeRow> {
  if (outcome.outcome === "missing") throw notFound("Episode");
  if (outcome.outcome === "stale") throw conflict(outcome.current);
  const row = await findEpisode(db, channelId, episodeId);
  if (!row) throw notFound("Episode");
  return row;
}

const blankToNull = (value: string | null | undefined) => (value === "" || value === undefined ? null : value);

function toValues(fields: EpisodeFields): EpisodeValues {
  return {
    title: fields.title,
    question: fields.question,
    origin: fields.origin,
    originLink: blankToNull(fields.originLink),
    whyWorthIt: fields.whyWorthIt,
    ownerId: blankToNull(fields.ownerId),
    tags: fields.tags,
    budgetAmount: blankToNull(fields.budgetAmount),
    budgetCurrency: blankToNull(fields.budgetAmount) === null ? null : blankToNull(fields.budgetCurrency),
    targetPublishDate: blankToNull(fields.targetPublishDate),
  };
}

function fieldsOf(row: EpisodeRow): EpisodeFields {
  return {
    title: row.title,
    question: row.question,
    origin: row.origin,
    originLink: row.originLink ?? "",
    whyWorthIt: row.whyWorthIt,
    ownerId: row.ownerId ?? "",
    tags: row.tags,
    budgetAmount: row.budgetAmount ?? "",
    budgetCurrency: row.budgetCurrency ?? "",
    targetPublishDate: row.targetPublishDate ?? "",
  };
}

async function checkOwner(db: Database, channelId: string, ownerId: string | null | undefined): Promise<void> {
  if (ownerId && !(await isMember(db, channelId, ownerId))) {
    throw new AppError("validation_failed", "Some fields need attention.", { ownerId: "Pick a member of this channel." });
  }
}

export async function createEpisode(db: Database, caller: Caller, fields: EpisodeFields): Promise<EpisodeRow> {
  const values = toValues(fields);
  await checkOwner(db, caller.channelId, values.ownerId);
  const id = await insertEpisode(db, caller.channelId, values, caller.userId);
  return (await findEpisode(db, caller.channelId, id))!;
}

/** An edit of some fields: checked together with the fields it leaves as they are. */
export async function editEpisode(db: Database, followers: readonly PublishDateFollower[], caller: Caller, episodeId: string, changes: EpisodeChanges): Promise<EpisodeRow> {
  const current = await findEpisode(db, caller.channelId, episodeId);
  if (!current) throw notFound("Episode");
  if (current.version !== changes.version) throw conflict(current);
  const { version, ...fields } = changes;
  const merged = parseBody(episodeFieldsSchema, { ...fieldsOf(current), ...fields });
  const values = toValues(merged);
  if (values.ownerId !== current.ownerId) await checkOwner(db, caller.channelId, values.ownerId);
  return db.transaction(async (tx) => {
    const row = await settled(tx, caller.channelId, episodeId, await updateEpisode(tx, caller.channelId, episodeId, version, values));
    // Dates other features count from the publish date (sponsor deliverables) move with it, in the same transaction.
    if (row.targetPublishDate !== current.targetPublishDate) {
      for (const follower of followers) await follower.follow(tx, { channelId: caller.channelId, episodeId, actorId: caller.userId });
    }
    return row;
  });
}

export async function setArchived(db: Database, caller: Caller, episodeId: string, version: number, archived: boolean): Promise<EpisodeRow> {
  const outcome = await updateEpisode(db, caller.channelId, episodeId, version, { archivedAt: archived ? new Date() : null });
  return settled(db, caller.channelId, episodeId, outcome);
}

/**
 * A move: backward always; forward past missing essentials (the gates of every feature) only with a
 * reason, which is recorded with what was missing.
 */
export async function move(db: Database, gates: readonly StageGate[], caller: Caller, episodeId: string, input: MoveEpisodeInput): Promise<EpisodeRow> {
  if (input.afterId === episodeId || input.beforeId === episodeId) {
    throw new AppError("validation_failed", "Some fields need attention.", { afterId: "A card can't be placed next to itself." });
  }
  const current = await findEpisode(db, caller.channelId, episodeId);
  if (!current) throw notFound("Episode");
  if (current.version !== input.version) throw conflict(current);
  const problems: GateProblem[] = current.stage === input.stage ? [] : await gateProblems(gates, { db, channelId: caller.channelId, episodeId, from: current.stage, to: input.stage });
  if (problems.length > 0 && !input.reason) {
    throw new AppError("unprocessable", "This episode is missing essentials for that move. Give a reason to move it on anyway.", undefined, { problems });
  }
  const outcome = await moveEpisode(db, {
    channelId: caller.channelId,
    episodeId,
    version: input.version,
    stage: input.stage,
    afterId: input.afterId,
    beforeId: input.beforeId,
    movedBy: caller.userId,
    reason: current.stage === input.stage ? null : (input.reason ?? null),
    skipped: problems,
  });
  return settled(db, caller.channelId, episodeId, outcome);
}

export async function overrideDueDate(db: Database, caller: Caller, episodeId: string, stage: Stage, input: { version: number; dueDate: string | null }) {
  if (stage === "publish") {
    throw new AppError("validation_failed", "Some fields need attention.", { stage: "The publish stage is due on the target publish date; change that date instead." });
  }
  const current = await findEpisode(db, caller.channelId, episodeId);
  if (!current) throw notFound("Episode");
  if (current.version !== input.version) throw conflict(current);
  if (current.targetPublishDate === null && input.dueDate !== null) {
    throw new AppError("unprocessable", "Set a target publish date first: due dates count back from it.");
  }
  const outcome = await setDueOverride(db, { channelId: caller.channelId, episodeId, stage, version: input.version, dueDate: input.dueDate, setBy: caller.userId });
  return settled(db, caller.channelId, episodeId, outcome);
}

export async function episodeDetail(db: Database, flagSources: readonly BoardFlagSource[], channelId: string, episodeId: string, timeZone: string): Promise<EpisodeDetail> {
  const row = await findEpisode(db, channelId, episodeId);
  if (!row) throw notFound("Episode");
  const today = localDate(new Date(), timeZone);
  const [state, overrides, skips, external] = await Promise.all([
    slateStateOf(db, channelId),
    overridesOf(db, channelId, [episodeId]),
    skippingMoves(db, channelId, [episodeId]),
    collectFlags(flagSources, db, channelId, [episodeId], { timeZone, today }),
  ]);
  const dueOverrides: DueOverrides = Object.fromEntries(overrides.map((o) => [o.stage, o.dueDate]));
  const skipped = skips.find((s) => s.toStage === row.stage && s.movedAt.getTime() === row.stageEnteredAt.getTime());
  const enteredOn = localDate(row.stageEnteredAt, timeZone);
  const own = slateFlags({ stage: row.stage, targetPublishDate: row.targetPublishDate, dueOverrides }, state.stageLengths, {
    enteredOn,
    today,
    skipped: skipped ? { problems: skipped.skipped, reason: skipped.reason } : null,
  });
  return {
    episode: toRecord(row),
    schedule: row.targetPublishDate ? countBack(row.targetPublishDate, state.stageLengths, dueOverrides) : null,
    stageLengths: state.stageLengths,
    risks: own.risks,
    flags: [...own.flags, ...(external[episodeId] ?? [])],
    today,
    stageEnteredOn: enteredOn,
  };
}

export async function episodeHistory(db: Database, channelId: string, episodeId: string): Promise<EpisodeHistory> {
  const row = await findEpisode(db, channelId, episodeId);
  if (!row) throw notFound("Episode");
  const rows = await historyOf(db, channelId, episodeId);
  const entries = rows.map((r) => ({ ...r, at: r.at.toISOString() }));
  // Episodes made outside the app (imports, factories) may lack the opening entry; their stay starts when they entered.
  const moves = entries.length > 0 ? entries : [{ from: null, to: row.stage, at: row.stageEnteredAt.toISOString() }];
  return { entries, timeInStage: timeInStages(moves, new Date()) };
}

/** The slate's side of the episode-maker seam: a viewer's ask opens an episode in the challenge stage. */
export const makeViewerEpisode: EpisodeMaker = async (tx, caller, episode) => {
  const fields = parseBody(episodeFieldsSchema, { ...emptyEpisodeFields, ...episode, origin: "viewer" });
  return createEpisode(tx, caller, fields);
};
