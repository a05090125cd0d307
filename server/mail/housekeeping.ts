import type PgBoss from "pg-boss";
import type { Database } from "../db/client";
import { LONGEST_WINDOW_MS } from "./quotas";
import { deleteUsesBefore } from "./quotas.repository";
import { makeQueue } from "../jobs/make-queue";

export const MAIL_HOUSEKEEPING_QUEUE = "mail-housekeeping";
const MAIL_HOUSEKEEPING_CRON = "41 * * * *";

/** Every hour, forgets counted sends that no allowance's window reaches any more. Runs once an hour however many instances there are. */
export async function scheduleMailHousekeeping(boss: PgBoss, db: Database): Promise<void> {
  await makeQueue(boss, MAIL_HOUSEKEEPING_QUEUE);
  await boss.schedule(MAIL_HOUSEKEEPING_QUEUE, MAIL_HOUSEKEEPING_CRON, {}, { tz: "UTC" });
  await boss.work(MAIL_HOUSEKEEPING_QUEUE, { batchSize: 1 }, async () => ({ forgotten: await deleteUsesBefore(db, new Date(Date.now() - LONGEST_WINDOW_MS)) }));
}
