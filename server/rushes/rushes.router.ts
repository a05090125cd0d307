import { z } from "zod";
import { footageQuerySchema } from "../../shared/rushes/footage-query";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import {
  completeUploadSchema,
  markInputSchema,
  markPatchSchema,
  partUrlsSchema,
  recordPartSchema,
  shootDayPatchSchema,
  shootDaySchema,
  shotPatchSchema,
  shotSchema,
  startUploadSchema,
  updateClipSchema,
} from "../../shared/rushes/schemas";
import type { AppDeps } from "../app";
import { AppError, notFound } from "../http/app-error";
import { memberOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { viaStorage } from "../storage/storage";
import * as clipsService from "./clips.service";
import * as exportsService from "./exports.service";
import { posterKey, stillKey } from "./object-keys";
import * as shoot from "./shoot.service";
import { channelPeople } from "./shoot.repository";
import { receiveStill } from "./stills";
import * as uploads from "./uploads.service";
import * as uploadsRepo from "./uploads.repository";
import * as clipsRepo from "./clips.repository";

const C = "/api/channels/:channelId";
const footageR = channelAccess("footage", "R");
const footageW = channelAccess("footage", "W");
const shootR = channelAccess("shoot", "R");
const shootW = channelAccess("shoot", "W");

const partNumberOf = (value: unknown) => {
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 10_000) throw notFound("Part");
  return n;
};

const idsSchema = z.object({ ids: z.string().max(200 * 37, "Too many clips in one zip.") });

