import type PgBoss from "pg-boss";
import { type CardContext, makeCard, RESULTS_CARD_GIVEN_UP_QUEUE, RESULTS_CARD_QUEUE, type ResultsCardJob, settleGivenUpCard } from "./results-card.service";
import { makeQueue } from "../jobs/make-queue";
import type { Jobs } from "../jobs/queue";

/**
 * This instance's results-card worker: one card at a time (one Chromium page), each channel's n-th
 * waiting card before any channel's (n+1)-th. What it made is the job's output; a failure is the
 * job's failure and the card says so. A job pg-boss gave up on is settled (`settleGivenUpCard`), so
 * a card whose server stopped twice while drawing it does not stay drawing.
 */
export async function startResultsCardWorker(boss: PgBoss, ctx: CardContext & { jobs: Pick<Jobs, "countLive"> }, options: { pollSeconds?: number } = {}): Promise<void> {
  await makeQueue(boss, RESULTS_CARD_QUEUE);
  const polling = { batchSize: 1, pollingIntervalSeconds: options.pollSeconds ?? 2, includeMetadata: true as const };
  await boss.work<ResultsCardJob>(RESULTS_CARD_QUEUE, polling, async ([job]) => makeCard(ctx, job!.data, job!.retryCount));
  await makeQueue(boss, RESULTS_CARD_GIVEN_UP_QUEUE);
  await boss.work<ResultsCardJob>(RESULTS_CARD_GIVEN_UP_QUEUE, polling, async ([job]) => settleGivenUpCard(ctx, job!.data));
}
