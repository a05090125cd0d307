import { sql } from "drizzle-orm";
import { roleMay } from "../../shared/access/roles";
import { stageDueKey } from "../../shared/calendar/conflicts";
import type { CalendarEntry } from "../../shared/calendar/entries";
import { countBack, defaultStageLengths, type DueOverrides, type StageLengths } from "../../shared/slate/schedule";
import { stageLabels, type Stage } from "../../shared/slate/stages";
import type { Queryable } from "../db/client";
import type { CalendarSource, PublishDateMover } from "../seams/calendar-sources";
import type { PublishDateFollower } from "../seams/episode-dates";
import { channelPath } from "../seams/home-needs";
import { updateEpisode } from "./episodes.repository";

interface DatedEpisode extends Record<string, unknown> {
  id: string;
  title: string;
  version: number;
  owner_id: string | null;
  target_publish_date: string;
  stage_lengths: Partial<StageLengths> | null;
  overrides: DueOverrides;
}

/**
 * Episodes that publish on or after the window's start (every stage is due on or before the publish
 * day, so none earlier can show), with the channel's lengths and each episode's overrides: one query.
 */
async function datedEpisodes(db: Queryable, channelId: string, from: string, episodeId?: string) {
  const result = await db.execute<DatedEpisode>(sql`
    select e.id, e.title, e.version, e.owner_id, e.target_publish_date::text as target_publish_date, s.stage_lengths,
      coalesce((select json_object_agg(o.stage, o.due_date::text) from due_overrides o where o.episode_id = e.id), '{}'::json) as overrides
    from episodes e left join slate_channels s on s.channel_id = e.channel_id
    where e.channel_id = ${channelId} and e.archived_at is null and e.target_publish_date >= ${from}
      ${episodeId ? sql`and e.id = ${episodeId}` : sql``}`);
  return result.rows;
}

function entriesOf(channelId: string, row: DatedEpisode, canMove: boolean): CalendarEntry[] {
  const base = {
    episodeId: row.id,
    episodeTitle: row.title,
    sponsorId: null,
    sponsorName: null,
    people: row.owner_id ? [row.owner_id] : [],
    at: null,
    zone: null,
    fee: null,
  };
  const lengths = { ...defaultStageLengths, ...row.stage_lengths };
  const stages = countBack(row.target_publish_date, lengths, row.overrides).filter((s) => s.stage !== "publish");
  return [
    {
      ...base,
      key: `publish:${row.id}`,
      kind: "publish",
      title: `Publish: ${row.title}`,
      detail: "The episode's target publish date; its stage due dates and sponsor items count back from it.",
      day: row.target_publish_date,
      href: channelPath(channelId, `episodes/${row.id}/overview`),
      episodeVersion: canMove ? row.version : null,
    },
    ...stages.map((s): CalendarEntry => ({
      ...base,
      key: stageDueKey(row.id, s.stage),
      kind: "stage_due",
      title: `${stageLabels[s.stage as Stage]} due: ${row.title}`,
      detail: s.overridden ? "Due date set by hand." : `Counted back from the publish date (${s.lengthDays} working days).`,
      day: s.due,
      href: channelPath(channelId, `episodes/${row.id}/overview`),
      episodeVersion: null,
    })),
  ];
}

/** Publish days and stage due dates, from the slate. */
export const slateCalendar: CalendarSource = {
  name: "slate",
  area: "episodes",
  async entriesFor(db, viewer, window) {
    const canMove = roleMay(viewer.role, "episodes", "W");
    const rows = await datedEpisodes(db, viewer.channelId, window.from, window.episodeId);
    return rows.flatMap((row) => entriesOf(viewer.channelId, row, canMove)).filter((e) => e.day >= window.from && e.day <= window.to);
  },
};

/** The slate's publish-date move for the calendar's preview: the date, then every follower, in `db`'s transaction. */
export function slatePublishDateMover(followers: readonly PublishDateFollower[]): PublishDateMover {
  return async (db, move) => {
    const [current] = (await db.execute<{ version: number }>(sql`select version from episodes where id = ${move.episodeId} and channel_id = ${move.channelId}`)).rows;
    if (!current) return;
    await updateEpisode(db, move.channelId, move.episodeId, current.version, { targetPublishDate: move.date });
    for (const follower of followers) await follower.follow(db, move);
  };
}
