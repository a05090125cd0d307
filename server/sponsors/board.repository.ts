import { and, asc, eq, isNotNull, ne, notInArray, sql } from "drizzle-orm";
import { moneyKinds } from "../../shared/sponsors/deliverables";
import type { Database } from "../db/client";
import { deals, deliverables, sponsors } from "../db/schema/sponsors";
import { episodeIdIn } from "../seams/board-flags";

// What the sponsors put on the slate's board: open items behind its flags, and its sponsor filter.

/** Open items of live deals on these episodes that have a date; never invoice or payment items (every role sees the board). */
export async function datedOpenItems(db: Database, channelId: string, episodeIds: string[]) {
  return db
    // Only the board's episodes pass the filter below, so the id is never null here.
    .select({ episodeId: sql<string>`${deals.episodeId}`, company: sponsors.company, title: deliverables.title, status: deliverables.status, dueDate: deliverables.dueDate })
    .from(deliverables)
    .innerJoin(deals, eq(deals.id, deliverables.dealId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .where(
      and(
        eq(deliverables.channelId, channelId),
        eq(deals.channelId, channelId),
        episodeIdIn(deals.episodeId, episodeIds),
        ne(deals.state, "cancelled"),
        notInArray(deliverables.status, ["approved", "done"]),
        notInArray(deliverables.kind, [...moneyKinds]),
        isNotNull(deliverables.dueDate),
      ),
    )
    .orderBy(asc(deliverables.dueDate));
}

/** The channel's sponsors with a live deal, for the board's sponsor filter. */
export async function sponsorsWithLiveDeals(db: Database, channelId: string) {
  return db
    .selectDistinct({ value: sponsors.id, label: sponsors.company })
    .from(sponsors)
    .innerJoin(deals, eq(deals.sponsorId, sponsors.id))
    .where(and(eq(sponsors.channelId, channelId), ne(deals.state, "cancelled")))
    .orderBy(asc(sponsors.company));
}

/** The episodes one sponsor has a live deal on. */
export async function episodesSponsoredBy(db: Database, channelId: string, sponsorId: string) {
  const rows = await db
    .select({ episodeId: deals.episodeId })
    .from(deals)
    .where(and(eq(deals.channelId, channelId), eq(deals.sponsorId, sponsorId), ne(deals.state, "cancelled")));
  return new Set(rows.flatMap((r) => (r.episodeId === null ? [] : [r.episodeId])));
}
