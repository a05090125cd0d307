import { and, asc, eq, getTableColumns, type Column, gt, isNull, lt, max, min, ne, sql } from "drizzle-orm";
import { generateKeyBetween } from "fractional-indexing";
import type { GateProblem } from "../../shared/slate/gates";
import type { Stage } from "../../shared/slate/stages";
import type { Database, Queryable, Transaction as Tx } from "../db/client";
import { users } from "../db/schema/accounts";
import { dueOverrides, episodes, stageMoves } from "../db/schema/slate";
import { nextVersion } from "../db/versions";
import { episodeIdIn } from "../seams/board-flags";


const summaryColumns = {
  id: episodes.id,
  title: episodes.title,
  question: episodes.question,
  stage: episodes.stage,
  rank: episodes.rank,
  version: episodes.version,
  ownerId: episodes.ownerId,
  ownerName: users.name,
  targetPublishDate: episodes.targetPublishDate,
  archivedAt: episodes.archivedAt,
};

/** What a board card is built from: one row per episode (all of the channel's, or these), in board order. */
export async function boardRows(db: Database, channelId: string, withArchived: boolean, episodeIds?: string[]) {
  return db
    .select({ ...summaryColumns, tags: episodes.tags, stageEnteredAt: episodes.stageEnteredAt })
    .from(episodes)
    .leftJoin(users, eq(users.id, episodes.ownerId))
    .where(and(eq(episodes.channelId, channelId), withArchived ? undefined : isNull(episodes.archivedAt), idsIn(episodes.id, episodeIds)))
    .orderBy(asc(episodes.stage), asc(episodes.rank), asc(episodes.id));
}

/** No condition without ids: the whole channel. */
const idsIn = (column: Column, episodeIds: string[] | undefined) => (episodeIds ? episodeIdIn(column, episodeIds) : undefined);

/** Every episode that is not archived, by title: what a picker of episodes lists. */
export async function episodeTitles(db: Database, channelId: string) {
  return db
    .select({ id: episodes.id, title: episodes.title, stage: episodes.stage })
    .from(episodes)
    .where(and(eq(episodes.channelId, channelId), isNull(episodes.archivedAt)))
    .orderBy(asc(episodes.title), asc(episodes.id));
}

/** Always scoped by channel: an id from another channel finds nothing and answers 404. */
export async function findEpisode(db: Queryable, channelId: string, episodeId: string) {
  const rows = await db
    .select({ ...getTableColumns(episodes), ownerName: users.name })
    .from(episodes)
    .leftJoin(users, eq(users.id, episodes.ownerId))
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}
export type EpisodeRow = NonNullable<Awaited<ReturnType<typeof findEpisode>>>;

/** An episode's stage, scoped by channel like every read here; null when the channel has no such episode. */
export async function stageOf(db: Queryable, channelId: string, episodeId: string): Promise<Stage | null> {
  const rows = await db
    .select({ stage: episodes.stage })
    .from(episodes)
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)))
    .limit(1);
  return rows[0]?.stage ?? null;
}

/** The due dates set by hand: of the whole channel, or of these episodes. */
export async function overridesOf(db: Queryable, channelId: string, episodeIds?: string[]) {
  return db
    .select({ episodeId: dueOverrides.episodeId, stage: dueOverrides.stage, dueDate: dueOverrides.dueDate })
    .from(dueOverrides)
    .where(and(eq(dueOverrides.channelId, channelId), idsIn(dueOverrides.episodeId, episodeIds)));
}

/** Moves that went past missing essentials: few, so the board reads them all (or those of these episodes). */
export async function skippingMoves(db: Queryable, channelId: string, episodeIds?: string[]) {
  const skipped = sql`jsonb_array_length(${stageMoves.skipped}) > 0`;
  return db
    .select({ episodeId: stageMoves.episodeId, toStage: stageMoves.toStage, movedAt: stageMoves.movedAt, skipped: stageMoves.skipped, reason: stageMoves.reason })
    .from(stageMoves)
    .where(and(eq(stageMoves.channelId, channelId), idsIn(stageMoves.episodeId, episodeIds), skipped));
}

