import { and, asc, eq, inArray } from "drizzle-orm";
import { clips } from "../db/schema/rushes";
import type { Db } from "./deals.repository";

// The cut a sponsor reviews is a clip of the episode's footage (the rushes feature's table), read here
// by id and always within the channel.

export async function findCutClips(db: Db, channelId: string, clipIds: string[]) {
  if (clipIds.length === 0) return [];
  return db
    .select({ id: clips.id, fileName: clips.fileName, durationMs: clips.durationMs, objectKey: clips.objectKey, contentType: clips.contentType, episodeId: clips.episodeId })
    .from(clips)
    .where(and(eq(clips.channelId, channelId), inArray(clips.id, clipIds)));
}

export async function listEpisodeClips(db: Db, channelId: string, episodeIds: string[]) {
  if (episodeIds.length === 0) return [];
  return db
    .select({ id: clips.id, fileName: clips.fileName, episodeId: clips.episodeId })
    .from(clips)
    .where(and(eq(clips.channelId, channelId), inArray(clips.episodeId, episodeIds)))
    .orderBy(asc(clips.fileName))
    .limit(200);
}
