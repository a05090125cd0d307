import { randomUUID } from "node:crypto";
import type { Request, Response } from "express";
import { imageSize } from "image-size";
import type { ThumbnailView } from "../../shared/publish/schemas";
import { checkThumbnailFile, THUMBNAIL_UPLOAD_MAX_BYTES, thumbnailProblems } from "../../shared/publish/thumbnail";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import type { Queryable } from "../db/client";
import { notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { receiveStill } from "../storage/photo-stream";
import { type Storage, viaStorage } from "../storage/storage";
import { clearThumbnailChoice } from "./package.repository";
import type { PublishContext } from "./publish.context";
import { deleteThumbnail, insertThumbnail, listThumbnails, type ThumbnailRow } from "./thumbnails.repository";

/** JPEG keeps its size in a frame header after any metadata; 256 KiB covers the metadata cameras and editors write (common practice). */
const HEAD_BYTES = 256 * 1024;

const thumbnailKey = (channelId: string, episodeId: string) => `${channelId}/${episodeId}/thumbnails/${randomUUID()}`;

/** Width and height from the file's own header; null when it can't be read. */
function dimensionsOf(head: Buffer): { width: number | null; height: number | null } {
  try {
    const size = imageSize(head);
    return { width: size.width ?? null, height: size.height ?? null };
  } catch {
    return { width: null, height: null };
  }
}

const factsOf = (row: ThumbnailRow) => ({ width: row.width, height: row.height, sizeBytes: row.sizeBytes, contentType: row.contentType });
export const problemsOf = (row: ThumbnailRow) => thumbnailProblems(factsOf(row));

async function thumbnailView(storage: Storage, row: ThumbnailRow): Promise<ThumbnailView> {
  const url = await viaStorage(() => storage.presignGet(row.objectKey, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: row.contentType }));
  return { id: row.id, fileName: row.fileName, contentType: row.contentType, size: row.sizeBytes, width: row.width, height: row.height, url, problems: problemsOf(row) };
}

export async function thumbnailViews(ctx: PublishContext, db: Queryable, channelId: string, episodeId: string) {
  const rows = await listThumbnails(db, channelId, episodeId);
  return { rows, views: await Promise.all(rows.map((row) => thumbnailView(ctx.storage, row))) };
}

/** A candidate picture streamed into storage; its row is written once the store has every byte. */
export async function addThumbnail(ctx: PublishContext, caller: Caller, episodeId: string, req: Request, res: Response): Promise<ThumbnailView> {
  const { channelId } = caller;
  const rules = { check: checkThumbnailFile, maxBytes: THUMBNAIL_UPLOAD_MAX_BYTES, keepHead: HEAD_BYTES };
  const { file } = await receiveStill(req, res, ctx.storage, () => thumbnailKey(channelId, episodeId), rules);
  try {
    const row = await insertThumbnail(ctx.db, {
      channelId,
      episodeId,
      objectKey: file.key,
      fileName: file.fileName,
      contentType: file.contentType,
      sizeBytes: file.size,
      ...dimensionsOf(file.head),
      uploadedBy: caller.userId,
    });
    return await thumbnailView(ctx.storage, row);
  } catch (error) {
    // Nothing of a refused picture stays in storage.
    await ctx.storage.remove(file.key).catch(() => undefined);
    throw error;
  }
}

/** Removes the picture and its object together (a store that is down leaves both: 503); a chosen one is unchosen. */
export async function removeThumbnail(ctx: PublishContext, channelId: string, episodeId: string, thumbnailId: string) {
  await ctx.db.transaction(async (tx) => {
    const row = await deleteThumbnail(tx, channelId, episodeId, thumbnailId);
    if (!row) throw notFound("Thumbnail");
    await clearThumbnailChoice(tx, channelId, thumbnailId);
    await viaStorage(() => ctx.storage.remove(row.objectKey));
  });
}
