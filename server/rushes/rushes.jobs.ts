import type PgBoss from "pg-boss";
import type { RushesContext } from "./rushes.context";
import { sweepAbandonedUploads } from "./uploads.service";

/**
 * Uploads nobody finished: every hour a job aborts (best effort) and marks those with no part recorded
 * for a day. pg-boss's schedule is a row, so with several app instances it still runs once an hour.
 */
export const ABANDONED_UPLOADS_QUEUE = "rushes-abandoned-uploads";
export const ABANDONED_UPLOADS_CRON = "17 * * * *";

export async function scheduleRushesJobs(boss: PgBoss, ctx: RushesContext): Promise<void> {
  await boss.createQueue(ABANDONED_UPLOADS_QUEUE);
  await boss.schedule(ABANDONED_UPLOADS_QUEUE, ABANDONED_UPLOADS_CRON, {}, { tz: "UTC" });
  await boss.work(ABANDONED_UPLOADS_QUEUE, { batchSize: 1 }, async () => {
    const { abandoned } = await sweepAbandonedUploads(ctx);
    if (abandoned > 0) console.log(`[rushes] ${abandoned} abandoned upload(s) aborted`);
  });
}
