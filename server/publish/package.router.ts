import { goLiveSchema, packageInputSchema } from "../../shared/publish/schemas";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { goLive, packageView, savePackage } from "./package.service";
import type { PublishContext } from "./publish.context";

const publish = "/api/channels/:channelId/episodes/:episodeId/publish";

/** The publish package and going live (the spec's "publish package" row). */
export function packageRoutes(ctx: PublishContext): RouteSpec[] {
  return [
    {
      method: "get",
      path: publish,
      access: channelAccess("publish", "R"),
      handler: async (req, res) => res.json({ package: await packageView(ctx, ctx.db, callerOf(req).channelId, idOf(req, "episodeId")) }),
    },
    {
      method: "put",
      path: publish,
      access: channelAccess("publish", "W"),
      handler: async (req, res) => {
        const input = parseBody(packageInputSchema, req.body);
        res.json({ package: await savePackage(ctx, callerOf(req), idOf(req, "episodeId"), input) });
      },
    },
    {
      method: "post",
      path: `${publish}/go-live`,
      access: channelAccess("publish", "W"),
      handler: async (req, res) => {
        const input = parseBody(goLiveSchema, req.body);
        res.json({ package: await goLive(ctx, callerOf(req), idOf(req, "episodeId"), input) });
      },
    },
  ];
}
