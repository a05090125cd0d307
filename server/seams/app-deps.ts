import type { DatabaseHandle } from "../db/client";
import type { Env } from "../env";
import type { Jobs } from "../jobs/queue";
import type { Mailer } from "../mail/mailer";
import type { Storage } from "../storage/storage";

/** What the composition root (server/app.ts) hands every feature's routes. */
export interface AppDeps {
  env: Env;
  database: DatabaseHandle;
  mailer: Mailer;
  jobs: Pick<Jobs, "enqueueMail" | "enqueue">;
  /** Object storage (S3 protocol): footage, posters, photos. */
  storage: Storage;
}
