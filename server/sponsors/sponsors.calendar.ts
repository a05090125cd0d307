import { sql } from "drizzle-orm";
import { roleMay } from "../../shared/access/roles";
import { inCurrencyDigits } from "../../shared/money/minor-units";
import type { CalendarEntry } from "../../shared/calendar/entries";
import { deliverableKindLabels, deliverableStatusLabels, moneyKinds, type DeliverableKind, type DeliverableStatus } from "../../shared/sponsors/deliverables";
import type { CalendarSource } from "../seams/calendar-sources";
import { channelPath } from "../seams/home-needs";

interface ItemRow extends Record<string, unknown> {
  id: string;
  kind: DeliverableKind;
  title: string;
  status: DeliverableStatus;
  due_date: string;
  owner_id: string | null;
  host_id: string | null;
  sponsor_id: string;
  company: string;
  episode_id: string | null;
  episode_title: string | null;
  fee_amount: string | null;
  currency: string | null;
}

function entryOf(channelId: string, row: ItemRow): CalendarEntry {
  const place = row.episode_id ? `episodes/${row.episode_id}/sponsor-deals` : `sponsors/${row.sponsor_id}`;
  return {
    key: `deliverable:${row.id}`,
    kind: row.kind === "report" ? "figures" : "deliverable",
    title: `${row.company}: ${row.title}`,
    detail: `${deliverableKindLabels[row.kind]}, ${deliverableStatusLabels[row.status].toLowerCase()}${row.episode_title ? `, for “${row.episode_title}”` : ""}.`,
    day: row.due_date,
    at: null,
    zone: null,
    episodeId: row.episode_id,
    episodeTitle: row.episode_title,
    sponsorId: row.sponsor_id,
    sponsorName: row.company,
    people: [...new Set([row.owner_id, row.host_id].filter((id): id is string => Boolean(id)))],
    href: channelPath(channelId, place),
    fee: row.fee_amount && row.currency ? { amount: inCurrencyDigits(row.fee_amount, row.currency), currency: row.currency } : null,
    episodeVersion: null,
  };
}

/**
 * Dated sponsor items of deals still on, from the sponsors: one query. The invoice and payment items,
 * and every fee, only for roles that may see money: the query never reads them for the others.
 */
export const sponsorsCalendar: CalendarSource = {
  name: "sponsors",
  area: "deliverables",
  async entriesFor(db, viewer, window) {
    const money = roleMay(viewer.role, "fees", "R");
    const moneyList = sql.join(moneyKinds.map((k) => sql`${k}`), sql`, `);
    const { rows } = await db.execute<ItemRow>(sql`
      select i.id, i.kind, i.title, i.status, i.due_date::text as due_date, i.owner_id, d.host_id, s.id as sponsor_id, s.company,
        e.id as episode_id, e.title as episode_title,
        ${money ? sql`case when i.kind in (${moneyList}) then d.fee_amount::text end` : sql`null::text`} as fee_amount,
        ${money ? sql`d.currency` : sql`null::text`} as currency
      from deliverables i join deals d on d.id = i.deal_id join sponsors s on s.id = d.sponsor_id
        left join episodes e on e.id = d.episode_id
      where i.channel_id = ${viewer.channelId} and d.channel_id = ${viewer.channelId} and d.state <> 'cancelled' and i.due_date between ${window.from} and ${window.to}
        and (e.id is null or e.archived_at is null)
        ${money ? sql`` : sql`and i.kind not in (${moneyList})`}
        ${window.episodeId ? sql`and d.episode_id = ${window.episodeId}` : sql``}
      order by i.due_date, i.id`);
    return rows.map((row) => entryOf(viewer.channelId, row));
  },
};
