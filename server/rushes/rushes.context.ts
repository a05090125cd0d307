import type { Database } from "../db/client";
import type { Jobs } from "../jobs/queue";
import type { Storage } from "../storage/storage";

/** What every rushes service works with: the database, the object store, and the job queue. */
export interface RushesContext {
  db: Database;
  storage: Storage;
  jobs: Pick<Jobs, "enqueue">;
}
