import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseId } from "../http/validate";
import type { RushesContext } from "./rushes.context";
import { addStill, stillWithLink } from "./stills.service";

const stills = "/api/channels/:channelId/stills";

/** Photos through the server, streamed into storage (the spec's "footage" row). */
export function stillRoutes(ctx: RushesContext): RouteSpec[] {
  return [
    {
      method: "post",
      path: stills,
      access: channelAccess("footage", "W"),
      body: "multipart",
      handler: async (req, res) => {
        // The episode, when given, comes in the query: the key is made before the form's fields are read.
        const episodeId = typeof req.query.episodeId === "string" && req.query.episodeId ? parseId(req.query.episodeId, "Episode") : null;
        res.status(201).json({ still: await addStill(ctx, callerOf(req), episodeId, req, res) });
      },
    },
    {
      method: "get",
      path: `${stills}/:stillId`,
      access: channelAccess("footage", "R"),
      handler: async (req, res) => res.json({ still: await stillWithLink(ctx, callerOf(req), idOf(req, "stillId")) }),
    },
  ];
}
