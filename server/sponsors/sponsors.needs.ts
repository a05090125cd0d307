import { deliverableKindLabels, deskGroupLabels, isCutKind, openStatusPhrases, type DeskGroup } from "../../shared/sponsors/deliverables";
import type { DeskItem } from "../../shared/sponsors/schemas";
import type { NeedEntry, NeedGroup, NeedTone } from "../../shared/home/needs";
import { channelPath, type NeedSource } from "../seams/home-needs";
import { desk } from "./desk.service";

const tones: Record<DeskGroup, NeedTone> = { overdue: "alarm", changes_asked: "warn", due_soon: "warn", waiting: "info", later: "info" };

function whenOf(item: DeskItem): string {
  if (item.group === "overdue") return `${item.daysLate} day${item.daysLate === 1 ? "" : "s"} late`;
  return deskGroupLabels[item.group];
}

function entryOf(group: NeedGroup, item: DeskItem, href: string): NeedEntry {
  return {
    group,
    key: `${group}:${item.id}`,
    title: `${item.company}: ${item.title}`,
    detail: `${deliverableKindLabels[item.kind]} for “${item.episodeTitle}” ${openStatusPhrases[item.status]}. ${whenOf(item)}.`,
    tone: tones[item.group],
    episode: { id: item.episodeId, title: item.episodeTitle },
    href,
    date: item.dueDate,
  };
}

/** The desk's open items that need chasing now (not those for later); money items only for fee roles, as on the desk. */
const sponsorItems: NeedSource = {
  group: "sponsor_item",
  area: "deliverables",
  async needsFor(db, viewer) {
    const { items } = await desk(db, viewer, {});
    return items
      .filter((item) => item.group !== "later")
      .map((item) => entryOf("sponsor_item", item, channelPath(viewer.channelId, `desk?episode=${item.episodeId}`)));
  },
};

/** The segment cuts the editor delivers that are late, due within the week or sent back with changes. */
const cutsToReview: NeedSource = {
  group: "cut_review",
  area: "cut",
  async needsFor(db, viewer) {
    const { items } = await desk(db, viewer, {});
    return items
      .filter((item) => isCutKind(item.kind) && (item.group === "overdue" || item.group === "changes_asked" || item.group === "due_soon"))
      .map((item) => entryOf("cut_review", item, channelPath(viewer.channelId, `episodes/${item.episodeId}/sponsor-deals`)));
  },
};

/** Sponsor entries on members' homes. */
export const sponsorNeeds: NeedSource[] = [sponsorItems, cutsToReview];
