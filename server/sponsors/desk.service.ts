import { dateInZone } from "../../shared/sponsors/dates";
import { deskGroupOf, deskGroups, isMoneyKind, latenessOf, type DeskGroup } from "../../shared/sponsors/deliverables";
import type { DeskItem, DeskView } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import type { Caller } from "../http/route-table";
import { openDeliverables } from "./deals.repository";
import { mayChangeItem, seesFees } from "./deals.service";
import { catchUpPublishDates } from "./schedule.service";

export async function desk(db: Database, caller: Caller, filter: { sponsorId?: string; episodeId?: string }, now = new Date()): Promise<DeskView> {
  await catchUpPublishDates(db, caller.channelId);
  const today = dateInZone(now, caller.timeZone);
  const visible = (await openDeliverables(db, caller.channelId)).filter((row) => seesFees(caller.role) || !isMoneyKind(row.kind));
  const grouped = visible
    .map((row) => ({ row, group: deskGroupOf(row, today) }))
    .filter((entry): entry is { row: (typeof visible)[number]; group: DeskGroup } => entry.group !== null);

  const sponsorsSeen = new Map<string, string>();
  const episodesSeen = new Map<string, string>();
  for (const { row } of grouped) {
    sponsorsSeen.set(row.sponsorId, row.company);
    episodesSeen.set(row.episodeId, row.episodeTitle);
  }
  const chosen = grouped.filter(({ row }) => (!filter.sponsorId || row.sponsorId === filter.sponsorId) && (!filter.episodeId || row.episodeId === filter.episodeId));
  const counts = Object.fromEntries(deskGroups.map((g) => [g, 0])) as Record<DeskGroup, number>;
  for (const { group } of chosen) counts[group]++;
  const items: DeskItem[] = chosen.map(({ row, group }) => ({ ...row, group, daysLate: latenessOf(row, today).daysLate, canEdit: mayChangeItem(caller.role, row.kind) }));
  return {
    today,
    counts,
    items,
    sponsors: [...sponsorsSeen].map(([id, company]) => ({ id, company })).sort((a, b) => a.company.localeCompare(b.company)),
    episodes: [...episodesSeen].map(([id, title]) => ({ id, title })).sort((a, b) => a.title.localeCompare(b.title)),
  };
}
