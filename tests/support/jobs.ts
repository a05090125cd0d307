import type pg from "pg";
import { expect } from "vitest";
import { MAIL_QUEUE } from "../../server/jobs/queue";

/**
 * What pg-boss has recorded about jobs, read from its own tables (pgboss.job, and pgboss.archive once
 * a finished job has been moved there). Tests wait on these states instead of sleeping: "nothing
 * happened" is only worth asserting once the job that could have done it has finished.
 */
export type JobState = "created" | "retry" | "active" | "completed" | "cancelled" | "failed";

export interface JobRecord {
  id: string;
  state: JobState;
}

const FINISHED: JobState[] = ["completed", "failed", "cancelled"];

async function jobsWhere(pool: pg.Pool, condition: string, values: unknown[]): Promise<JobRecord[]> {
  const columns = "id::text, state::text, created_on";
  const { rows } = await pool.query<JobRecord>(
    `select id, state from (select ${columns} from pgboss.job where ${condition} union all select ${columns} from pgboss.archive where ${condition}) jobs order by created_on, id`,
    values,
  );
  return rows;
}

/** Every mail job addressed to `address`, oldest first. */
export function mailJobsTo(pool: pg.Pool, address: string): Promise<JobRecord[]> {
  return jobsWhere(pool, "name = $1 and lower(data->>'to') = lower($2)", [MAIL_QUEUE, address]);
}

/** The recorded state of each job, in the order asked ("missing" for an id pg-boss doesn't hold). */
export async function jobStates(pool: pg.Pool, ids: string[]): Promise<(JobState | "missing")[]> {
  const found = new Map((await jobsWhere(pool, "id = any($1::uuid[])", [ids])).map((job) => [job.id, job.state]));
  return ids.map((id) => found.get(id) ?? "missing");
}

/** Waits until pg-boss records each job in one of `states` (by default: finished, one way or another). */
export async function waitForJobStates(pool: pg.Pool, ids: string[], states: JobState[] = FINISHED, timeoutMs = 30_000): Promise<(JobState | "missing")[]> {
  await expect
    .poll(() => jobStates(pool, ids), { timeout: timeoutMs, interval: 200, message: `jobs ${ids.join(", ")} reaching ${states.join(" or ")}` })
    .toSatisfy((found: (JobState | "missing")[]) => found.every((state) => (states as string[]).includes(state)));
  return jobStates(pool, ids);
}

/** Waits until every job of the queue has finished: after this, no job of it can still send or write anything. */
export async function waitForQueueToSettle(pool: pg.Pool, queue: string = MAIL_QUEUE, timeoutMs = 30_000): Promise<JobRecord[]> {
  const jobs = () => jobsWhere(pool, "name = $1", [queue]);
  await expect
    .poll(async () => (await jobs()).filter((job) => !FINISHED.includes(job.state)), { timeout: timeoutMs, interval: 200, message: `unfinished ${queue} jobs` })
    .toEqual([]);
  return jobs();
}
