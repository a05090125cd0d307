import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import PgBoss from "pg-boss";
import { migrateDatabase } from "../server/db/migrate";
import { startMailCatcher } from "./mail";
import { APP_WEBHOOK_PATH, startPaymentsStandIn } from "./payments/server";
import { newSecretKey, newWebhookSecret } from "./payments/store";
import { TEST_RETRY } from "./payments/webhooks";
import { startS3StandIn } from "./s3";
import { repoRoot, stateDir } from "./paths";
import { ensureDatabase, startCluster, stopLeftoverCluster } from "./postgres";
import { freePort, run, runCollected, spawnTied, stopChild, waitForHttp } from "./processes";
import { removeFolder } from "./service-user";

/**
 * `npm test`: a throwaway PostgreSQL cluster and mail, storage and payments stand-ins, then the type
 * check, the linter, the migrations' check, the unit and API tests, the client build and the browser
 * tests, each against its own database.
 * The demo cluster of `npm start` is never touched.
 */
// `npm test -- <vitest filters>` runs just those vitest files against fresh services: the quick loop.
// `npm test -- --browser [playwright filters]` builds the client and runs just the browser tests.
const args = process.argv.slice(2);
const browserOnly = args[0] === "--browser";
const filters = browserOnly ? [] : args;
const browserFilters = browserOnly ? args.slice(1) : [];
const partial = args.length > 0;
// Each run has its own cluster and output, so two runs at once (two terminals, helpers) never collide.
const outputDir = path.join(stateDir, partial ? `test-output-${process.pid}` : "test-output");
const bin = (name: string) => path.join(repoRoot, "node_modules", ".bin", name);

interface Step {
  name: string;
  passed: boolean;
  seconds: number;
}
const steps: Step[] = [];
const stops: (() => Promise<void> | void)[] = [];
const runStarted = performance.now();
const secondsSince = (start: number) => (performance.now() - start) / 1000;

async function step(name: string, command: string, args: string[], env: NodeJS.ProcessEnv = {}): Promise<boolean> {
  console.log(`\n── ${name} ──`);
  const started = performance.now();
  const code = await run(command, args, { env: { ...process.env, ...env }, cwd: repoRoot });
  steps.push({ name, passed: code === 0, seconds: secondsSince(started) });
  return code === 0;
}

/**
 * Checks that each keep one core busy (the type check, the linter), run side by side on the machine's
 * two cores; each one's output is printed whole when it ends, so theirs never interleave.
 */
async function stepsSideBySide(checks: { name: string; command: string; args: string[] }[]): Promise<void> {
  const started = performance.now();
  const done = checks.map((check) => ({ name: check.name, passed: false, seconds: 0 }));
  steps.push(...done);
  await Promise.all(
    checks.map(async (check, i) => {
      const { code, output } = await runCollected(check.command, check.args, { env: process.env, cwd: repoRoot });
      console.log(`\n── ${check.name} ──\n${output.trimEnd()}`);
      Object.assign(done[i]!, { passed: code === 0, seconds: secondsSince(started) });
    }),
  );
}

async function preparePostgres() {
  const port = await freePort();
  removeAbandonedFolders();
  const dataDir = path.join(stateDir, `pg-test-${process.pid}`);
  const cluster = startCluster({ dataDir, port, fresh: true });
  stops.push(() => {
    cluster.stop();
    removeFolder(dataDir);
  });
  const templateUrl = await ensureDatabase(cluster, "kerf_template");
  await migrateDatabase(templateUrl);
  // pg-boss installs its own schema at first start; doing it once here lets every copy skip it.
  const boss = new PgBoss({ connectionString: templateUrl, schema: "pgboss" });
  await boss.start();
  await boss.stop({ graceful: false, wait: true });
  return { cluster, clusterUrl: `postgres://kerf@127.0.0.1:${port}` };
}

/**
 * Clusters and storage folders left by runs that were killed; their process id no longer exists.
 * Their storage and mail daemons died with them (spawnTied); a cluster is stopped here.
 */
function removeAbandonedFolders(): void {
  if (!existsSync(stateDir)) return;
  for (const name of readdirSync(stateDir)) {
    const [, kind, pid] = /^(pg|s3)-(?:test|fault)-(\d+)(?:-[\w-]+)?$/.exec(name) ?? [];
    if (!pid || processAlive(Number(pid))) continue;
    if (kind === "pg") stopLeftoverCluster(path.join(stateDir, name));
    removeFolder(path.join(stateDir, name));
  }
}

