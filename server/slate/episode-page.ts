import type { Request } from "express";
import { partForStage } from "../../shared/slate/episode-parts";
import { isUuid } from "../../shared/http/ids";
import type { Database } from "../db/client";
import { rolesReadWithSession } from "../http/session";
import { stageOf } from "./episodes.repository";

/**
 * The part an episode's address without one opens on (its stage's), so the page can bring that part's
 * code and answers with it; null unless the visitor's session holds a role in the episode's channel,
 * so the page tells no one else anything about the episode.
 */
export function episodeOpeningPart(db: Database) {
  return async (req: Request): Promise<string | null> => {
    const { channelId, episodeId } = req.params as Record<string, string | undefined>;
    if (!isUuid(channelId) || !isUuid(episodeId) || !rolesReadWithSession(req)?.[channelId]) return null;
    const stage = await stageOf(db, channelId, episodeId);
    return stage ? partForStage[stage] : null;
  };
}
