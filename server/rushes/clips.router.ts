import { footageQuerySchema } from "../../shared/rushes/footage-query";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import { markInputSchema, markPatchSchema, updateClipSchema } from "../../shared/rushes/schemas";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import * as clips from "./clips.service";
import { retryClipMedia } from "./media.service";
import type { RushesContext } from "./rushes.context";

const list = "/api/channels/:channelId/clips";
const clip = `${list}/:clipId`;

/** The footage list, a clip's log, preview and poster, and its timecode marks (the spec's "footage" row). */
export function clipRoutes(ctx: RushesContext): RouteSpec[] {
  const read = channelAccess("footage", "R");
  const write = channelAccess("footage", "W");
  return [
    {
      method: "get",
      path: list,
      access: read,
      handler: async (req, res) => res.json(await clips.listFootage(ctx, callerOf(req), parseBody(footageQuerySchema, req.query))),
    },
    {
      method: "get",
      path: clip,
      access: read,
      handler: async (req, res) => res.json({ clip: await clips.getClip(ctx, callerOf(req), idOf(req, "clipId")) }),
    },
    {
      method: "patch",
      path: clip,
      access: write,
      handler: async (req, res) => {
        const patch = parseBody(updateClipSchema, req.body);
        res.json({ clip: await clips.updateClip(ctx, callerOf(req), idOf(req, "clipId"), patch) });
      },
    },
    {
      method: "delete",
      path: clip,
      // Crew upload and log footage but never delete it: an area of its own in the role table.
      access: channelAccess("footageRemoval", "W", "Crew can upload and log footage but not delete it."),
      body: "none",
      handler: async (req, res) => {
        await clips.deleteClip(ctx, callerOf(req), idOf(req, "clipId"));
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: `${clip}/preview`,
      access: read,
      handler: async (req, res) => {
        const download = req.query.download === "1";
        res.set("Cache-Control", `private, max-age=${Math.floor(PREVIEW_URL_SECONDS / 2)}`);
        res.json(await clips.previewUrl(ctx, callerOf(req), idOf(req, "clipId"), download));
      },
    },
    {
      method: "post",
      path: `${clip}/poster`,
      access: write,
      body: "multipart",
      handler: async (req, res) => res.status(201).json({ clip: await clips.setPoster(ctx, callerOf(req), idOf(req, "clipId"), req, res) }),
    },
    {
      method: "post",
      path: `${clip}/media/retry`,
      // Anyone who may upload and log footage may ask again for a failed clip's poster and proxy.
      access: write,
      body: "none",
      handler: async (req, res) => {
        await retryClipMedia(ctx, callerOf(req), idOf(req, "clipId"));
        res.status(202).json({ clip: await clips.getClip(ctx, callerOf(req), idOf(req, "clipId")) });
      },
    },
    {
      method: "post",
      path: `${clip}/marks`,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(markInputSchema, req.body);
        res.status(201).json({ mark: await clips.addMark(ctx, callerOf(req), idOf(req, "clipId"), input) });
      },
    },
    {
      method: "patch",
      path: `${clip}/marks/:markId`,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(markPatchSchema, req.body);
        res.json({ mark: await clips.updateMark(ctx, callerOf(req), idOf(req, "clipId"), idOf(req, "markId"), input) });
      },
    },
    {
      method: "delete",
      path: `${clip}/marks/:markId`,
      access: write,
      body: "none",
      handler: async (req, res) => {
        await clips.deleteMark(ctx, callerOf(req), idOf(req, "clipId"), idOf(req, "markId"));
        res.status(204).end();
      },
    },
  ];
}
