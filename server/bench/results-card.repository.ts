import { and, eq, inArray } from "drizzle-orm";
import type { CardColours } from "../../shared/bench/card-colours";
import type { Queryable } from "../db/client";
import { channels } from "../db/schema/accounts";
import { resultsCards } from "../db/schema/bench";
import { stills } from "../db/schema/rushes";

export type CardRow = typeof resultsCards.$inferSelect;

export async function findCard(db: Queryable, channelId: string, episodeId: string): Promise<CardRow | null> {
  const [row] = await db
    .select()
    .from(resultsCards)
    .where(and(eq(resultsCards.channelId, channelId), eq(resultsCards.episodeId, episodeId)));
  return row ?? null;
}

/** A new request starts the card over: queued, the last picture kept until the new one is ready. */
export async function queueCard(db: Queryable, channelId: string, episodeId: string, requestedBy: string): Promise<CardRow> {
  const [row] = await db
    .insert(resultsCards)
    .values({ channelId, episodeId, state: "queued", requestedBy })
    .onConflictDoUpdate({ target: resultsCards.episodeId, set: { state: "queued", failure: null, requestedBy, updatedAt: new Date() } })
    .returning();
  return row!;
}

/** The card's state, its row held until the transaction ends; null when it is gone. */
export async function lockCardState(db: Queryable, channelId: string, episodeId: string): Promise<CardRow["state"] | null> {
  const [row] = await db
    .select({ state: resultsCards.state })
    .from(resultsCards)
    .where(and(eq(resultsCards.channelId, channelId), eq(resultsCards.episodeId, episodeId)))
    .for("update");
  return row?.state ?? null;
}

/**
 * Takes a queued card for drawing; null when it is gone or another worker has it. `retry`: pg-boss runs
 * the job again because its last run never finished (its server stopped, or it ran past its time),
 * which left the card "drawing", so that state is taken too.
 */
export async function claimCard(db: Queryable, channelId: string, episodeId: string, retry = false): Promise<CardRow | null> {
  const states: CardRow["state"][] = retry ? ["queued", "drawing"] : ["queued"];
  const [row] = await db
    .update(resultsCards)
    .set({ state: "drawing", updatedAt: new Date() })
    .where(and(eq(resultsCards.channelId, channelId), eq(resultsCards.episodeId, episodeId), inArray(resultsCards.state, states)))
    .returning();
  return row ?? null;
}

export async function finishCard(db: Queryable, channelId: string, episodeId: string, done: { pngStillId: string; svgStillId: string } | { failure: string }) {
  const set = "failure" in done ? { state: "failed" as const, failure: done.failure } : { state: "ready" as const, failure: null, ...done };
  await db
    .update(resultsCards)
    .set({ ...set, updatedAt: new Date() })
    .where(and(eq(resultsCards.channelId, channelId), eq(resultsCards.episodeId, episodeId)));
}

export async function channelLook(db: Queryable, channelId: string): Promise<{ name: string; colours: CardColours | null }> {
  const [row] = await db.select({ name: channels.name, colours: channels.cardColours }).from(channels).where(eq(channels.id, channelId));
  return { name: row?.name ?? "", colours: row?.colours ?? null };
}

export async function saveCardColours(db: Queryable, channelId: string, colours: CardColours | null): Promise<void> {
  await db.update(channels).set({ cardColours: colours }).where(eq(channels.id, channelId));
}

/** The card's files as stills of the episode: the footage's small files, where the editor looks. */
export async function insertCardStill(db: Queryable, values: typeof stills.$inferInsert) {
  const [row] = await db.insert(stills).values(values).returning({ id: stills.id });
  return row!;
}

export async function cardStills(db: Queryable, channelId: string, ids: string[]) {
  if (ids.length === 0) return [];
  return db
    .select({ id: stills.id, objectKey: stills.objectKey, fileName: stills.fileName, contentType: stills.contentType })
    .from(stills)
    .where(and(eq(stills.channelId, channelId), inArray(stills.id, ids)));
}
