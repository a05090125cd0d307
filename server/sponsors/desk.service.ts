import { and, asc, eq, isNull, ne } from "drizzle-orm";
import { dateInZone } from "../../shared/sponsors/dates";
import { deskGroupOf, deskGroups, isMoneyKind, latenessOf, type DeskGroup } from "../../shared/sponsors/deliverables";
import type { DeskItem, DeskView } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { users } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";
import { deals, deliverables, sponsors } from "../db/schema/sponsors";
import { seesFees, type Viewer } from "./deals.service";
import { catchUpPublishDates } from "./schedule.service";

/** Every open deliverable of the channel's live deals, grouped for the producer's morning look. */
export async function openDeliverables(db: Database, channelId: string) {
  return db
    .select({
      id: deliverables.id,
      dealId: deliverables.dealId,
      episodeId: deals.episodeId,
      episodeTitle: episodes.title,
      sponsorId: deals.sponsorId,
      company: sponsors.company,
      kind: deliverables.kind,
      title: deliverables.title,
      dueDate: deliverables.dueDate,
      status: deliverables.status,
      ownerName: users.name,
    })
    .from(deliverables)
    .innerJoin(deals, eq(deals.id, deliverables.dealId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .leftJoin(users, eq(users.id, deliverables.ownerId))
    .where(and(eq(deliverables.channelId, channelId), ne(deals.state, "cancelled"), isNull(episodes.archivedAt)))
    .orderBy(asc(deliverables.dueDate), asc(deliverables.position));
}

export async function desk(db: Database, viewer: Viewer, filter: { sponsorId?: string; episodeId?: string }, now = new Date()): Promise<DeskView> {
  await catchUpPublishDates(db, viewer.channelId);
  const today = dateInZone(now, viewer.timeZone);
  const visible = (await openDeliverables(db, viewer.channelId)).filter((row) => seesFees(viewer.role) || !isMoneyKind(row.kind));
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
  const items: DeskItem[] = chosen.map(({ row, group }) => ({ ...row, group, daysLate: latenessOf(row, today).daysLate }));
  return {
    today,
    counts,
    items,
    sponsors: [...sponsorsSeen].map(([id, company]) => ({ id, company })).sort((a, b) => a.company.localeCompare(b.company)),
    episodes: [...episodesSeen].map(([id, title]) => ({ id, title })).sort((a, b) => a.title.localeCompare(b.title)),
  };
}
