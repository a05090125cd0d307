import type { Database } from "../db/client";

/**
 * The publish-date seam: a feature whose dates count from an episode's target publish date (sponsor
 * deliverables) exports a `PublishDateFollower`; server/app.ts hands the list to the slate, which
 * calls each after an edit moves the date.
 */
export interface PublishDateFollower {
  name: string;
  follow(db: Database, change: { channelId: string; episodeId: string; actorId: string }): Promise<unknown>;
}
