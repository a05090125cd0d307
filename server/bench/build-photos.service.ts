import { randomUUID } from "node:crypto";
import type { Request, Response } from "express";
import { type BuildPhotoView, MAX_PHOTOS_PER_ITERATION } from "../../shared/bench/schemas";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import type { Database } from "../db/client";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { receiveStill } from "../storage/photo-stream";
import { type Storage, viaStorage } from "../storage/storage";
import { type BuildPhotoRow, countPhotos, deletePhoto, insertPhoto, iterationOfEpisode, listPhotos } from "./build-photos.repository";

/** Keys are Kerf's, never the file's: channel/episode/uuid, as every stored object. */
const photoKey = (channelId: string, episodeId: string) => `${channelId}/${episodeId}/${randomUUID()}`;

async function photoView(storage: Storage, row: BuildPhotoRow): Promise<BuildPhotoView> {
  const url = await viaStorage(() => storage.presignGet(row.objectKey, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: row.contentType }));
  return { id: row.id, iterationId: row.iterationId, fileName: row.fileName, contentType: row.contentType, size: row.sizeBytes, url, createdAt: row.createdAt.toISOString() };
}

/** The episode's build photos, each with a short-lived link. */
export async function buildPhotos(db: Database, storage: Storage, channelId: string, episodeId: string): Promise<BuildPhotoView[]> {
  const rows = await listPhotos(db, channelId, episodeId);
  return Promise.all(rows.map((row) => photoView(storage, row)));
}

/** A photo of an iteration, streamed into storage; its row is written only once the store has every byte. */
export async function addPhoto(db: Database, storage: Storage, caller: Caller, episodeId: string, iterationId: string, req: Request, res: Response) {
  const { channelId } = caller;
  if (!(await iterationOfEpisode(db, channelId, episodeId, iterationId))) throw notFound("Iteration");
  if ((await countPhotos(db, channelId, iterationId)) >= MAX_PHOTOS_PER_ITERATION) {
    throw new AppError("conflict", `An iteration keeps at most ${MAX_PHOTOS_PER_ITERATION} photos; remove one first.`);
  }
  const { file } = await receiveStill(req, res, storage, () => photoKey(channelId, episodeId));
  try {
    const row = await db.transaction(async (tx) => {
      // Counted again under the insert's transaction, so two uploads at once can't pass the limit together.
      if ((await countPhotos(tx, channelId, iterationId)) >= MAX_PHOTOS_PER_ITERATION) {
        throw new AppError("conflict", `An iteration keeps at most ${MAX_PHOTOS_PER_ITERATION} photos; remove one first.`);
      }
      return insertPhoto(tx, { channelId, episodeId, iterationId, objectKey: file.key, fileName: file.fileName, contentType: file.contentType, sizeBytes: file.size, uploadedBy: caller.userId });
    });
    return await photoView(storage, row);
  } catch (error) {
    // Nothing of a refused photo stays in storage.
    await storage.remove(file.key).catch(() => undefined);
    throw error;
  }
}

/** Removes the photo's row and its object together: a store that is down leaves both as they were (503). */
export async function removePhoto(db: Database, storage: Storage, channelId: string, episodeId: string, photoId: string) {
  await db.transaction(async (tx) => {
    const row = await deletePhoto(tx, channelId, episodeId, photoId);
    if (!row) throw notFound("Photo");
    await viaStorage(() => storage.remove(row.objectKey));
  });
}
