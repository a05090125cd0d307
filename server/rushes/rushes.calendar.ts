import { sql } from "drizzle-orm";
import type { CalendarEntry } from "../../shared/calendar/entries";
import type { CalendarSource } from "../seams/calendar-sources";
import { channelPath } from "../seams/home-needs";

interface ShootRow extends Record<string, unknown> {
  id: string;
  day: string;
  place: string;
  call_time: string | null;
  episode_id: string;
  episode_title: string;
  crew: string[];
}

/** Shoot days in the window with their crew, from the rushes: one query. */
export const rushesCalendar: CalendarSource = {
  name: "rushes",
  area: "shoot",
  async entriesFor(db, viewer, window) {
    const { rows } = await db.execute<ShootRow>(sql`
      select d.id, d.day::text as day, d.place, d.call_time, e.id as episode_id, e.title as episode_title,
        coalesce((select array_agg(c.user_id order by c.user_id) from shoot_day_crew c where c.shoot_day_id = d.id), '{}') as crew
      from shoot_days d join episodes e on e.id = d.episode_id
      where d.channel_id = ${viewer.channelId} and e.archived_at is null and d.day between ${window.from} and ${window.to}
        ${window.episodeId ? sql`and d.episode_id = ${window.episodeId}` : sql``}
      order by d.day, d.id`);
    return rows.map(
      (row): CalendarEntry => ({
        key: `shoot:${row.id}`,
        kind: "shoot",
        title: `Shoot: ${row.episode_title}`,
        detail: [row.place && `At ${row.place}.`, row.call_time && `Call time ${row.call_time}, local time at the place.`].filter(Boolean).join(" "),
        day: row.day,
        at: null,
        zone: null,
        episodeId: row.episode_id,
        episodeTitle: row.episode_title,
        sponsorId: null,
        sponsorName: null,
        people: row.crew,
        href: channelPath(viewer.channelId, `episodes/${row.episode_id}/shoot`),
        fee: null,
        episodeVersion: null,
      }),
    );
  },
};
