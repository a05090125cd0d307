import type PgBoss from "pg-boss";
import { type CardContext, makeCard, RESULTS_CARD_QUEUE, type ResultsCardJob } from "./results-card.service";
import { makeQueue } from "../jobs/make-queue";

/**
 * This instance's results-card worker: one card at a time (one Chromium page), each channel's n-th
 * waiting card before any channel's (n+1)-th. What it made is the job's output; a failure is the
 * job's failure and the card says so.
 */
export async function startResultsCardWorker(boss: PgBoss, ctx: CardContext, options: { pollSeconds?: number } = {}): Promise<void> {
  await makeQueue(boss, RESULTS_CARD_QUEUE);
  const polling = { batchSize: 1, pollingIntervalSeconds: options.pollSeconds ?? 2, includeMetadata: true as const };
  await boss.work<ResultsCardJob>(RESULTS_CARD_QUEUE, polling, async ([job]) => makeCard(ctx, job!.data, job!.retryCount));
}
