import { and, asc, eq, isNotNull, ne, notInArray } from "drizzle-orm";
import { episodeIdIn } from "../slate/flags";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import { DUE_SOON_DAYS, deskGroupOf, moneyKinds } from "../../shared/sponsors/deliverables";
import type { BoardFlag } from "../../shared/slate/flags";
import type { Database } from "../db/client";
import { deals, deliverables, sponsors } from "../db/schema/sponsors";
import type { BoardFilter, BoardFlagSource } from "../slate/flags";

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * "Sponsor item late" when an open item of a live deal is past its date, "Sponsor item due" when one
 * is due in the next seven days. The board is read by every role, so invoice and payment items (which
 * only fee roles see) never raise a flag. The board has no viewer's time zone here: today is UTC's date.
 */
const dueAndLate: BoardFlagSource = {
  name: "sponsors.items",
  async flagsFor(db, channelId, episodeIds) {
    const out = new Map<string, BoardFlag[]>();
    if (episodeIds.length === 0) return out;
    const rows = await db
      .select({ episodeId: deals.episodeId, company: sponsors.company, title: deliverables.title, status: deliverables.status, dueDate: deliverables.dueDate })
      .from(deliverables)
      .innerJoin(deals, eq(deals.id, deliverables.dealId))
      .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
      .where(
        and(
          eq(deliverables.channelId, channelId),
          episodeIdIn(deals.episodeId, episodeIds),
          ne(deals.state, "cancelled"),
          notInArray(deliverables.status, ["approved", "done"]),
          notInArray(deliverables.kind, [...moneyKinds]),
          isNotNull(deliverables.dueDate),
        ),
      )
      .orderBy(asc(deliverables.dueDate));
    const today = dateInZone(new Date(), "UTC");
    const late = new Map<string, string[]>();
    const due = new Map<string, string[]>();
    for (const row of rows) {
      const group = deskGroupOf(row, today);
      const line = `${row.company}: ${row.title} (${row.dueDate})`;
      if (group === "overdue") late.set(row.episodeId, [...(late.get(row.episodeId) ?? []), line]);
      else if (group === "due_soon" || (group === "waiting" && row.dueDate !== null && row.dueDate <= shiftDate(today, DUE_SOON_DAYS))) {
        due.set(row.episodeId, [...(due.get(row.episodeId) ?? []), line]);
      }
    }
    for (const episodeId of new Set([...late.keys(), ...due.keys()])) {
      const flags: BoardFlag[] = [];
      const lateLines = late.get(episodeId);
      const dueLines = due.get(episodeId);
      if (lateLines) flags.push({ code: "sponsors.item_late", label: "Sponsor item late", tone: "alarm", detail: `Late: ${lateLines.join("; ")}` });
      if (dueLines) flags.push({ code: "sponsors.item_due", label: "Sponsor item due", tone: "warn", detail: `Due within 7 days: ${dueLines.join("; ")}` });
      out.set(episodeId, flags);
    }
    return out;
  },
};

/** Sponsor flags on board cards. */
export const sponsorFlagSources: BoardFlagSource[] = [dueAndLate];

/** The board's sponsor filter: the channel's sponsors with a live deal, and the episodes each sponsors. */
export const sponsorBoardFilter: BoardFilter | null = {
  param: "sponsor",
  async options(db: Database, channelId: string) {
    const rows = await db
      .selectDistinct({ value: sponsors.id, label: sponsors.company })
      .from(sponsors)
      .innerJoin(deals, eq(deals.sponsorId, sponsors.id))
      .where(and(eq(sponsors.channelId, channelId), ne(deals.state, "cancelled")))
      .orderBy(asc(sponsors.company));
    return rows;
  },
  async episodeIds(db: Database, channelId: string, value: string) {
    if (!uuidPattern.test(value)) return new Set<string>();
    const rows = await db
      .select({ episodeId: deals.episodeId })
      .from(deals)
      .where(and(eq(deals.channelId, channelId), eq(deals.sponsorId, value), ne(deals.state, "cancelled")));
    return new Set(rows.map((r) => r.episodeId));
  },
};