/** A storage stand-in of this run's own, in a folder of its own, removed when the run ends. */
function startStorage(name: string, origins: string[]) {
  const dataDir = path.join(stateDir, `s3-test-${process.pid}-${name}`);
  const starting = freePort().then((port) => startS3StandIn({ port, dataDir, origins }));
  // Listed at once: a run that fails while storage is still starting stops it all the same.
  stops.push(async () => {
    await (await starting.catch(() => null))?.stop();
    removeFolder(dataDir);
  });
  return starting;
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

const minutes = (seconds: number) => `${Math.floor(Math.round(seconds) / 60)} min ${Math.round(seconds) % 60} s`;

function countVitest(): { passed: number; failed: number } {
  const file = path.join(outputDir, "vitest.json");
  if (!existsSync(file)) return { passed: 0, failed: 0 };
  const report = JSON.parse(readFileSync(file, "utf8")) as { numPassedTests: number; numFailedTests: number };
  return { passed: report.numPassedTests, failed: report.numFailedTests };
}

function countPlaywright(): { passed: number; failed: number } {
  const file = path.join(outputDir, "playwright.json");
  if (!existsSync(file)) return { passed: 0, failed: 0 };
  const report = JSON.parse(readFileSync(file, "utf8")) as { stats: { expected: number; unexpected: number; flaky: number } };
  return { passed: report.stats.expected + report.stats.flaky, failed: report.stats.unexpected };
}

/** A payments stand-in for this run: fresh keys, its state in memory only (no test restarts it). */
async function startPayments(webhookUrls: string[] = []) {
  const payments = await startPaymentsStandIn({
    port: await freePort(),
    secretKey: newSecretKey(),
    webhookSecret: newWebhookSecret(),
    accountName: "Kerf test channel",
    webhookUrls,
    retry: TEST_RETRY,
  });
  stops.push(() => payments.stop());
  return payments;
}

const paymentsTestEnv = (payments: Awaited<ReturnType<typeof startPayments>>) => ({
  KERF_TEST_PAYMENTS_API_URL: payments.url,
  KERF_TEST_PAYMENTS_SECRET_KEY: payments.secretKey,
  KERF_TEST_PAYMENTS_WEBHOOK_SECRET: payments.webhookSecret,
});

/** The browser tests' server signs its links with this; the tests sign an expired one with it too. */
const BROWSER_SESSION_SECRET = "browser-test-secret-browser-test-secret";

async function browserTests(clusterUrl: string, cluster: ReturnType<typeof startCluster>, mail: { smtpPort: number; webUrl: string }) {
  const databaseUrl = await ensureDatabase(cluster, "kerf_e2e", "kerf_template");
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  // The browser uploads straight to storage, so its stand-in must allow this app's origin (CORS).
  const s3 = await startStorage("e2e", [appUrl]);
  const payments = await startPayments([`${appUrl}${APP_WEBHOOK_PATH}`]);
  const server = spawnTied(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "inherit", "inherit"],
    env: {
      ...process.env,
      NODE_ENV: "test",
      PORT: String(port),
      APP_URL: appUrl,
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: BROWSER_SESSION_SECRET,
      SMTP_PORT: String(mail.smtpPort),
      // Every browser test signs its people up from this one address.
      SIGN_UPS_PER_ADDRESS: "1000",
      // Journeys wait on mail, posters, cards and reports: the workers ask for work at pg-boss's quickest pace.
      JOB_POLL_SECONDS: "0.5",
      // One process, as before: several are tested by tests/api/server-processes.test.ts.
      KERF_WORKERS: "1",
      ...s3.env,
      ...payments.env,
    },
  });
  stops.push(() => stopChild(server));
  await waitForHttp(`${appUrl}/api/health`, 60_000);
  return step("browser tests (Playwright, Debian's Chromium)", bin("playwright"), ["test", ...browserFilters], {
    KERF_E2E_URL: appUrl,
    KERF_TEST_CLUSTER_URL: clusterUrl,
    KERF_E2E_DATABASE_URL: databaseUrl,
    KERF_E2E_SESSION_SECRET: BROWSER_SESSION_SECRET,
    KERF_TEST_MAIL_WEB_URL: mail.webUrl,
    KERF_TEST_S3_ENDPOINT: s3.endpoint,
    KERF_TEST_S3_BUCKET: s3.bucket,
    ...paymentsTestEnv(payments),
    PLAYWRIGHT_JSON_OUTPUT_NAME: path.join(outputDir, "playwright.json"),
  });
}

