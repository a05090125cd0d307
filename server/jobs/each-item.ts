/** What a background job's pass over many items did, recorded as the job's output (pgboss.job.output). */
export interface ItemTally {
  failed: number;
  /** The first few failures, for an operator: which item, and what went wrong. */
  failures: { item: string; error: string }[];
}

const FAILURES_KEPT = 20;

export const emptyTally = (): ItemTally => ({ failed: 0, failures: [] });

export function mergeTallies(a: ItemTally, b: ItemTally): ItemTally {
  return { failed: a.failed + b.failed, failures: [...a.failures, ...b.failures].slice(0, FAILURES_KEPT) };
}

/**
 * Runs `work` on each item in turn. One that throws is logged and counted, and the rest still run:
 * one channel's broken row must never cost every other channel its turn.
 */
export async function eachItem<T>(
  job: string,
  items: Iterable<T>,
  name: (item: T) => string,
  work: (item: T) => Promise<void>,
): Promise<ItemTally & { failedItems: T[] }> {
  const tally = { ...emptyTally(), failedItems: [] as T[] };
  for (const item of items) {
    try {
      await work(item);
    } catch (error) {
      const message = reasonOf(error);
      console.error(`[${job}] ${name(item)} failed, the others go on: ${message}`);
      tally.failed++;
      tally.failedItems.push(item);
      if (tally.failures.length < FAILURES_KEPT) tally.failures.push({ item: name(item), error: message });
    }
  }
  return tally;
}

/** The innermost reason: Drizzle wraps the database's own message (the useful part) in its query text. */
function reasonOf(error: unknown): string {
  let reason = error;
  while (reason instanceof Error && reason.cause instanceof Error) reason = reason.cause;
  return reason instanceof Error ? reason.message : String(reason);
}
