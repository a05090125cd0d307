import type pg from "pg";
import { expect } from "vitest";

export interface JobRow {
  id: string;
  state: string;
  data: { kind?: string; fairKey?: string; data?: Record<string, unknown> } & Record<string, unknown>;
  output: Record<string, unknown> | null;
  priority: number;
  completed_on: Date | null;
}

/** The jobs of one pg-boss queue, oldest first (the recorded state a test waits on, never a clock). */
export async function jobsIn(pool: pg.Pool, queue: string): Promise<JobRow[]> {
  const result = await pool.query<JobRow>("select id, state, data, output, priority, completed_on from pgboss.job where name = $1 order by created_on, id", [queue]);
  return result.rows;
}

/** Waits until every job of the queue that `matches` has settled (completed or failed), and returns them. */
export async function settledJobs(pool: pg.Pool, queue: string, matches: (job: JobRow) => boolean, count: number, timeoutMs = 30_000): Promise<JobRow[]> {
  const settled = async () => (await jobsIn(pool, queue)).filter((job) => matches(job) && ["completed", "failed"].includes(job.state));
  await expect.poll(async () => (await settled()).length, { timeout: timeoutMs, interval: 100 }).toBeGreaterThanOrEqual(count);
  return settled();
}
