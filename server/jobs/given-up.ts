import type { Database } from "../db/client";
import { inTransaction, type SqlExecutor } from "../db/transaction";
import type { Jobs } from "./queue";

export type LeftAlone = { outcome: "skipped"; reason: string };

export interface GivenUpRow<S, T> {
  /** What the row is called in the reasons ("clip", "card", "report"). */
  noun: string;
  /** The queue of the jobs that work on the row, and the job data's key and value that name it. */
  queue: string;
  key: string;
  value: string;
  /** The row's state, held until the transaction ends; null when the row is gone. */
  lock(tx: Database): Promise<S | null>;
  /** The states a run that never finished leaves the row in. */
  unfinished: readonly S[];
  /** What becomes of the row, under the same hold. */
  settle(tx: Database, sql: SqlExecutor): Promise<T>;
}

/**
 * A job pg-boss gave up on (its dead-letter copy): the row it worked on is held; one a run finished
 * (or failed, saying why) or that is gone is left alone, as is one a newer job of its own still has
 * (a retry or a request since, which held the row while it queued); otherwise it is settled.
 */
export function settleGivenUp<S, T>(db: Database, jobs: Pick<Jobs, "countLive">, row: GivenUpRow<S, T>): Promise<T | LeftAlone> {
  return inTransaction(db, async (tx, sql) => {
    const state = await row.lock(tx);
    if (state === null || !row.unfinished.includes(state)) return { outcome: "skipped", reason: `a run settled the ${row.noun}, or it is gone` };
    if ((await jobs.countLive(row.queue, row.key, row.value, { db: sql })) > 0) return { outcome: "skipped", reason: `another job has the ${row.noun}` };
    return row.settle(tx, sql);
  });
}
