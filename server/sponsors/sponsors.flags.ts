import { isUuid } from "../../shared/http/ids";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import { DUE_SOON_DAYS, deskGroupOf } from "../../shared/sponsors/deliverables";
import type { BoardFlag } from "../../shared/slate/flags";
import type { BoardFilter, BoardFlagSource } from "../seams/board-flags";
import { datedOpenItems, episodesSponsoredBy, sponsorsWithLiveDeals } from "./board.repository";

/**
 * "Sponsor item late" when an open item of a live deal is past its date, "Sponsor item due" when one
 * is due in the next seven days. The board is read by every role, so invoice and payment items (which
 * only fee roles see) never raise a flag. Days are counted from UTC's date, not the viewer's.
 */
const dueAndLate: BoardFlagSource = {
  name: "sponsors.items",
  async flagsFor(db, channelId, episodeIds) {
    const out = new Map<string, BoardFlag[]>();
    if (episodeIds.length === 0) return out;
    const rows = await datedOpenItems(db, channelId, episodeIds);
    const today = dateInZone(new Date(), "UTC");
    const late = new Map<string, string[]>();
    const due = new Map<string, string[]>();
    for (const row of rows) {
      const group = deskGroupOf(row, today);
      const line = `${row.company}: ${row.title} (${row.dueDate})`;
      if (group === "overdue") late.set(row.episodeId, [...(late.get(row.episodeId) ?? []), line]);
      else if (group !== null && row.dueDate !== null && row.dueDate <= shiftDate(today, DUE_SOON_DAYS)) {
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
export const sponsorBoardFilter: BoardFilter = {
  options: sponsorsWithLiveDeals,
  async episodeIds(db, channelId, value) {
    return isUuid(value) ? episodesSponsoredBy(db, channelId, value) : new Set<string>();
  },
};
