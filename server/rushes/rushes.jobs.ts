import type PgBoss from "pg-boss";
import type { RushesContext } from "./rushes.context";
import { CLIP_MEDIA_GIVEN_UP_QUEUE, CLIP_MEDIA_QUEUE, MEDIA_WORKERS, makeClipMedia, settleGivenUpMedia, type ClipMediaJob } from "./media.service";
import { sweepAbandonedUploads } from "./uploads.service";
import { makeQueue } from "../jobs/make-queue";
import type { Jobs } from "../jobs/queue";

/**
 * Uploads nobody finished: every hour a job aborts those with no part recorded for a day in storage
 * (Swift and many stores have no lifecycle rule to do it) and marks them abandoned. Its counts are the
 * job's output. pg-boss's schedule is a row, so with several app instances it still runs once an hour.
 */
export const ABANDONED_UPLOADS_QUEUE = "rushes-abandoned-uploads";
export const ABANDONED_UPLOADS_CRON = "17 * * * *";

export async function scheduleRushesJobs(boss: PgBoss, ctx: Pick<RushesContext, "db" | "storage">, options: { pollSeconds?: number } = {}): Promise<void> {
  await makeQueue(boss, ABANDONED_UPLOADS_QUEUE);
  await boss.schedule(ABANDONED_UPLOADS_QUEUE, ABANDONED_UPLOADS_CRON, {}, { tz: "UTC" });
  // The sweep's tally (abandoned, deferred, which failed and why) becomes the job's output, where an operator can read it.
  await boss.work(ABANDONED_UPLOADS_QUEUE, { batchSize: 1, pollingIntervalSeconds: options.pollSeconds ?? 2 }, async () => {
    const swept = await sweepAbandonedUploads(ctx);
    if (swept.abandoned > 0) console.log(`[rushes] ${swept.abandoned} abandoned upload(s) aborted`);
    if (swept.deferred > 0) console.error(`[rushes] ${swept.deferred} abandoned upload(s) left for the next sweep`);
    return swept;
  });
}

/**
 * The clip media workers of this instance: MEDIA_WORKERS jobs at a time, one each, taken by priority
 * (each channel's n-th waiting clip before any channel's (n+1)-th), so one channel's card of big files
 * takes turns with everyone else's. What a job made (or why it was skipped) is its output; a failure
 * is the job's failure, recorded by pg-boss, and the clip says why. One more worker settles the jobs
 * pg-boss gave up on (`settleGivenUpMedia`), so a restart in the middle of a run never leaves a clip
 * "making" for good.
 */
export async function startClipMediaWorkers(boss: PgBoss, ctx: RushesContext & { jobs: Pick<Jobs, "enqueue" | "countLive"> }, options: { pollSeconds?: number; workers?: number } = {}): Promise<void> {
  const polling = { batchSize: 1, pollingIntervalSeconds: options.pollSeconds ?? 2 };
  await makeQueue(boss, CLIP_MEDIA_QUEUE);
  await makeQueue(boss, CLIP_MEDIA_GIVEN_UP_QUEUE);
  for (let n = 0; n < (options.workers ?? MEDIA_WORKERS); n++) {
    await boss.work<ClipMediaJob>(CLIP_MEDIA_QUEUE, polling, async ([job]) => makeClipMedia(ctx, job!.data));
  }
  await boss.work<ClipMediaJob>(CLIP_MEDIA_GIVEN_UP_QUEUE, polling, async ([job]) => settleGivenUpMedia(ctx, job!.data));
}
