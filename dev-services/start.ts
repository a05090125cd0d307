import path from "node:path";
import { connectDatabase } from "../server/db/client";
import { migrateDatabase } from "../server/db/migrate";
import { readEnv } from "../server/env";
import { startServer } from "../server/index";
import { startServers } from "../server/workers";
import { confirmDemoAddresses, DEMO_CHANNEL, DEMO_PASSWORD, demoAccounts, isEmpty, seedDemo } from "./demo/channel";
import { startMailCatcher } from "./mail";
import { APP_WEBHOOK_PATH, startPaymentsStandIn } from "./payments/server";
import { startS3StandIn } from "./s3";
import { stateDir } from "./paths";
import { ensureDatabase, startCluster } from "./postgres";
import { run } from "./processes";
import { developmentSecrets } from "./secrets";

/**
 * `npm start`: the local cluster, migrations, demo data, the mail, storage and payments stand-ins,
 * the built client and the server.
 */
const PG_PORT = Number(process.env.KERF_PG_PORT ?? 54329);
const SMTP_PORT = Number(process.env.KERF_SMTP_PORT ?? 1025);
const MAIL_WEB_PORT = Number(process.env.KERF_MAIL_WEB_PORT ?? 1080);
const APP_PORT = Number(process.env.PORT ?? 3000);
// The S3 endpoint; Swift's account, container and object servers and memcached take the four after it.
const S3_PORT = Number(process.env.KERF_S3_PORT ?? 4568);
const PAYMENTS_PORT = Number(process.env.KERF_PAYMENTS_PORT ?? 4590);

const stops: (() => Promise<void> | void)[] = [];
let stopping = false;
async function stopAll(code: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    for (const stop of stops.reverse()) await stop();
  }
  process.exit(code);
}
process.on("SIGINT", () => void stopAll(0));
process.on("SIGTERM", () => void stopAll(0));

try {
  console.log("[kerf] starting the S3 stand-in (Swift) and PostgreSQL…");
  // Pages served by Kerf itself and by Vite's dev server (npm run dev) upload straight to it.
  const appOrigin = new URL(process.env.APP_URL ?? `http://127.0.0.1:${APP_PORT}`).origin;
  const storage = startS3StandIn({
    port: S3_PORT,
    backendPorts: { account: S3_PORT + 1, container: S3_PORT + 2, object: S3_PORT + 3, memcached: S3_PORT + 4 },
    dataDir: path.join(stateDir, "swift"),
    origins: [appOrigin, "http://127.0.0.1:5173", "http://localhost:5173"],
  }).catch((error: Error) => {
    const hint = /in use/.test(error.message) ? ` (the S3 stand-in takes KERF_S3_PORT=${S3_PORT} and the four ports after it; set KERF_S3_PORT to move them)` : "";
    throw new Error(`storage: ${error.message}${hint}`);
  });
  storage.catch(() => undefined);
  const cluster = startCluster({ dataDir: path.join(stateDir, "pg"), port: PG_PORT });
  stops.push(() => cluster.stop());
  const databaseUrl = await ensureDatabase(cluster, "kerf");
  await migrateDatabase(databaseUrl);

  const seedHandle = connectDatabase(databaseUrl);
  const seeded = await isEmpty(seedHandle.db);
  if (seeded) await seedDemo(seedHandle.db);
  else await confirmDemoAddresses(seedHandle.db);
  await seedHandle.close();

  console.log("[kerf] starting the mail stand-in…");
  const mail = await startMailCatcher({ smtpPort: SMTP_PORT, webPort: MAIL_WEB_PORT });
  stops.push(() => mail.stop());

  const s3 = await storage;
  stops.push(() => s3.stop());

  console.log("[kerf] starting the payments stand-in…");
  const secrets = developmentSecrets();
  const payments = await startPaymentsStandIn({
    port: PAYMENTS_PORT,
    dataFile: path.join(stateDir, "payments", "state.json"),
    secretKey: secrets.paymentsSecretKey,
    webhookSecret: secrets.paymentsWebhookSecret,
    accountName: DEMO_CHANNEL,
    webhookUrls: [process.env.KERF_PAYMENTS_WEBHOOK_URL ?? `${appOrigin}${APP_WEBHOOK_PATH}`],
  });
  stops.push(() => payments.stop());

  if (process.env.KERF_SKIP_BUILD !== "1") {
    console.log("[kerf] building the client…");
    if ((await run(process.execPath, [path.resolve("node_modules/vite/bin/vite.js"), "build", "--logLevel", "warn"])) !== 0) throw new Error("client build failed");
  }

  const settings = {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? "development",
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: process.env.SESSION_SECRET ?? secrets.sessionSecret,
    PORT: String(APP_PORT),
    APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${APP_PORT}`,
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(SMTP_PORT),
    ...(process.env.S3_ENDPOINT ? {} : s3.env),
    ...(process.env.PAYMENTS_API_URL ? {} : payments.env),
  };
  // One server process per core unless KERF_WORKERS says otherwise; each reads these settings.
  const server = await startServers(() => startServer(readEnv(settings)), settings);
  stops.push(() => server.stop());

  console.log(`
Kerf is running at ${server.url}
  mail stand-in inbox: ${mail.webUrl}
  S3 stand-in:         ${s3.endpoint} (bucket ${s3.bucket})
  payments stand-in:   ${payments.url} (a sponsor pays each invoice at its hosted_invoice_url, under /i/)
  database:            ${databaseUrl}${seeded ? "  (demo channel just seeded)" : ""}
  development secrets: ${secrets.file}

Demo sign-ins for "${DEMO_CHANNEL}" (demo only; password for all: ${DEMO_PASSWORD})
${demoAccounts.map((a) => `  ${a.role.padEnd(9)} ${a.email}`).join("\n")}

Press Ctrl-C to stop everything.`);
} catch (error) {
  console.error(`[kerf] could not start: ${(error as Error).message}`);
  await stopAll(1);
}
