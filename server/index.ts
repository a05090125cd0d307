import cluster from "node:cluster";
import type { Server } from "node:http";
import { createApp, mailRenderers } from "./app";
import { startResultsCardWorker } from "./bench/bench.jobs";
import { closeSharedBrowser } from "./jobs/chromium";
import { defaultSignInLimits } from "./auth/rate-limits";
import { connectDatabase } from "./db/client";
import { readEnv, type Env } from "./env";
import { startJobs } from "./jobs/queue";
import { scheduleMailHousekeeping } from "./mail/housekeeping";
import { createMailer } from "./mail/mailer";
import { scheduleRushesJobs, startClipMediaWorkers } from "./rushes/rushes.jobs";
import { publishedVideo } from "./publish/publish.video";
import { startSponsorReportWorker } from "./sponsors/report-pdf";
import { scheduleSponsorJobs } from "./sponsors/reminders";
import { reportContext } from "./sponsors/sponsors.router";
import { createS3Storage, storageSettingsFrom } from "./storage/storage";
import { startServers } from "./workers";

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

export async function startServer(env: Env = readEnv()): Promise<RunningServer> {
  const database = connectDatabase(env.DATABASE_URL);
  const mailer = createMailer(env);
  const pace = { pollSeconds: env.JOB_POLL_SECONDS };
  const jobs = await startJobs({ databaseUrl: env.DATABASE_URL, mailer, ...pace });
  await jobs.startMailWorker(mailRenderers({ env, database }));
  const storage = createS3Storage(storageSettingsFrom(env));
  await scheduleRushesJobs(jobs.boss, { db: database.db, storage }, pace);
  await startClipMediaWorkers(jobs.boss, { db: database.db, storage, jobs }, pace);
  await startResultsCardWorker(jobs.boss, { db: database.db, storage, jobs, chromiumPath: env.CHROMIUM_PATH }, pace);
  await startSponsorReportWorker(jobs.boss, { ...reportContext({ env, database, storage, jobs }, publishedVideo), jobs, chromiumPath: env.CHROMIUM_PATH }, pace);
  await scheduleSponsorJobs(jobs.boss, { db: database.db, jobs, appUrl: env.APP_URL }, pace);
  await scheduleMailHousekeeping(jobs.boss, database.db);
  const signInLimits = { ...defaultSignInLimits, signUpsPerAddress: env.SIGN_UPS_PER_ADDRESS };
  const app = createApp({ env, database, mailer, jobs, storage }, { signInLimits });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(env.PORT, env.HOST, () => resolve(listening));
  });
  // Idle connections are kept longer than a client or a balancer in front keeps them (Node's default is
  // 5 s): a client reusing one the server had just closed would see its request reset.
  server.keepAliveTimeout = 65_000;
  server.headersTimeout = 66_000;
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : env.PORT;
  return {
    url: `http://${env.HOST}:${port}`,
    async stop() {
      await drain(server);
      await quiet(database.pool);
      await jobs.stop();
      await closeSharedBrowser();
      mailer.close();
      await database.close();
    },
  };
}

const DRAIN_MS = 5_000;

/**
 * Stops taking connections and lets the requests already running finish (up to five seconds) before
 * the database goes: cutting them off would leave handlers querying a closed pool.
 */
async function drain(server: Server): Promise<void> {
  const closed = new Promise<void>((resolve) => server.close(() => resolve()));
  // Keep-alive connections go idle as their last answer is sent; close each as it does.
  const sweep = setInterval(() => server.closeIdleConnections(), 50);
  const deadline = new Promise<void>((resolve) => setTimeout(resolve, DRAIN_MS).unref());
  await Promise.race([closed, deadline]);
  clearInterval(sweep);
  server.closeAllConnections();
  await closed;
}

/**
 * A client that went away mid-request leaves its handler running: wait (up to two seconds) until no
 * query has been running for a tenth of a second, so those handlers finish before the pool closes.
 */
async function quiet(pool: RunningPool): Promise<void> {
  const until = Date.now() + 2_000;
  let idleSince = Date.now();
  while (Date.now() < until && Date.now() - idleSince < 100) {
    if (pool.totalCount - pool.idleCount > 0 || pool.waitingCount > 0) idleSince = Date.now();
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

type RunningPool = ReturnType<typeof connectDatabase>["pool"];

// `npm run serve` runs this file: the server processes (server/workers.ts), each of which runs it again as a worker.
if (import.meta.url === `file://${process.argv[1]}`) {
  const worker = cluster.isWorker;
  const running = worker ? await startServer() : await startServers(() => startServer());
  if (!worker) console.log(`Kerf is serving ${running.url}`);
  const stop = () => void running.stop().then(() => process.exit(0));
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}
