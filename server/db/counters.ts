import { sql, type SQL } from "drizzle-orm";
import type { Queryable } from "./client";
import { counters } from "./schema/counters";

export type CounterScope = "bench_run" | "build_iteration" | "test_criterion" | "deliverable_position" | "shot_position" | "invoice_position";

/**
 * The next number of a numbering, race-free: an upsert on the counter's row, which holds that row's
 * lock until the caller's transaction ends, so call it inside the transaction that inserts the
 * numbered row. `atLeast` is the smallest number free by the rows themselves (e.g. `max(number) + 1`):
 * it starts a counter for rows numbered before it existed, and keeps it past rows written without it.
 */
export async function nextNumber(db: Queryable, counter: { scope: CounterScope; ownerId: string; channelId: string; atLeast: SQL }): Promise<number> {
  const [row] = await db
    .insert(counters)
    .values({ scope: counter.scope, ownerId: counter.ownerId, channelId: counter.channelId, last: sql`(${counter.atLeast})` })
    .onConflictDoUpdate({ target: [counters.scope, counters.ownerId], set: { last: sql`greatest(${counters.last} + 1, excluded.last)` } })
    .returning({ last: counters.last });
  return row!.last;
}
