import PgBoss from "pg-boss";
import type { SqlExecutor } from "../db/transaction";
import type { MailJob, MailRenderers } from "../mail/mail-jobs";
import type { Mailer, OutgoingMail } from "../mail/mailer";
import { makeQueue } from "./make-queue";

/**
 * Work that must survive a restart or an outage (mail first) goes through pg-boss on the same
 * PostgreSQL: a job is a row, so a mail server that is down delays mail and loses none, and any
 * number of app instances may run workers without a job being taken twice.
 */
export const MAIL_QUEUE = "mail";
const BOSS_SCHEMA = "pgboss";
/** Mail jobs one fetch takes; each is sent, completed or failed on its own. */
const MAIL_BATCH = 10;

/** How a feature's queued job is retried and how long one run may take before pg-boss gives up on it. */
export interface QueueOptions {
  retryLimit: number;
  expireInSeconds: number;
  /**
   * A queue that gets a copy of the job (its data, and the failure as output) once pg-boss gives up
   * on it: its last try failed, ran past its time, or was running when its process stopped.
   */
  deadLetter?: string;
}

export interface Jobs {
  boss: PgBoss;
  /** `db` sends the job inside the caller's transaction (pg-boss's executor), so it exists only if that commits. */
  enqueueMail(job: MailJob, options?: { db?: SqlExecutor }): Promise<void>;
  /**
   * Queues a feature's job, its channel taking turns with others: the job's priority is minus the
   * number of that channel's jobs of the queue already waiting (as mail's is). The queue is made on
   * first use; `db` sends it inside the caller's transaction.
   */
  enqueue(queue: string, data: { channelId: string } & Record<string, unknown>, options: QueueOptions & { db?: SqlExecutor }): Promise<void>;
  /** How many of the queue's jobs whose data has `key` set to `value` are still to run or running; `db` reads inside the caller's transaction. */
  countLive(queue: string, key: string, value: string, options?: { db?: SqlExecutor }): Promise<number>;
  /** Starts this instance's mail worker; the renderers build each mail when its job runs. */
  startMailWorker(renderers: MailRenderers): Promise<void>;
  stop(): Promise<void>;
}

/** What a finished mail job records as its output (pgboss.job.output), for tests and operators. */
export type MailOutcome = { outcome: "sent" } | { outcome: "skipped"; reason: string } | { outcome: "passed on"; mails: number };

/**
 * How many of the queue's jobs whose data has `key` set to `value` are in a state before `before`
 * (pg-boss's states are ordered: created, retry, active, completed, cancelled, failed).
 */
async function countJobs(db: SqlExecutor, queue: string, before: "active" | "completed", key: string, value: string): Promise<number> {
  const { rows } = await db.executeSql(`select count(*)::int as n from ${BOSS_SCHEMA}.job where name = $1 and state < '${before}' and data->>$2 = $3`, [queue, key, value]);
  return (rows[0] as { n: number } | undefined)?.n ?? 0;
}

export async function startJobs(options: { databaseUrl: string; mailer: Mailer; pollSeconds?: number }): Promise<Jobs> {
  const boss = new PgBoss({ connectionString: options.databaseUrl, schema: BOSS_SCHEMA, max: 4 });
  boss.on("error", (error: Error) => console.error(`[jobs] ${error.message}`));
  await boss.start();
  await makeQueue(boss, MAIL_QUEUE);

  /**
   * Fair between channels: pg-boss hands out jobs by priority, then age. A mail's priority is minus
   * the number of mails its channel (or account) already has waiting, so the n-th waiting mail of
   * every channel goes before the (n+1)-th of any: one channel's burst of thirty invitations takes
   * turns with other channels' mail instead of standing in front of it.
   */
  async function enqueueMail(job: MailJob, sendOptions?: { db?: SqlExecutor }): Promise<void> {
    const db = sendOptions?.db ?? boss.getDb();
    const waiting = await countJobs(db, MAIL_QUEUE, "active", "fairKey", job.fairKey);
    // Retries back off from 10 s, for about a day in all: long enough to outlast a mail outage.
    await boss.send(MAIL_QUEUE, job as unknown as object, { priority: -waiting, retryLimit: 14, retryDelay: 10, retryBackoff: true, db });
  }

  const madeQueues = new Map<string, Promise<void>>();
  /** pg-boss takes jobs only for a queue it holds; made once per process, outside any caller's transaction. */
  function ensureQueue(queue: string): Promise<void> {
    let made = madeQueues.get(queue);
    if (!made) {
      made = makeQueue(boss, queue).catch((error: unknown) => {
        madeQueues.delete(queue);
        throw error;
      });
      madeQueues.set(queue, made);
    }
    return made;
  }

  async function enqueue(queue: string, data: { channelId: string } & Record<string, unknown>, sendOptions: QueueOptions & { db?: SqlExecutor }): Promise<void> {
    await ensureQueue(queue);
    if (sendOptions.deadLetter) await ensureQueue(sendOptions.deadLetter);
    const db = sendOptions.db ?? boss.getDb();
    const waiting = await countJobs(db, queue, "active", "channelId", data.channelId);
    const { retryLimit, expireInSeconds, deadLetter } = sendOptions;
    await boss.send(queue, data, { priority: -waiting, retryLimit, expireInSeconds, ...(deadLetter ? { deadLetter } : {}), db });
  }

  function countLive(queue: string, key: string, value: string, countOptions?: { db?: SqlExecutor }): Promise<number> {
    return countJobs(countOptions?.db ?? boss.getDb(), queue, "completed", key, value);
  }

  async function deliver(renderers: MailRenderers, job: MailJob | OutgoingMail): Promise<MailOutcome> {
    // A job queued before mail was rendered at send time carries its finished mail.
    if (!("kind" in job)) {
      await options.mailer.send(job);
      return { outcome: "sent" };
    }
    const render = renderers[job.kind];
    if (!render) throw new Error(`no renderer for mail of kind "${job.kind}"`);
    const plan = await render(job.data as never);
    if ("skip" in plan) return { outcome: "skipped", reason: plan.skip };
    if ("instead" in plan) {
      for (const next of plan.instead) await enqueueMail(next);
      return { outcome: "passed on", mails: plan.instead.length };
    }
    await options.mailer.send(plan.send);
    return { outcome: "sent" };
  }

  return {
    boss,
    enqueueMail,
    enqueue,
    countLive,
    async startMailWorker(renderers) {
      const work = { pollingIntervalSeconds: options.pollSeconds ?? 2, batchSize: MAIL_BATCH, includeMetadata: true as const };
      await boss.work<MailJob | OutgoingMail>(MAIL_QUEUE, work, async (jobs) => {
        // A batch arrives in no particular order: send it in the queue's (priority, then age).
        const inTurn = [...jobs].sort((a, b) => b.priority - a.priority || a.createdOn.getTime() - b.createdOn.getTime());
        // Each job settles on its own: a failure retries only the mail that failed, never one already sent.
        for (const job of inTurn) {
          try {
            await boss.complete(MAIL_QUEUE, job.id, await deliver(renderers, job.data));
          } catch (error) {
            console.error(`[mail] job ${job.id} failed: ${(error as Error).message}`);
            await boss.fail(MAIL_QUEUE, job.id, { message: (error as Error).message });
          }
        }
      });
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 5_000 });
    },
  };
}
