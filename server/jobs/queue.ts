import PgBoss from "pg-boss";
import type { Mailer, OutgoingMail } from "../mail/mailer";

/**
 * Work that must survive a restart or an outage (mail first) goes through pg-boss on the same
 * PostgreSQL: a job is a row, so a mail server that is down delays mail and loses none, and any
 * number of app instances may run workers without a job being taken twice.
 */
export const MAIL_QUEUE = "mail";

export interface Jobs {
  boss: PgBoss;
  /** `db` sends the job inside the caller's transaction (pg-boss's executor), so it exists only if that commits. */
  enqueueMail(mail: OutgoingMail, options?: { db?: PgBoss.Db }): Promise<void>;
  stop(): Promise<void>;
}

export async function startJobs(options: { databaseUrl: string; mailer: Mailer; runWorkers: boolean; pollSeconds?: number }): Promise<Jobs> {
  const boss = new PgBoss({ connectionString: options.databaseUrl, schema: "pgboss", max: 4 });
  boss.on("error", (error: Error) => console.error(`[jobs] ${error.message}`));
  await boss.start();
  await boss.createQueue(MAIL_QUEUE);
  if (options.runWorkers) {
    await boss.work<OutgoingMail>(MAIL_QUEUE, { pollingIntervalSeconds: options.pollSeconds ?? 2, batchSize: 1 }, async (jobs) => {
      // One job a batch: a failure retries only the mail that failed, never one already sent.
      for (const job of jobs) await options.mailer.send(job.data);
    });
  }
  return {
    boss,
    async enqueueMail(mail, sendOptions) {
      // Retries back off from 10 s, for about a day in all: long enough to outlast a mail outage.
      await boss.send(MAIL_QUEUE, mail, { retryLimit: 14, retryDelay: 10, retryBackoff: true, db: sendOptions?.db });
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 5_000 });
    },
  };
}
