import type { Server } from "node:http";
import { createApp } from "./app";
import { connectDatabase } from "./db/client";
import { readEnv, type Env } from "./env";
import { startJobs } from "./jobs/queue";
import { createMailer } from "./mail/mailer";
import { scheduleRushesJobs } from "./rushes/rushes.jobs";
import { scheduleSponsorJobs } from "./sponsors/reminders";
import { createS3Storage, storageSettingsFrom } from "./storage/storage";

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

export async function startServer(env: Env = readEnv()): Promise<RunningServer> {
  const database = connectDatabase(env.DATABASE_URL);
  const mailer = createMailer(env);
  const jobs = await startJobs({ databaseUrl: env.DATABASE_URL, mailer, runWorkers: true });
  const storage = createS3Storage(storageSettingsFrom(env));
  await scheduleRushesJobs(jobs.boss, { db: database.db, storage });
  await scheduleSponsorJobs(jobs.boss, { db: database.db, pool: database.pool, jobs, appUrl: env.APP_URL });
  const app = createApp({ env, database, mailer, jobs, storage });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(env.PORT, env.HOST, () => resolve(listening));
  });
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : env.PORT;
  return {
    url: `http://${env.HOST}:${port}`,
    async stop() {
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
      await jobs.stop();
      mailer.close();
      await database.close();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const running = await startServer();
  console.log(`Kerf is serving ${running.url}`);
  const stop = () => void running.stop().then(() => process.exit(0));
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}
