import type { Request, Response } from "express";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import { notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { viaStorage } from "../storage/storage";
import { stillKey } from "./object-keys";
import type { RushesContext } from "./rushes.context";
import { receiveStill } from "../storage/photo-stream";
import * as repo from "./stills.repository";
import { episodeInChannel } from "./uploads.repository";

/** A photo streamed through the server into storage, for the channel or one of its episodes. */
export async function addStill(ctx: RushesContext, caller: Caller, episodeId: string | null, req: Request, res: Response) {
  if (episodeId && !(await episodeInChannel(ctx.db, caller.channelId, episodeId))) throw notFound("Episode");
  const { file } = await receiveStill(req, res, ctx.storage, () => stillKey(caller.channelId, episodeId));
  const still = await repo.insertStill(ctx.db, {
    channelId: caller.channelId,
    episodeId,
    objectKey: file.key,
    fileName: file.fileName,
    contentType: file.contentType,
    sizeBytes: file.size,
    uploadedBy: caller.userId,
  });
  return { id: still.id, fileName: still.fileName, contentType: still.contentType, size: still.sizeBytes, episodeId };
}

/** A photo with a short-lived link to it. */
export async function stillWithLink(ctx: RushesContext, caller: Caller, stillId: string) {
  const still = await repo.findStill(ctx.db, caller.channelId, stillId);
  if (!still) throw notFound("Photo");
  const url = await viaStorage(() => ctx.storage.presignGet(still.objectKey, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: still.contentType }));
  return { id: still.id, fileName: still.fileName, contentType: still.contentType, size: still.sizeBytes, url };
}
