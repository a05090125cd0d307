import { sql } from "drizzle-orm";
import type { CalendarEntry } from "../../shared/calendar/entries";
import { localDate } from "../../shared/slate/dates";
import type { CalendarSource } from "../seams/calendar-sources";
import { channelPath } from "../seams/home-needs";

interface ReleaseRow extends Record<string, unknown> {
  episode_id: string;
  title: string;
  owner_id: string | null;
  publish_at: string;
  time_zone: string;
  published: boolean;
}

/** A day either side of the window: an instant's day in the reader's zone may differ from its UTC day. */
const widened = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString();

/** Publish packages' release times, timed in the zone they were set in, from the publish package: one query. */
export const publishCalendar: CalendarSource = {
  name: "publish",
  area: "publish",
  async entriesFor(db, viewer, window) {
    const { rows } = await db.execute<ReleaseRow>(sql`
      select e.id as episode_id, e.title, e.owner_id, p.publish_at, p.time_zone, p.published_at is not null as published
      from publish_packages p join episodes e on e.id = p.episode_id
      where p.channel_id = ${viewer.channelId} and e.archived_at is null and p.publish_at is not null
        and p.publish_at >= ${widened(window.from, -1)} and p.publish_at < ${widened(window.to, 2)}
        ${window.episodeId ? sql`and p.episode_id = ${window.episodeId}` : sql``}
      order by p.publish_at`);
    return rows
      .map(
        (row): CalendarEntry => ({
          key: `release:${row.episode_id}`,
          kind: "release",
          title: `${row.published ? "Released" : "Release"}: ${row.title}`,
          detail: row.published ? "The video is live." : "The publish package's release time.",
          day: localDate(new Date(row.publish_at), viewer.timeZone),
          at: new Date(row.publish_at).toISOString(),
          zone: row.time_zone,
          episodeId: row.episode_id,
          episodeTitle: row.title,
          sponsorId: null,
          sponsorName: null,
          people: row.owner_id ? [row.owner_id] : [],
          href: channelPath(viewer.channelId, `episodes/${row.episode_id}/publish-package`),
          fee: null,
          episodeVersion: null,
        }),
      )
      .filter((e) => e.day >= window.from && e.day <= window.to);
  },
};
