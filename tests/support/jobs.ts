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

/** A job with what it carries and what it recorded when it finished. */
export interface JobRow extends JobRecord {
  data: { kind?: string; fairKey?: string; data?: Record<string, unknown> } & Record<string, unknown>;
  output: Record<string, unknown> | null;
  priority: number;
  completed_on: Date | null;
}

const FINISHED: JobState[] = ["completed", "failed", "cancelled"];

async function jobsWhere<T extends JobRecord = JobRecord>(pool: pg.Pool, condition: string, values: unknown[], columns: string[] = []): Promise<T[]> {
  const all = ["id::text", "state::text", "created_on", ...columns].join(", ");
  const { rows } = await pool.query<T>(
    `select * from (select ${all} from pgboss.job where ${condition} union all select ${all} from pgboss.archive where ${condition}) jobs order by created_on, id`,
    values,
  );
  return rows;
}

const JOB_ROW = ["data", "output", "priority", "completed_on"];

/**
 * Every mail job addressed to `address`, oldest first. A queued mail names what to send, not its
 * recipient (server/mail/mail-jobs.ts), so the address is read through the row each kind names.
 */
export function mailJobsTo(pool: pg.Pool, address: string): Promise<JobRecord[]> {
  const to = `name = $1 and (
    lower(data->>'to') = lower($2)
    or (data->>'kind' in ('password-reset', 'address-change') and lower(data->'data'->>'email') = lower($2))
    or (data->>'kind' in ('member', 'verification') and data->'data'->>'userId' in (select id::text from users where lower(email) = lower($2)))
    or (data->>'kind' = 'invitation' and data->'data'->>'invitationId' in (select id::text from invitations where lower(email) = lower($2)))
    or (data->>'kind' = 'review-link' and data->'data'->>'linkId' in (select id::text from review_links where lower(contact_email) = lower($2)))
    or (data->>'kind' = 'sponsor-invoice' and data->'data'->>'invoiceId' in (select i.id::text from deal_invoices i join deals d on d.id = i.deal_id join sponsor_contacts c on c.id = d.contact_id where lower(c.email) = lower($2)))
    or (data->>'kind' in ('intake-confirm', 'intake-news') and data->'data'->>'contactId' in (select id::text from intake_contacts where lower(email) = lower($2)))
  )`;
  return jobsWhere(pool, to, [MAIL_QUEUE, address]);
}

/** The jobs of one pg-boss queue with their data and output, oldest first. */
export function jobsIn(pool: pg.Pool, queue: string): Promise<JobRow[]> {
  return jobsWhere<JobRow>(pool, "name = $1", [queue], JOB_ROW);
}

/** Waits until at least `count` jobs of the queue that `matches` have settled (completed or failed), and returns them. */
export async function settledJobs(pool: pg.Pool, queue: string, matches: (job: JobRow) => boolean, count: number, timeoutMs = 30_000): Promise<JobRow[]> {
  const settled = async () => (await jobsIn(pool, queue)).filter((job) => matches(job) && ["completed", "failed"].includes(job.state));
  await expect.poll(async () => (await settled()).length, { timeout: timeoutMs, interval: 100, message: `${count} settled ${queue} jobs` }).toBeGreaterThanOrEqual(count);
  return settled();
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

/**
 * Makes the retries these jobs are waiting for due now, as pg-boss's own clock would once their backoff
 * (mail: 10 s, then 20 s, …) has passed: a test that brought a service back waits on the retry's
 * outcome, not on its timer. A job not waiting for a retry is left as it is.
 */
export async function retryNow(pool: pg.Pool, ids: string[]): Promise<void> {
  await pool.query("update pgboss.job set start_after = now() where id = any($1::uuid[]) and state = 'retry'", [ids]);
}

/** Waits until every job of the queue has finished: after this, no job of it can still send or write anything. */
export async function waitForQueueToSettle(pool: pg.Pool, queue: string = MAIL_QUEUE, timeoutMs = 30_000): Promise<JobRecord[]> {
  const jobs = () => jobsWhere(pool, "name = $1", [queue]);
  await expect
    .poll(async () => (await jobs()).filter((job) => !FINISHED.includes(job.state)), { timeout: timeoutMs, interval: 200, message: `unfinished ${queue} jobs` })
    .toEqual([]);
  return jobs();
}
