import type { EpisodeSummary } from "../../shared/slate/schemas";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import { memberOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseId } from "../http/validate";
import { findEpisode, listEpisodes } from "./episodes.repository";

type EpisodeRow = Awaited<ReturnType<typeof listEpisodes>>[number];

const toSummary = (row: EpisodeRow): EpisodeSummary => ({ ...row, archivedAt: row.archivedAt?.toISOString() ?? null });

export function slateRoutes(db: Database): RouteSpec[] {
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/episodes",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const rows = await listEpisodes(db, memberOf(req).channelId);
        res.json({ episodes: rows.map(toSummary) });
      },
    },
    {
      method: "get",
      path: "/api/channels/:channelId/episodes/:episodeId",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const episodeId = parseId(req.params.episodeId, "Episode");
        const row = await findEpisode(db, memberOf(req).channelId, episodeId);
        if (!row) throw notFound("Episode");
        res.json({ episode: toSummary(row) });
      },
    },
  ];
}
