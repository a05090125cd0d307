import path from "node:path";
import { connectDatabase } from "../server/db/client";
import { migrateDatabase } from "../server/db/migrate";
import { readEnv } from "../server/env";
import { startServer } from "../server/index";
import { DEMO_CHANNEL, DEMO_PASSWORD, demoAccounts, isEmpty, seedDemo } from "./demo/channel";
import { startMailCatcher } from "./mail";
import { stateDir } from "./paths";
import { ensureDatabase, startCluster } from "./postgres";
import { run } from "./processes";
import { developmentSecrets } from "./secrets";

/** `npm start`: the local cluster, migrations, demo data, the mail stand-in, the built client and the server. */
const PG_PORT = Number(process.env.KERF_PG_PORT ?? 54329);
const SMTP_PORT = Number(process.env.KERF_SMTP_PORT ?? 1025);
const MAIL_WEB_PORT = Number(process.env.KERF_MAIL_WEB_PORT ?? 1080);
const APP_PORT = Number(process.env.PORT ?? 3000);

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
  console.log("[kerf] starting PostgreSQL…");
  const cluster = startCluster({ dataDir: path.join(stateDir, "pg"), port: PG_PORT });
  stops.push(() => cluster.stop());
  const databaseUrl = await ensureDatabase(cluster, "kerf");
  await migrateDatabase(databaseUrl);

  const seedHandle = connectDatabase(databaseUrl);
  const seeded = await isEmpty(seedHandle.db);
  if (seeded) await seedDemo(seedHandle.db);
  await seedHandle.close();

  console.log("[kerf] starting the mail stand-in…");
  const mail = await startMailCatcher({ smtpPort: SMTP_PORT, webPort: MAIL_WEB_PORT });
  stops.push(() => mail.stop());

  if (process.env.KERF_SKIP_BUILD !== "1") {
    console.log("[kerf] building the client…");
    if ((await run(process.execPath, [path.resolve("node_modules/vite/bin/vite.js"), "build", "--logLevel", "warn"])) !== 0) throw new Error("client build failed");
  }

  const secrets = developmentSecrets();
  const env = readEnv({
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? "development",
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: process.env.SESSION_SECRET ?? secrets.sessionSecret,
    PORT: String(APP_PORT),
    APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${APP_PORT}`,
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(SMTP_PORT),
  });
  const server = await startServer(env);
  stops.push(() => server.stop());

  console.log(`
Kerf is running at ${server.url}
  mail stand-in inbox: ${mail.webUrl}
  database:            ${databaseUrl}${seeded ? "  (demo channel just seeded)" : ""}
  development secrets: ${secrets.file}

Demo sign-ins for "${DEMO_CHANNEL}" (demo only; password for all: ${DEMO_PASSWORD})
${demoAccounts.map((a) => `  ${a.role.padEnd(9)} ${a.email}`).join("\n")}

Press Ctrl-C to stop everything.`);
} catch (error) {
  console.error(`[kerf] could not start: ${(error as Error).message}`);
  await stopAll(1);
}
