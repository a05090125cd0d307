import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { footageLinks } from "./footage-links.service";
import type { RushesContext } from "./rushes.context";

/** What the episode's footage shows: read by anyone who reads footage; links are written on the clip and its marks. */
export function footageLinkRoutes(ctx: RushesContext): RouteSpec[] {
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/episodes/:episodeId/footage-links",
      access: channelAccess("footage", "R"),
      handler: async (req, res) => res.json(await footageLinks(ctx, callerOf(req), idOf(req, "episodeId"))),
    },
  ];
}