/** Footage (uploads, clips, marks, exports), shoot days and the shot list. Handlers stay thin: the services tell the story. */
export function rushesRoutes(deps: AppDeps): RouteSpec[] {
  const ctx = { db: deps.database.db, storage: deps.storage };
  return [
    // Uploads: the server signs and records; the bytes go from the browser to storage.
    {
      method: "post",
      path: `${C}/uploads`,
      access: footageW,
      handler: async (req, res) => {
        const body = parseBody(startUploadSchema, req.body);
        res.status(201).json({ upload: await uploads.startUpload(ctx, memberOf(req), body) });
      },
    },
    {
      method: "get",
      path: `${C}/uploads`,
      access: footageR,
      handler: async (req, res) => {
        const episodeId = typeof req.query.episodeId === "string" && req.query.episodeId ? parseId(req.query.episodeId, "Episode") : undefined;
        res.json({ uploads: await uploads.listOpenUploads(ctx, memberOf(req), episodeId) });
      },
    },
    {
      method: "get",
      path: `${C}/uploads/:uploadId`,
      access: footageR,
      handler: async (req, res) => {
        res.json({ upload: await uploads.getUpload(ctx, memberOf(req), parseId(req.params.uploadId, "Upload")) });
      },
    },
    {
      method: "post",
      path: `${C}/uploads/:uploadId/part-urls`,
      access: footageW,
      handler: async (req, res) => {
        const { parts } = parseBody(partUrlsSchema, req.body);
        res.json(await uploads.signParts(ctx, memberOf(req), parseId(req.params.uploadId, "Upload"), parts));
      },
    },
    {
      method: "put",
      path: `${C}/uploads/:uploadId/parts/:partNumber`,
      access: footageW,
      handler: async (req, res) => {
        const part = parseBody(recordPartSchema, req.body);
        res.json({ part: await uploads.recordPart(ctx, memberOf(req), parseId(req.params.uploadId, "Upload"), partNumberOf(req.params.partNumber), part) });
      },
    },
    {
      method: "post",
      path: `${C}/uploads/:uploadId/complete`,
      access: footageW,
      handler: async (req, res) => {
        const body = parseBody(completeUploadSchema, req.body);
        const member = memberOf(req);
        const done = await uploads.completeUpload(ctx, member, parseId(req.params.uploadId, "Upload"), body);
        res.status(done.alreadyComplete ? 200 : 201).json({ clip: await clipsService.getClip(ctx, member, done.clipId) });
      },
    },
    {
      method: "delete",
      path: `${C}/uploads/:uploadId`,
      access: footageW,
      body: "none",
      handler: async (req, res) => {
        res.json(await uploads.cancelUpload(ctx, memberOf(req), parseId(req.params.uploadId, "Upload")));
      },
    },

    // The footage list and its exports.
    {
      method: "get",
      path: `${C}/clips`,
      access: footageR,
      handler: async (req, res) => {
        res.json(await clipsService.listFootage(ctx, memberOf(req), parseBody(footageQuerySchema, req.query)));
      },
    },
    ...(["csv", "edl", "otio"] as const).map(
      (kind): RouteSpec => ({
        method: "get",
        path: `${C}/exports/footage.${kind}`,
        access: footageR,
        handler: async (req, res) => {
          const q = parseBody(footageQuerySchema, req.query);
          await exportsService.writeExport(ctx, memberOf(req), q, kind, res);
        },
      }),
    ),
    {
      method: "get",
      path: `${C}/exports/footage.zip`,
      access: footageR,
      handler: async (req, res) => {
        const { ids } = parseBody(idsSchema, req.query);
        const clipIds = ids.split(",").filter(Boolean).map((id) => parseId(id, "Clip"));
        await exportsService.streamZip(ctx, memberOf(req), clipIds, res);
      },
    },
    {
      method: "get",
      path: `${C}/clips/:clipId`,
      access: footageR,
      handler: async (req, res) => {
        res.json({ clip: await clipsService.getClip(ctx, memberOf(req), parseId(req.params.clipId, "Clip")) });
      },
    },
    {
      method: "patch",
      path: `${C}/clips/:clipId`,
      access: footageW,
      handler: async (req, res) => {
        const patch = parseBody(updateClipSchema, req.body);
        res.json({ clip: await clipsService.updateClip(ctx, memberOf(req), parseId(req.params.clipId, "Clip"), patch) });
      },
    },
    {
      method: "delete",
      path: `${C}/clips/:clipId`,
      access: footageW,
      body: "none",
      handler: async (req, res) => {
        await clipsService.deleteClip(ctx, memberOf(req), parseId(req.params.clipId, "Clip"));
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: `${C}/clips/:clipId/preview`,
      access: footageR,
      handler: async (req, res) => {
        const download = req.query.download === "1";
        res.set("Cache-Control", `private, max-age=${Math.floor(PREVIEW_URL_SECONDS / 2)}`);
        res.json(await clipsService.previewUrl(ctx, memberOf(req), parseId(req.params.clipId, "Clip"), download));
      },
    },
    {
      method: "post",
      path: `${C}/clips/:clipId/poster`,
      access: footageW,
      body: "multipart",
      handler: async (req, res) => {
        const member = memberOf(req);
        const clip = await clipsRepo.findClip(ctx.db, member.channelId, parseId(req.params.clipId, "Clip"));
        if (!clip) throw notFound("Clip");
        const { file } = await receiveStill(req, res, ctx.storage, () => posterKey(member.channelId, clip.episodeId));
        await clipsRepo.updateClip(ctx.db, member.channelId, clip.id, { posterKey: file.key });
        if (clip.posterKey) await ctx.storage.remove(clip.posterKey).catch(() => undefined);
        res.status(201).json({ clip: await clipsService.getClip(ctx, member, clip.id) });
      },
    },
    {
      method: "post",
      path: `${C}/clips/:clipId/marks`,
      access: footageW,
      handler: async (req, res) => {
        const input = parseBody(markInputSchema, req.body);
        res.status(201).json({ mark: await clipsService.addMark(ctx, memberOf(req), parseId(req.params.clipId, "Clip"), input) });
      },
    },
    {
      method: "patch",
      path: `${C}/clips/:clipId/marks/:markId`,
      access: footageW,
      handler: async (req, res) => {
        const input = parseBody(markPatchSchema, req.body);
        const mark = await clipsService.updateMark(ctx, memberOf(req), parseId(req.params.clipId, "Clip"), parseId(req.params.markId, "Mark"), input);
        res.json({ mark });
      },
    },
    {
      method: "delete",
      path: `${C}/clips/:clipId/marks/:markId`,
      access: footageW,
      body: "none",
      handler: async (req, res) => {
        await clipsService.deleteMark(ctx, memberOf(req), parseId(req.params.clipId, "Clip"), parseId(req.params.markId, "Mark"));
        res.status(204).end();
      },
    },

    // Photos through the server, streamed into storage.
    {
      method: "post",
      path: `${C}/stills`,
      access: footageW,
      body: "multipart",
      handler: async (req, res) => {
        const member = memberOf(req);
        // The episode, when given, comes in the query: the key is made before the form's fields are read.
        const episodeId = typeof req.query.episodeId === "string" && req.query.episodeId ? parseId(req.query.episodeId, "Episode") : null;
        if (episodeId && !(await uploadsRepo.episodeInChannel(ctx.db, member.channelId, episodeId))) throw notFound("Episode");
        const { file } = await receiveStill(req, res, ctx.storage, () => stillKey(member.channelId, episodeId));
        const still = await uploadsRepo.insertStill(ctx.db, {
          channelId: member.channelId,
          episodeId,
          objectKey: file.key,
          fileName: file.fileName,
          contentType: file.contentType,
          sizeBytes: file.size,
          uploadedBy: member.userId,
        });
        res.status(201).json({ still: { id: still.id, fileName: still.fileName, contentType: still.contentType, size: still.sizeBytes, episodeId } });
      },
    },
    {
      method: "get",
      path: `${C}/stills/:stillId`,
      access: footageR,
      handler: async (req, res) => {
        const member = memberOf(req);
        const still = await uploadsRepo.findStill(ctx.db, member.channelId, parseId(req.params.stillId, "Photo"));
        if (!still) throw notFound("Photo");
        const url = await viaStorage(() => ctx.storage.presignGet(still.objectKey, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: still.contentType }));
        res.json({ still: { id: still.id, fileName: still.fileName, contentType: still.contentType, size: still.sizeBytes, url } });
      },
    },

    // Shoot days and the shot list: every role writes them.
    {
      method: "get",
      path: `${C}/episodes/:episodeId/shoot-days`,
      access: shootR,
      handler: async (req, res) => {
        res.json({ shootDays: await shoot.listShootDays(ctx, memberOf(req), parseId(req.params.episodeId, "Episode")) });
      },
    },
    {
      method: "post",
      path: `${C}/episodes/:episodeId/shoot-days`,
      access: shootW,
      handler: async (req, res) => {
        const body = parseBody(shootDaySchema, req.body);
        res.status(201).json({ shootDay: await shoot.createShootDay(ctx, memberOf(req), parseId(req.params.episodeId, "Episode"), body) });
      },
    },
    {
      method: "get",
      path: `${C}/shoot-crew`,
      access: shootR,
      handler: async (req, res) => {
        res.json({ people: await channelPeople(ctx.db, memberOf(req).channelId) });
      },
    },
    {
      method: "get",
      path: `${C}/shoot-days/:shootDayId`,
      access: shootR,
      handler: async (req, res) => {
        res.json(await shoot.getShootDay(ctx, memberOf(req), parseId(req.params.shootDayId, "Shoot day")));
      },
    },
    {
      method: "patch",
      path: `${C}/shoot-days/:shootDayId`,
      access: shootW,
      handler: async (req, res) => {
        const patch = parseBody(shootDayPatchSchema, req.body);
        res.json({ shootDay: await shoot.updateShootDay(ctx, memberOf(req), parseId(req.params.shootDayId, "Shoot day"), patch) });
      },
    },
    {
      method: "delete",
      path: `${C}/shoot-days/:shootDayId`,
      access: shootW,
      body: "none",
      handler: async (req, res) => {
        await shoot.deleteShootDay(ctx, memberOf(req), parseId(req.params.shootDayId, "Shoot day"));
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: `${C}/episodes/:episodeId/shots`,
      access: shootR,
      handler: async (req, res) => {
        res.json({ shots: await shoot.listShots(ctx, memberOf(req), parseId(req.params.episodeId, "Episode")) });
      },
    },
    {
      method: "post",
      path: `${C}/episodes/:episodeId/shots`,
      access: shootW,
      handler: async (req, res) => {
        const body = parseBody(shotSchema, req.body);
        res.status(201).json({ shot: await shoot.createShot(ctx, memberOf(req), parseId(req.params.episodeId, "Episode"), body) });
      },
    },
    {
      method: "patch",
      path: `${C}/shots/:shotId`,
      access: shootW,
      handler: async (req, res) => {
        const patch = parseBody(shotPatchSchema, req.body);
        if (Object.keys(patch).length === 0) throw new AppError("validation_failed", "Change at least one thing.");
        res.json({ shot: await shoot.updateShot(ctx, memberOf(req), parseId(req.params.shotId, "Shot"), patch) });
      },
    },
    {
      method: "delete",
      path: `${C}/shots/:shotId`,
      access: shootW,
      body: "none",
      handler: async (req, res) => {
        await shoot.deleteShot(ctx, memberOf(req), parseId(req.params.shotId, "Shot"));
        res.status(204).end();
      },
    },
  ];
}
