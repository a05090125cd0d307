import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import type { Storage } from "../storage/storage";
import { addPhoto, buildPhotos, removePhoto } from "./build-photos.service";

const episode = "/api/channels/:channelId/episodes/:episodeId";

/** Photos of the build log's iterations: written and read as the build log is (the spec's "bench" row). */
export function buildPhotoRoutes(db: Database, storage: Storage): RouteSpec[] {
  const read = channelAccess("bench", "R");
  const write = channelAccess("bench", "W");
  return [
    {
      method: "get",
      path: `${episode}/build-photos`,
      access: read,
      handler: async (req, res) => res.json({ photos: await buildPhotos(db, storage, callerOf(req).channelId, idOf(req, "episodeId")) }),
    },
    {
      method: "post",
      path: `${episode}/build-log/:iterationId/photos`,
      access: write,
      body: "multipart",
      handler: async (req, res) => {
        res.status(201).json({ photo: await addPhoto(db, storage, callerOf(req), idOf(req, "episodeId"), idOf(req, "iterationId"), req, res) });
      },
    },
    {
      method: "delete",
      path: `${episode}/build-photos/:photoId`,
      access: write,
      handler: async (req, res) => {
        await removePhoto(db, storage, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "photoId"));
        res.status(204).end();
      },
    },
  ];
}
