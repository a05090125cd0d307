import type { Database } from "../db/client";
import type { Storage } from "../storage/storage";

/** What every rushes service works with: the database and the object store. */
export interface RushesContext {
  db: Database;
  storage: Storage;
}
