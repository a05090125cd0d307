import type { FigureValues } from "../../shared/publish/figures";
import type { Queryable } from "../db/client";
import type { EpisodeRef } from "./publish-sources";

/**
 * What a feature may read of an episode's video once it is out (the sponsor's report): when and where
 * it went live, its description as published, and its figures by day. The publish feature provides it;
 * server/app.ts hands it to whoever needs it. Nothing here knows any feature.
 */
export interface PublishedVideo {
  publishedAt: string | null;
  liveOn: string | null;
  videoUrl: string | null;
  description: string;
  figures: { day: number; dueOn: string | null; values: FigureValues }[];
}

export interface PublishedVideoReader {
  read(db: Queryable, episode: EpisodeRef): Promise<PublishedVideo>;
}
