import { daysBetween } from "../../shared/sponsors/dates";
import { isSettled, openStatusPhrases } from "../../shared/sponsors/deliverables";
import { checkDisclosure } from "../../shared/sponsors/disclosure";
import type { GateProblem } from "../../shared/slate/gates";
import { entersStageForward, type GateContext, type StageGate } from "../seams/stage-gates";
import { itemsOfDeals, liveDealsOfEpisode, type Db } from "./deals.repository";

const liveDeals = (context: GateContext) => liveDealsOfEpisode(context.db, context.channelId, context.episodeId);

/**
 * Every item still open that was due before the video goes out: counted back from the publish date (or
 * hand-dated on or before it), not yet approved or done. Read by the gate below and by the publish package.
 */
export async function openItemsBeforePublish(db: Db, channelId: string, episodeId: string): Promise<string[]> {
  const found = await liveDealsOfEpisode(db, channelId, episodeId);
  if (found.length === 0) return [];
  const items = await itemsOfDeals(db, channelId, found.map((d) => d.id));
  const open: string[] = [];
  for (const deal of found) {
    for (const item of items.filter((i) => i.dealId === deal.id)) {
      if (isSettled(item.status)) continue;
      const beforePublish =
        item.anchor === "before_publish" ||
        (item.anchor === "fixed" && item.dueDate !== null && deal.publishDate !== null && daysBetween(item.dueDate, deal.publishDate) >= 0);
      if (beforePublish) open.push(`${deal.company}: "${item.title}" ${openStatusPhrases[item.status]}; it must be approved or done before publishing.`);
    }
  }
  return open;
}

/** Entering publish with a sponsor item still open that was due before the video goes out. */
const unapprovedItems: StageGate = {
  name: "sponsors.unapproved_items",
  applies: (from, to) => entersStageForward("publish", from, to),
  async check(context) {
    const open = await openItemsBeforePublish(context.db, context.channelId, context.episodeId);
    return open.map((message): GateProblem => ({ code: "sponsors.unapproved_item", message }));
  },
};

/**
 * A paid episode (one with a deal that isn't cancelled) needs a disclosure both in the spoken segment
 * and in the description: FTC Endorsement Guides, 16 CFR Part 255 (§ 255.5), and the UK CAP Code,
 * section 2. A reminder, not legal advice: the law of the country where the video is seen governs.
 */
const disclosure: StageGate = {
  name: "sponsors.disclosure",
  applies: (from, to) => entersStageForward("publish", from, to),
  async check(context) {
    const problems: GateProblem[] = [];
    for (const deal of await liveDeals(context)) {
      const found = checkDisclosure({ script: deal.script, description: deal.descriptionCopy ?? "", wording: deal.disclosureText });
      if (!found.inSegment) {
        problems.push({ code: "sponsors.no_disclosure_in_segment", message: `${deal.company}: the segment's script has no disclosure (say it in the video, e.g. "this video is sponsored by…").` });
      }
      if (!found.inDescription) {
        problems.push({ code: "sponsors.no_disclosure_in_description", message: `${deal.company}: the description text has no disclosure line.` });
      }
    }
    return problems;
  },
};

/** Sponsor essentials checked when an episode enters publish. */
export const sponsorGates: StageGate[] = [unapprovedItems, disclosure];
