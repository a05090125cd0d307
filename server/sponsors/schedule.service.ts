import { followedDueDates } from "../../shared/sponsors/deliverables";
import { eachItem, type ItemTally } from "../jobs/each-item";
import type { PublishDateFollower } from "../seams/episode-dates";
import { dealsBehindPublishDate, insertEvents, type Db, type NewEvent } from "./deals.repository";
import { claimDealsForPublishDate, datingOfItems, episodePublishDate, setDueDate, userName } from "./schedule.repository";

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
  const items = await datingOfItems(db, deal.channelId, deal.id);
  const changes = followedDueDates(items, { publishDate, goLiveDate: deal.goLiveDate });
  for (const change of changes) await setDueDate(db, change.id, change.to);
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
 * Call after an episode's target publish date changes (the slate's episode edit does, through
 * `sponsorsFollowPublishDate`): every open deliverable of the episode's deals moves with it. Safe to
 * call twice or from two instances at once: each deal is claimed by moving its `publish_basis`, so its
 * items move once per date change. Called inside a transaction, it reads the date that transaction wrote.
 */
export async function followPublishDate(db: Db, input: { channelId: string; episodeId: string; actor?: Actor; actorId?: string }): Promise<{ moved: number }> {
  return db.transaction(async (tx) => {
    const actor = input.actor ?? (input.actorId ? await memberActor(tx, input.actorId) : systemActor);
    const episode = await episodePublishDate(tx, input.channelId, input.episodeId);
    if (!episode) return { moved: 0 };
    const claimed = await claimDealsForPublishDate(tx, input.channelId, input.episodeId, episode.publishDate);
    const note = episode.publishDate ? `Publish date moved to ${episode.publishDate}` : "Publish date cleared";
    let moved = 0;
    for (const deal of claimed) moved += await redateDeal(tx, deal, episode.publishDate, actor, note);
    return { moved };
  });
}

export async function memberActor(db: Db, userId: string): Promise<Actor> {
  const name = await userName(db, userId);
  return name === null ? systemActor : { id: userId, name, kind: "member" };
}

/** The sponsors' part of the publish-date seam: open items move with the episode's date. */
export const sponsorsFollowPublishDate: PublishDateFollower = {
  name: "sponsors.deliverables",
  follow: (db, change) => followPublishDate(db, change),
};

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
