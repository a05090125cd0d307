import { and, eq, sql } from "drizzle-orm";
import { followedDueDates } from "../../shared/sponsors/deliverables";
import { deals, deliverables } from "../db/schema/sponsors";
import { episodes } from "../db/schema/slate";
import { users } from "../db/schema/accounts";
import { eachItem, type ItemTally } from "../jobs/each-item";
import { dealsBehindPublishDate, insertEvents, type Db, type NewEvent } from "./deals.repository";

/** Who made a change, as the item's history shows it. */
export interface Actor {
  id: string | null;
  name: string;
  kind: "member" | "sponsor" | "system";
}

export const systemActor: Actor = { id: null, name: "Kerf", kind: "system" };

/**
 * Re-dates a deal's open items from its episode's publish date and its own go-live date, recording
 * every move in the item's history. Settled and hand-dated items keep their dates.
 */
export async function redateDeal(db: Db, deal: { id: string; channelId: string; goLiveDate: string | null }, publishDate: string | null, actor: Actor, note: string) {
  const items = await db
    .select({ id: deliverables.id, anchor: deliverables.anchor, offsetDays: deliverables.offsetDays, status: deliverables.status, dueDate: deliverables.dueDate })
    .from(deliverables)
    .where(and(eq(deliverables.dealId, deal.id), eq(deliverables.channelId, deal.channelId)));
  const changes = followedDueDates(items, { publishDate, goLiveDate: deal.goLiveDate });
  for (const change of changes) {
    await db.update(deliverables).set({ dueDate: change.to, updatedAt: new Date() }).where(eq(deliverables.id, change.id));
  }
  const events: NewEvent[] = changes.map((change) => ({
    channelId: deal.channelId,
    deliverableId: change.id,
    actorId: actor.id,
    actorName: actor.name,
    actorKind: actor.kind,
    what: "due_moved",
    fromDate: change.from,
    toDate: change.to,
    note,
  }));
  await insertEvents(db, events);
  return changes.length;
}

/**
 * Call after an episode's target publish date changes (the slate's publish-date update does): every
 * open deliverable of the episode's deals moves with it. Safe to call twice or from two instances at
 * once: each deal is claimed by moving its `publish_basis`, so its items move once per date change.
 * Pass the transaction that changed the date, so the new date is the one read here.
 */
export async function followPublishDate(db: Db, input: { channelId: string; episodeId: string; actor?: Actor; actorId?: string }): Promise<{ moved: number }> {
  return db.transaction(async (tx) => {
    const actor = input.actor ?? (input.actorId ? await memberActor(tx, input.actorId) : systemActor);
    const [episode] = await tx
      .select({ publishDate: episodes.targetPublishDate })
      .from(episodes)
      .where(and(eq(episodes.id, input.episodeId), eq(episodes.channelId, input.channelId)));
    if (!episode) return { moved: 0 };
    const claimed = await tx
      .update(deals)
      .set({ publishBasis: episode.publishDate })
      .where(and(eq(deals.episodeId, input.episodeId), eq(deals.channelId, input.channelId), sql`${deals.publishBasis} is distinct from ${episode.publishDate}`))
      .returning({ id: deals.id, channelId: deals.channelId, goLiveDate: deals.goLiveDate });
    const note = episode.publishDate ? `Publish date moved to ${episode.publishDate}` : "Publish date cleared";
    let moved = 0;
    for (const deal of claimed) moved += await redateDeal(tx, deal, episode.publishDate, actor, note);
    return { moved };
  });
}

async function memberActor(db: Db, userId: string): Promise<Actor> {
  const [user] = await db.select({ name: users.name }).from(users).where(eq(users.id, userId));
  return user ? { id: userId, name: user.name, kind: "member" } : systemActor;
}

/**
 * A safety net for a publish date changed without the call above (a script, another tool): before the
 * desk, a deal or the reminder scan is read, deals dated from an old publish date catch up.
 */
export async function catchUpPublishDates(db: Db, channelId: string | null): Promise<ItemTally> {
  const behind = await dealsBehindPublishDate(db, channelId);
  const episodes = new Map(behind.map((row) => [row.episodeId, row.channelId]));
  // Each episode moves in its own transaction: one that fails stays behind, logged, and the others move.
  return eachItem("publish-date catch-up", episodes, ([episodeId, inChannel]) => `episode ${episodeId} of channel ${inChannel}`, async ([episodeId, inChannel]) => {
    await followPublishDate(db, { channelId: inChannel, episodeId });
  });
}
