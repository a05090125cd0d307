import { shotKindLabels, shotPriorityLabels } from "../../shared/rushes/vocabulary";
import type { NeedEntry } from "../../shared/home/needs";
import type { Database } from "../db/client";
import { channelPath, type NeedSource, type NeedViewer } from "../seams/home-needs";
import { plannedShotsOf, shootDaysFrom, unratedClips, unratedCount, UNRATED_LIMIT } from "./needs.repository";
import { crewOf } from "./shoot.repository";

type ShownDay = Awaited<ReturnType<typeof shootDaysFrom>>[number];

/** Today's shoot days in the viewer's zone; on a day without one, the next one ahead. */
async function daysToShow(db: Database, viewer: NeedViewer) {
  const ahead = await shootDaysFrom(db, viewer.channelId, viewer.today, 10);
  const today = ahead.filter((day) => day.day === viewer.today);
  return today.length > 0 ? today : ahead.slice(0, 1);
}

/** An entry done on a shoot day's page. */
const onDay = (viewer: NeedViewer, day: ShownDay, entry: Pick<NeedEntry, "group" | "key" | "title" | "detail" | "tone">): NeedEntry => ({
  ...entry,
  episode: { id: day.episodeId, title: day.episodeTitle },
  href: channelPath(viewer.channelId, `shoot-days/${day.id}`),
  date: day.day,
});

const shootToday: NeedSource = {
  group: "shoot_today",
  area: "shoot",
  async needsFor(db, viewer) {
    const days = await daysToShow(db, viewer);
    const crew = await crewOf(db, days.map((day) => day.id));
    return days.map((day) => {
      const names = crew.filter((person) => person.shootDayId === day.id);
      const onCrew = names.some((person) => person.userId === viewer.userId);
      const isToday = day.day === viewer.today;
      const where = [day.place, day.callTime ? `call ${day.callTime} local time` : ""].filter(Boolean).join(", ");
      const who = names.length === 0 ? "Nobody is on the crew list yet." : `Crew: ${names.map((p) => p.name).join(", ")}${onCrew ? " (you are on it)" : ""}.`;
      return onDay(viewer, day, {
        group: "shoot_today",
        key: `shoot_today:${day.id}`,
        title: `${isToday ? "Today" : "Next shoot"}: ${day.episodeTitle}`,
        detail: `${where || "No place set yet"}. ${who}`,
        tone: isToday ? "warn" : "info",
      });
    });
  },
};

/** The planned shots of the days above: must-haves first, in their list's order. */
const shotsToGet: NeedSource = {
  group: "shot_to_get",
  area: "shoot",
  async needsFor(db, viewer) {
    const days = await daysToShow(db, viewer);
    const byId = new Map(days.map((day) => [day.id, day]));
    const shots = await plannedShotsOf(db, viewer.channelId, [...byId.keys()]);
    const order = { must: 0, normal: 1, spare: 2 } as const;
    return [...shots]
      .sort((a, b) => order[a.priority] - order[b.priority])
      .map((shot) => {
        const day = byId.get(shot.shootDayId!)!;
        const detail = `${shotKindLabels[shot.kind]} · ${shotPriorityLabels[shot.priority]} · ${day.episodeTitle}`;
        return onDay(viewer, day, { group: "shot_to_get", key: `shot_to_get:${shot.id}`, title: shot.description, detail, tone: shot.priority === "must" ? "warn" : "info" });
      });
  },
};

/** Clips without a rating: the editor's logging still to do, oldest first. */
const unloggedClips: NeedSource = {
  group: "unlogged_clip",
  area: "footage",
  async needsFor(db, viewer) {
    const [rows, total] = await Promise.all([unratedClips(db, viewer.channelId), unratedCount(db, viewer.channelId)]);
    const entries = rows.map(
      (clip): NeedEntry => ({
        group: "unlogged_clip",
        key: `unlogged_clip:${clip.id}`,
        title: clip.fileName,
        detail: `${clip.camera ? `${clip.camera}, ` : ""}${clip.episodeTitle}: not rated yet (select, maybe or reject).`,
        tone: "info",
        episode: { id: clip.episodeId, title: clip.episodeTitle },
        href: channelPath(viewer.channelId, `rushes?clip=${clip.id}`),
        date: null,
      }),
    );
    if (total <= UNRATED_LIMIT) return entries;
    const more: NeedEntry = {
      group: "unlogged_clip",
      key: "unlogged_clip:more",
      title: `${total - UNRATED_LIMIT} more clips not rated yet`,
      detail: "The rushes page lists every clip; sort by rating to find them.",
      tone: "info",
      episode: null,
      href: channelPath(viewer.channelId, "rushes"),
      date: null,
    };
    return [...entries, more];
  },
};

/** Rushes entries on members' homes. */
export const rushesNeeds: NeedSource[] = [shootToday, shotsToGet, unloggedClips];