export async function historyOf(db: Database, channelId: string, episodeId: string) {
  return db
    .select({
      id: stageMoves.id,
      from: stageMoves.fromStage,
      to: stageMoves.toStage,
      at: stageMoves.movedAt,
      byId: stageMoves.movedBy,
      byName: users.name,
      reason: stageMoves.reason,
      skipped: stageMoves.skipped,
    })
    .from(stageMoves)
    .leftJoin(users, eq(users.id, stageMoves.movedBy))
    .where(and(eq(stageMoves.channelId, channelId), eq(stageMoves.episodeId, episodeId)))
    .orderBy(asc(stageMoves.movedAt), asc(stageMoves.id));
}

/**
 * Every write that places a card takes this lock first, so two moves into the same gap are ordered
 * and each gets its own key; different channels never wait for each other.
 */
async function lockBoard(tx: Tx, channelId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${channelId}, 3))`);
}

/**
 * The key that puts a card right after `afterId` (or right before `beforeId`) in `stage`. An anchor
 * that is not in that column any more (moved meanwhile) falls back to the end of the column: the
 * move still happens, a little off where it was dropped, and nothing is lost.
 */
async function rankFor(tx: Tx, place: { channelId: string; stage: Stage; movingId: string | null; afterId?: string | null; beforeId?: string | null }): Promise<string> {
  const inColumn = and(eq(episodes.channelId, place.channelId), eq(episodes.stage, place.stage), place.movingId ? ne(episodes.id, place.movingId) : undefined);
  const rankOf = async (id: string) => {
    if (id === place.movingId) return null;
    const [row] = await tx.select({ rank: episodes.rank }).from(episodes).where(and(inColumn, eq(episodes.id, id)));
    return row?.rank ?? null;
  };
  if (place.afterId) {
    const lower = await rankOf(place.afterId);
    if (lower !== null) {
      const [{ upper = null } = {}] = await tx.select({ upper: min(episodes.rank) }).from(episodes).where(and(inColumn, gt(episodes.rank, lower)));
      return generateKeyBetween(lower, upper);
    }
  } else if (place.beforeId) {
    const upper = await rankOf(place.beforeId);
    if (upper !== null) {
      const [{ lower = null } = {}] = await tx.select({ lower: max(episodes.rank) }).from(episodes).where(and(inColumn, lt(episodes.rank, upper)));
      return generateKeyBetween(lower, upper);
    }
  }
  const [{ last = null } = {}] = await tx.select({ last: max(episodes.rank) }).from(episodes).where(inColumn);
  return generateKeyBetween(last, null);
}

/** The first key of a column: a new episode goes on top of challenge. */
async function topRank(tx: Tx, channelId: string, stage: Stage): Promise<string> {
  const [{ first = null } = {}] = await tx
    .select({ first: min(episodes.rank) })
    .from(episodes)
    .where(and(eq(episodes.channelId, channelId), eq(episodes.stage, stage)));
  return generateKeyBetween(null, first);
}

export type EpisodeValues = Omit<typeof episodes.$inferInsert, "id" | "channelId" | "rank" | "stage" | "version" | "createdAt" | "updatedAt" | "stageEnteredAt">;

export async function insertEpisode(db: Database, channelId: string, values: EpisodeValues, createdBy: string) {
  return db.transaction(async (tx) => {
    await lockBoard(tx, channelId);
    const rank = await topRank(tx, channelId, "challenge");
    const [row] = await tx.insert(episodes).values({ ...values, channelId, stage: "challenge", rank }).returning({ id: episodes.id, movedAt: episodes.stageEnteredAt });
    if (!row) throw new Error("episode insert returned nothing");
    await tx.insert(stageMoves).values({ channelId, episodeId: row.id, fromStage: null, toStage: "challenge", movedBy: createdBy, movedAt: row.movedAt });
    return row.id;
  });
}

export type Versioned<T> = { outcome: "done"; row: T } | { outcome: "stale"; current: EpisodeRow } | { outcome: "missing" };

/** After an update matched no row: was the version stale, or is there no such episode here? */
async function staleOrMissing(db: Queryable, channelId: string, episodeId: string): Promise<Versioned<never>> {
  const current = await findEpisode(db, channelId, episodeId);
  return current ? { outcome: "stale", current } : { outcome: "missing" };
}

/** Changes fields only if the episode is still at `version`; every change raises the version by one. */
export async function updateEpisode(db: Queryable, channelId: string, episodeId: string, version: number, values: Partial<EpisodeValues>): Promise<Versioned<{ id: string }>> {
  const [row] = await db
    .update(episodes)
    .set({ ...values, version: nextVersion(episodes.version), updatedAt: sql`now()` })
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId), eq(episodes.version, version)))
    .returning({ id: episodes.id });
  return row ? { outcome: "done", row } : staleOrMissing(db, channelId, episodeId);
}

export interface MoveRequest {
  channelId: string;
  episodeId: string;
  version: number;
  stage: Stage;
  afterId?: string | null;
  beforeId?: string | null;
  movedBy: string;
  reason: string | null;
  skipped: GateProblem[];
}

/**
 * One card to a new place: one episode row rewritten (stage, rank, version) and, when the stage
 * changes, one history row. A stale version changes nothing.
 */
export async function moveEpisode(db: Database, move: MoveRequest): Promise<Versioned<{ id: string; from: Stage; to: Stage }>> {
  return db.transaction(async (tx) => {
    await lockBoard(tx, move.channelId);
    const [current] = await tx
      .select({ stage: episodes.stage, version: episodes.version })
      .from(episodes)
      .where(and(eq(episodes.id, move.episodeId), eq(episodes.channelId, move.channelId)));
    if (!current) return { outcome: "missing" };
    if (current.version !== move.version) return staleOrMissing(tx, move.channelId, move.episodeId);
    const rank = await rankFor(tx, { ...move, movingId: move.episodeId });
    const changesStage = current.stage !== move.stage;
    const [row] = await tx
      .update(episodes)
      .set({
        stage: move.stage,
        rank,
        version: nextVersion(episodes.version),
        updatedAt: sql`now()`,
        ...(changesStage ? { stageEnteredAt: sql`now()` } : {}),
      })
      .where(and(eq(episodes.id, move.episodeId), eq(episodes.version, move.version)))
      .returning({ id: episodes.id, at: episodes.stageEnteredAt });
    if (!row) return staleOrMissing(tx, move.channelId, move.episodeId);
    if (changesStage) {
      await tx.insert(stageMoves).values({
        channelId: move.channelId,
        episodeId: move.episodeId,
        fromStage: current.stage,
        toStage: move.stage,
        movedBy: move.movedBy,
        movedAt: row.at,
        reason: move.reason,
        skipped: move.skipped,
      });
    }
    return { outcome: "done", row: { id: row.id, from: current.stage, to: move.stage } };
  });
}

/** Sets (or, with null, clears) one stage's due date, as an edit of the episode at `version`. */
export async function setDueOverride(
  db: Database,
  input: { channelId: string; episodeId: string; version: number; stage: Stage; dueDate: string | null; setBy: string },
): Promise<Versioned<{ id: string }>> {
  return db.transaction(async (tx) => {
    const bumped = await updateEpisode(tx, input.channelId, input.episodeId, input.version, {});
    if (bumped.outcome !== "done") return bumped;
    const key = and(eq(dueOverrides.episodeId, input.episodeId), eq(dueOverrides.stage, input.stage));
    if (input.dueDate === null) {
      await tx.delete(dueOverrides).where(key);
    } else {
      await tx
        .insert(dueOverrides)
        .values({ channelId: input.channelId, episodeId: input.episodeId, stage: input.stage, dueDate: input.dueDate, setBy: input.setBy })
        .onConflictDoUpdate({ target: [dueOverrides.episodeId, dueOverrides.stage], set: { dueDate: input.dueDate, setBy: input.setBy, setAt: sql`now()` } });
    }
    return bumped;
  });
}
