import { isSettled } from "../../shared/sponsors/deliverables";
import type { GoLiveFollower, PublishSource } from "../seams/publish-sources";
import { insertEvents, liveDealsOfEpisode, reportDaysOfEpisode, updateDeliverableRow, type Db } from "./deals.repository";
import { goLiveItems, setGoLiveDate } from "./schedule.repository";
import { memberActor, redateDeal } from "./schedule.service";
import { openItemsBeforePublish } from "./sponsors.gates";

/** What the publish package takes from the episode's deals: each paid mention, approvals still open, and the days their figures are due. */
export const sponsorsPublishSource: PublishSource = {
  name: "sponsors.mentions",
  async read(db, { channelId, episodeId }) {
    const [found, openApprovals, figureDays] = await Promise.all([liveDealsOfEpisode(db, channelId, episodeId), openItemsBeforePublish(db, channelId, episodeId), reportDaysOfEpisode(db, channelId, episodeId)]);
    return {
      figureDays,
      mentions: found.map((deal) => ({ company: deal.company, disclosure: deal.disclosureText, link: deal.link, code: deal.promoCode })),
      openApprovals,
    };
  },
};

/**
 * The video went live: each live deal's go-live date becomes that day, every "after go-live" item is
 * dated from it, and the go-live items are done, each move in the item's history.
 */
export async function followGoLive(db: Db, change: { channelId: string; episodeId: string; actorId: string; liveOn: string }) {
  const actor = await memberActor(db, change.actorId);
  const note = `Went live on ${change.liveOn}`;
  for (const deal of await liveDealsOfEpisode(db, change.channelId, change.episodeId)) {
    await setGoLiveDate(db, change.channelId, deal.id, change.liveOn);
    await redateDeal(db, { id: deal.id, channelId: change.channelId, goLiveDate: change.liveOn }, deal.publishDate, actor, note);
    const open = (await goLiveItems(db, change.channelId, deal.id)).filter((item) => !isSettled(item.status));
    for (const item of open) await updateDeliverableRow(db, change.channelId, item.id, { status: "done" });
    await insertEvents(
      db,
      open.map((item) => ({ channelId: change.channelId, deliverableId: item.id, actorId: actor.id, actorName: actor.name, actorKind: actor.kind, what: "status" as const, fromStatus: item.status, toStatus: "done", note })),
    );
  }
}

export const sponsorsFollowGoLive: GoLiveFollower = { name: "sponsors.go_live", follow: followGoLive };