async function main(): Promise<number> {
  rmSync(outputDir, { recursive: true, force: true });
  mkdirSync(outputDir, { recursive: true });

  if (!partial) {
    await stepsSideBySide([
      { name: "type check", command: bin("tsc"), args: ["--noEmit", "-p", "tsconfig.json"] },
      { name: "lint", command: bin("eslint"), args: ["--max-warnings", "0", "."] },
    ]);
    // Two branches that each generated the next migration leave two snapshots with one parent: refused here.
    await step("migrations check (drizzle-kit check)", bin("drizzle-kit"), ["check"]);
  }

  console.log("\n── test services ──");
  const servicesStarted = performance.now();
  // Storage's daemons start while PostgreSQL is prepared: the slowest of the services goes first.
  // The browser tests get a stand-in of their own later (its CORS names their server's origin).
  const storage = browserOnly ? null : startStorage("api", ["http://kerf.test"]);
  storage?.catch(() => undefined);
  const { cluster, clusterUrl } = await preparePostgres();
  const mail = await startMailCatcher({ smtpPort: await freePort(), webPort: await freePort() });
  stops.push(() => mail.stop());
  const s3 = await storage;
  const payments = await startPayments();
  const seconds = ((performance.now() - servicesStarted) / 1000).toFixed(1);
  console.log(`PostgreSQL ${clusterUrl}, mail stand-in ${mail.webUrl}${s3 ? `, S3 stand-in ${s3.endpoint}` : ""}, payments stand-in ${payments.url} (up in ${seconds} s)`);

  if (s3) {
    const testEnv = {
      NO_COLOR: "1",
      KERF_TEST_CLUSTER_URL: clusterUrl,
      KERF_TEST_TEMPLATE_DB: "kerf_template",
      KERF_TEST_SMTP_PORT: String(mail.smtpPort),
      KERF_TEST_MAIL_WEB_URL: mail.webUrl,
      KERF_TEST_S3_ENDPOINT: s3.endpoint,
      KERF_TEST_S3_BUCKET: s3.bucket,
      KERF_TEST_S3_ACCESS_KEY_ID: s3.accessKeyId,
      KERF_TEST_S3_SECRET_ACCESS_KEY: s3.secretAccessKey,
      ...paymentsTestEnv(payments),
    };
    const vitestArgs = ["run", "--reporter=default", "--reporter=json", `--outputFile.json=${path.join(outputDir, "vitest.json")}`, ...filters];
    await step("unit and API tests (vitest)", bin("vitest"), vitestArgs, testEnv);
    // Its memory and processes are the browser tests' now.
    await s3.stop();
  }

  if (filters.length === 0 && (await step("client build", bin("vite"), ["build", "--logLevel", "warn"]))) {
    await browserTests(clusterUrl, cluster, mail);
  }

  const vitest = countVitest();
  const browser = countPlaywright();
  console.log("\n── summary ──");
  for (const s of steps) console.log(`${s.passed ? "ok  " : "FAIL"}  ${s.name} (${minutes(s.seconds)})`);
  console.log(`wall time ${minutes(secondsSince(runStarted))} (this script's; installing what was missing came before it)`);
  console.log(`vitest: ${vitest.passed} passed, ${vitest.failed} failed; browser: ${browser.passed} passed, ${browser.failed} failed`);
  console.log(`screenshots and traces: ${path.relative(repoRoot, outputDir)}/`);
  const failedSteps = steps.filter((s) => !s.passed).length;
  // The closing line CI reads: every test and every check step counted together.
  console.log(`${vitest.passed + browser.passed + steps.length - failedSteps} passed, ${vitest.failed + browser.failed + failedSteps} failed`);
  return failedSteps === 0 ? 0 : 1;
}

let stopping: Promise<void> | null = null;
/** Stops every service once, whether the run ends, fails or is interrupted (Ctrl-C). */
function stopAll(): Promise<void> {
  stopping ??= (async () => {
    for (const stop of stops.reverse()) await stop();
    if (filters.length > 0) rmSync(outputDir, { recursive: true, force: true });
  })();
  return stopping;
}
for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.on(signal, () => {
    console.error(`\n[test] ${signal}: stopping the test services…`);
    void stopAll().then(() => process.exit(130));
  });
}

let code = 1;
try {
  code = await main();
} catch (error) {
  console.error(`[test] ${(error as Error).stack ?? error}`);
} finally {
  await stopAll();
}
process.exit(code);
