import { completeUploadSchema, partUrlsSchema, recordPartsSchema, startUploadSchema } from "../../shared/rushes/schemas";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { getClip } from "./clips.service";
import type { RushesContext } from "./rushes.context";
import * as uploads from "./uploads.service";

const upload = "/api/channels/:channelId/uploads";

/** Uploads: the server signs and records; the bytes go from the browser to storage (the spec's "footage" row). */
export function uploadRoutes(ctx: RushesContext): RouteSpec[] {
  const read = channelAccess("footage", "R");
  const write = channelAccess("footage", "W");
  return [
    {
      method: "post",
      path: upload,
      access: write,
      handler: async (req, res) => {
        const body = parseBody(startUploadSchema, req.body);
        res.status(201).json({ upload: await uploads.startUpload(ctx, callerOf(req), body) });
      },
    },
    {
      method: "get",
      path: upload,
      access: read,
      handler: async (req, res) => {
        const episodeId = typeof req.query.episodeId === "string" && req.query.episodeId ? parseId(req.query.episodeId, "Episode") : undefined;
        res.json({ uploads: await uploads.listOpenUploads(ctx, callerOf(req), episodeId) });
      },
    },
    {
      // Asked before a file is sent, so a file already in the channel is flagged first.
      method: "get",
      path: "/api/channels/:channelId/footage-checksums/:sha256",
      access: read,
      valueParams: ["sha256"],
      handler: async (req, res) => res.json(await uploads.findByChecksum(ctx, callerOf(req), String(req.params.sha256))),
    },
    {
      method: "get",
      path: `${upload}/:uploadId`,
      access: read,
      handler: async (req, res) => res.json({ upload: await uploads.getUpload(ctx, callerOf(req), idOf(req, "uploadId")) }),
    },
    {
      method: "post",
      path: `${upload}/:uploadId/part-urls`,
      access: write,
      handler: async (req, res) => {
        const { parts } = parseBody(partUrlsSchema, req.body);
        res.json(await uploads.signParts(ctx, callerOf(req), idOf(req, "uploadId"), parts));
      },
    },
    {
      method: "post",
      path: `${upload}/:uploadId/parts`,
      access: write,
      handler: async (req, res) => {
        const { parts } = parseBody(recordPartsSchema, req.body);
        res.json(await uploads.recordParts(ctx, callerOf(req), idOf(req, "uploadId"), parts));
      },
    },
    {
      method: "post",
      path: `${upload}/:uploadId/complete`,
      access: write,
      handler: async (req, res) => {
        const body = parseBody(completeUploadSchema, req.body);
        const caller = callerOf(req);
        const done = await uploads.completeUpload(ctx, caller, idOf(req, "uploadId"), body);
        res.status(done.alreadyComplete ? 200 : 201).json({ clip: await getClip(ctx, caller, done.clipId) });
      },
    },
    {
      method: "delete",
      path: `${upload}/:uploadId`,
      access: write,
      body: "none",
      handler: async (req, res) => res.json(await uploads.cancelUpload(ctx, callerOf(req), idOf(req, "uploadId"))),
    },
  ];
}
