import type { Queryable } from "../db/client";

/**
 * The publish-date seam: a feature whose dates count from an episode's target publish date (sponsor
 * deliverables) exports a `PublishDateFollower`; server/app.ts hands the list to the slate, which
 * calls each inside the transaction of the edit that moves the date: a follower that fails undoes the edit.
 */
export interface PublishDateFollower {
  name: string;
  follow(db: Queryable, change: { channelId: string; episodeId: string; actorId: string }): Promise<unknown>;
}
