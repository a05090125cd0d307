import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import type { PublishContext } from "./publish.context";
import { addThumbnail, removeThumbnail } from "./thumbnails.service";

const thumbnails = "/api/channels/:channelId/episodes/:episodeId/publish/thumbnails";

/** Candidate thumbnails, streamed through the server into storage. */
export function thumbnailRoutes(ctx: PublishContext): RouteSpec[] {
  return [
    {
      method: "post",
      path: thumbnails,
      access: channelAccess("publish", "W"),
      body: "multipart",
      handler: async (req, res) => {
        res.status(201).json({ thumbnail: await addThumbnail(ctx, callerOf(req), idOf(req, "episodeId"), req, res) });
      },
    },
    {
      method: "delete",
      path: `${thumbnails}/:thumbnailId`,
      access: channelAccess("publish", "W"),
      handler: async (req, res) => {
        await removeThumbnail(ctx, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "thumbnailId"));
        res.status(204).end();
      },
    },
  ];
}
