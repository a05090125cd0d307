import type { Database } from "../db/client";
import type { GoLiveFollower, PublishSource } from "../seams/publish-sources";
import type { Storage } from "../storage/storage";

/** What the publish feature's services need: the database, storage, and what other features plug in. */
export interface PublishContext {
  db: Database;
  storage: Storage;
  sources: readonly PublishSource[];
  goLiveFollowers: readonly GoLiveFollower[];
}
