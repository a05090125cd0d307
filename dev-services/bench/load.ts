import { spawn } from "node:child_process";
import { rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import { connectDatabase } from "../../server/db/client";
import { migrateDatabase } from "../../server/db/migrate";
import { addMember, createUser } from "../../tests/factories/accounts";
import { DEMO_CHANNEL, seedDemo } from "../demo/channel";
import { startMailCatcher } from "../mail";
import { repoRoot, stateDir } from "../paths";
import { percentile, signIn, type SignedIn } from "./measure";
import { ensureDatabase, startCluster } from "../postgres";
import { freePort, stopChild, waitForHttp } from "../processes";
import { startS3StandIn } from "../s3";
import { deeplyNested } from "../../tests/support/server-timing";
import { coresUsed, postmasterOf, sampleCpu } from "./cpu-share";
import { STATEMENT_STATS_SETTINGS, startCountingStatements, statementFigures } from "./statements";

/**
 * `npm run bench:load`: a bounded mixed workload from 50 signed-in clients for 30 s on loopback —
 * the board, an episode page, the footage list and the producer's desk, and a write (a comment) every
 * tenth request — against a Kerf server of its own on throwaway services. Bounded: each client keeps
 * to a set pace (RATE). A short flat-out run after it shows the ceiling, with one server process per
 * core (as served) and then with one process (`core_scaling` is their ratio), and what PostgreSQL did for
 * each request of the one-process run (statements, planning and running time). Last line: one JSON object.
 *
 * `npm run bench:load -- --attack` (or BENCH_ATTACK=1): the same, with one more client that sends
 * 6,000-level-deep bodies to the sign-up form as fast as it is answered, all through the paced and the
 * flat-out runs; a calm paced run first gives the baseline the attacked one is compared with.
 */
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
/**
 * Requests a second from each client, sent together like the calls of one page load: a page a second
 * from each of fifty people is far busier than a team at work. BENCH_RATE=0 drives flat out.
 */
const RATE = Number(process.env.BENCH_RATE ?? 4);
const WARMUP_SECONDS = Number(process.env.BENCH_WARMUP_SECONDS ?? 10);
const ATTACK = process.argv.includes("--attack") || process.env.BENCH_ATTACK === "1";
const ATTACK_DEPTH = 6000;
const SATURATION_SECONDS = Number(process.env.BENCH_SATURATION_SECONDS ?? 10);
const work = path.join(stateDir, `bench-load-${process.pid}`);
const stops: (() => Promise<void> | void)[] = [];

async function main() {
  rmSync(work, { recursive: true, force: true });
  const cluster = startCluster({ dataDir: path.join(work, "pg"), port: await freePort(), fresh: true, settings: STATEMENT_STATS_SETTINGS });
  stops.push(() => cluster.stop());
  const databaseUrl = await ensureDatabase(cluster, "kerf_load");
  await migrateDatabase(databaseUrl);

  const handle = connectDatabase(databaseUrl);
  await seedDemo(handle.db);
  const { rows } = await handle.pool.query<{ id: string }>("select id from channels where name = $1", [DEMO_CHANNEL]);
  const channelId = rows[0]!.id;
  const episodes = await handle.pool.query<{ id: string }>("select id from episodes where channel_id = $1 order by rank", [channelId]);
  const password = "load-bench-password";
  const people = [];
  for (let i = 0; i < CONNECTIONS; i++) {
    const person = await createUser(handle.db, { email: `load-${i}@example.com`, name: `Load ${i}`, password });
    await addMember(handle.db, channelId, person, "producer");
    people.push(person);
  }
  await handle.close();

  const mail = await startMailCatcher({ smtpPort: await freePort(), webPort: await freePort() });
  stops.push(() => mail.stop());
  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  const s3 = await startS3StandIn({ port: await freePort(), dataDir: path.join(work, "s3"), origins: [appUrl] });
  stops.push(() => s3.stop());
  /** `server/index.ts` with `workers` processes (0: one per core, as served), on the shared database. */
  const startApp = async (workers: number, port: number) => {
    const url = `http://127.0.0.1:${port}`;
    // BENCH_PROFILE=<dir> writes the server's CPU profile there when it stops (open it in Chromium's devtools).
    const profile = process.env.BENCH_PROFILE ? ["--cpu-prof", "--cpu-prof-dir", path.resolve(process.env.BENCH_PROFILE)] : [];
    const server = spawn(process.execPath, [...profile, "--import", "tsx", "server/index.ts"], {
      cwd: repoRoot,
      stdio: ["ignore", "ignore", "inherit"],
      env: {
        ...process.env,
        ...s3.env,
        NODE_ENV: "production",
        PORT: String(port),
        APP_URL: appUrl,
        DATABASE_URL: databaseUrl,
        SESSION_SECRET: "load-bench-secret-load-bench-secret-00",
        SMTP_PORT: String(mail.smtpPort),
        ...(workers > 0 ? { KERF_WORKERS: String(workers) } : {}),
      },
    });
    stops.push(() => stopChild(server));
    // A loaded machine may take minutes to start a server (its code is compiled as it loads).
    await waitForHttp(`${url}/api/health`, 180_000);
    return { url, pid: server.pid!, stop: () => stopChild(server) };
  };
  const all = await startApp(0, appPort);

  const clients = await Promise.all(people.map((p) => signIn(appUrl, { email: p.email, password })));
  const base = `/api/channels/${channelId}`;
  const episodeIds = episodes.rows.map((r) => r.id);
  const reads = [`${base}/episodes`, `${base}/episodes/${episodeIds[0]}`, `${base}/clips?limit=50`, `${base}/desk`];
  const requestsFor = (client: SignedIn, index: number) => {
    // As a browser asks: compressed answers accepted.
    const headers = { cookie: client.cookie, accept: "application/json", "accept-encoding": "gzip, deflate, br" };
    const sequence: autocannon.Request[] = Array.from({ length: 9 }, (_, i) => ({ method: "GET", path: reads[i % reads.length]!, headers }));
    const episodeId = episodeIds[index % episodeIds.length];
    sequence.push({
      method: "POST",
      path: `${base}/episodes/${episodeId}/comments`,
      headers: { ...headers, "content-type": "application/json", "x-csrf-token": client.csrf },
      body: JSON.stringify({ body: `Load note from client ${index}` }),
    });
    return sequence;
  };

  // Check each request once before the run, so a wrong path is a clear failure, not a sea of 404s.
  for (const request of requestsFor(clients[0]!, 0)) {
    const response = await fetch(appUrl + request.path, { method: request.method, headers: request.headers as Record<string, string>, body: request.body as string | undefined });
    if (!response.ok) throw new Error(`${request.method} ${request.path} answered ${response.status}: ${(await response.text()).slice(0, 200)}`);
  }

  // A fresh server runs its code cold (not yet optimised by V8) and its pools empty: warm it first.
  console.log(`Warming up for ${WARMUP_SECONDS} s (not counted)…`);
  await drivePaced(appUrl, clients, requestsFor, { seconds: WARMUP_SECONDS, rate: Math.max(1, RATE) });
  const drive = () => (RATE > 0 ? drivePaced(appUrl, clients, requestsFor, { seconds: SECONDS, rate: RATE }) : driveFlatOut(appUrl, clients, requestsFor, { seconds: SECONDS }));
  let calm: ReturnType<typeof summary> | null = null;
  if (ATTACK) {
    console.log(`Calm run: ${CONNECTIONS} signed-in clients for ${SECONDS} s, each at ${RATE} requests a second, no attacker (the baseline)…`);
    calm = summary(await drive());
  }
  const attacks: AttackRun[] = [];
  const underAttack = async <T>(seconds: number, run: Promise<T>): Promise<T> => {
    if (!ATTACK) return run;
    const [result, hits] = await Promise.all([run, attack(appUrl, seconds)]);
    attacks.push(hits);
    return result;
  };
  console.log(`Driving ${CONNECTIONS} signed-in clients for ${SECONDS} s against ${appUrl}, each at ${RATE} requests a second${ATTACK ? `, while one client sends ${ATTACK_DEPTH}-deep bodies flat out` : ""}…`);
  const paced = summary(await underAttack(SECONDS, drive()));
  console.log(`Then flat out for ${SATURATION_SECONDS} s, each client sending its next request as soon as the last is answered…`);
  const watched = (serverPid: number) => ({ server: serverPid, postgres: postmasterOf(cluster.dataDir), bench: process.pid });
  const beforeAll = sampleCpu();
  const flatOut = summary(await underAttack(SATURATION_SECONDS, driveFlatOut(appUrl, clients, requestsFor, { seconds: SATURATION_SECONDS })));
  const coresAll = coresUsed(beforeAll, sampleCpu(), watched(all.pid));
  const attacked = ATTACK ? attackSummary(attacks, SECONDS + SATURATION_SECONDS) : null;

  // The same flat-out run against one server process, on the same database: what the other cores add.
  console.log(`Then flat out for ${SATURATION_SECONDS} s against a server of one process…`);
  await all.stop();
  const single = await startApp(1, await freePort());
  const singleClients = await Promise.all(people.map((p) => signIn(single.url, { email: p.email, password })));
  await driveFlatOut(single.url, singleClients, requestsFor, { seconds: Math.min(5, SATURATION_SECONDS) });
  const stats = connectDatabase(databaseUrl);
  await startCountingStatements(stats.pool);
  const beforeOne = sampleCpu();
  const flatOutOne = summary(await driveFlatOut(single.url, singleClients, requestsFor, { seconds: SATURATION_SECONDS }));
  const coresOne = coresUsed(beforeOne, sampleCpu(), watched(single.pid));
  const statements = await statementFigures(stats.pool, flatOutOne.requests);
  await stats.close();
  await single.stop();

  const figures = {
    connections: CONNECTIONS,
    seconds: SECONDS,
    rate_per_client: RATE,
    requests: paced.requests,
    requests_per_second: paced.perSecond,
    errors: paced.errors,
    p50_ms: paced.p50,
    p95_ms: paced.p95,
    p99_ms: paced.p99,
    flat_out_requests_per_second: flatOut.perSecond,
    flat_out_errors: flatOut.errors,
    flat_out_p50_ms: flatOut.p50,
    flat_out_p95_ms: flatOut.p95,
    workers: os.availableParallelism(),
    flat_out_rps_all: flatOut.perSecond,
    flat_out_rps_one: flatOutOne.perSecond,
    flat_out_one_errors: flatOutOne.errors,
    core_scaling: Math.round((flatOut.perSecond / Math.max(1, flatOutOne.perSecond)) * 100) / 100,
    core_scaling_ceiling: scalingCeiling(coresOne.machine),
    flat_out_all_cores_server: coresAll.server,
    flat_out_all_cores_postgres: coresAll.postgres,
    flat_out_all_cores_load_generator: coresAll.bench,
    flat_out_all_cores_machine: coresAll.machine,
    flat_out_one_cores_server: coresOne.server,
    flat_out_one_cores_postgres: coresOne.postgres,
    flat_out_one_cores_load_generator: coresOne.bench,
    flat_out_one_cores_machine: coresOne.machine,
    postgres_statements_per_request: statements.perRequest,
    postgres_plan_ms_per_request: statements.planMsPerRequest,
    postgres_exec_ms_per_request: statements.execMsPerRequest,
    ...(attacked && calm
      ? {
          attack_depth: ATTACK_DEPTH,
          attack_requests: attacked.requests,
          attack_requests_per_second: attacked.perSecond,
          attack_not_400: attacked.not400,
          attack_p50_ms: attacked.p50,
          attack_p95_ms: attacked.p95,
          calm_p95_ms: calm.p95,
          calm_errors: calm.errors,
          p95_ratio_to_calm: Math.round((paced.p95 / Math.max(0.1, calm.p95)) * 100) / 100,
        }
      : {}),
    load_average_1min: Math.round(os.loadavg()[0]! * 100) / 100,
  };
  console.log(`
paced (${CONNECTIONS} clients × ${RATE}/s):
  requests:   ${paced.requests} in ${SECONDS} s (${paced.perSecond}/s), ${paced.errors} errors (${paced.non2xx} non-2xx, ${paced.timeouts} timeouts)
  latency:    p50 ${paced.p50} ms, p95 ${paced.p95} ms, p99 ${paced.p99} ms
  target:     zero errors and p95 under 100 ms — ${paced.errors === 0 && paced.p95 < 100 ? "met" : "NOT met"}
flat out (the ceiling of this machine, server, database and load generator together):
  requests:   ${flatOut.requests} in ${SATURATION_SECONDS} s (${flatOut.perSecond}/s), ${flatOut.errors} errors
  latency:    p50 ${flatOut.p50} ms, p95 ${flatOut.p95} ms (${CONNECTIONS} requests always waiting: latency is ${CONNECTIONS} ÷ throughput)
one server process flat out: ${flatOutOne.perSecond}/s, ${flatOutOne.errors} errors; ${figures.workers} processes: ${flatOut.perSecond}/s
  core scaling: ${figures.core_scaling} (target >= 1.6 on 2 cores with PostgreSQL and the load on the same machine: ${figures.core_scaling >= 1.6 ? "met" : "NOT met"})
  ceiling:      ${figures.core_scaling_ceiling} = ${os.cpus().length} cores ÷ the ${coresOne.machine} the one-process run kept busy (server, PostgreSQL and load generator together):
                the most two processes can add when a request costs them what it cost the one (1.6 needs the one-process run under ${Math.round((os.cpus().length / 1.6) * 100) / 100} cores)
  cores busy (of ${os.cpus().length}):  ${figures.workers} processes: server ${coresAll.server}, PostgreSQL ${coresAll.postgres}, load generator ${coresAll.bench}, whole machine ${coresAll.machine}
                     one process: server ${coresOne.server}, PostgreSQL ${coresOne.postgres}, load generator ${coresOne.bench}, whole machine ${coresOne.machine}
PostgreSQL per request (one process flat out): ${statements.perRequest} statements, planning ${statements.planMsPerRequest} ms, running ${statements.execMsPerRequest} ms; costliest:
${statements.top.map((t) => `  ${String(t.ms).padStart(6)} ms ${String(t.calls).padStart(6)}× ${t.text}`).join("\n")}${
    attacked && calm
      ? `
attacker (one client, ${ATTACK_DEPTH}-deep bodies to the sign-up form, flat out through both runs):
  requests:   ${attacked.requests} (${attacked.perSecond}/s), ${attacked.not400} not answered 400
  latency:    p50 ${attacked.p50} ms, p95 ${attacked.p95} ms
calm paced run (no attacker): p95 ${calm.p95} ms, ${calm.errors} errors; attacked p95 is ${figures.p95_ratio_to_calm}× the calm one`
      : ""
  }
machine: ${os.cpus().length} CPUs, load average ${figures.load_average_1min}`);
  console.log(JSON.stringify(figures));
}

/**
 * The most `core_scaling` can be on this machine: all its cores over the cores the one-process run
 * kept busy, as more processes can't make a request cheaper, only add cores. The one-process run is
 * bound by its one main thread, while PostgreSQL, the load generator and the server's other threads use
 * the rest; with everything on two cores that share is what the second process can't have.
 */
function scalingCeiling(oneProcessMachineCores: number): number {
  return Math.round((os.cpus().length / Math.max(0.01, oneProcessMachineCores)) * 100) / 100;
}

type RequestsFor = (client: SignedIn, index: number) => autocannon.Request[];

interface Run {
  requests: number;
  perSecond: number;
  errors: number;
  non2xx: number;
  timeouts: number;
  latencies: number[];
}

function oneRun(options: autocannon.Options, onResponse: (ms: number, status: number) => void): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    const instance = autocannon(options, (error, finished) => (error ? reject(error) : resolve(finished)));
    instance.on("response", (_client, status, _bytes, responseTime) => onResponse(responseTime, status));
  });
}

interface AttackRun {
  requests: number;
  not400: number;
  latencies: number[];
}

/** One visitor, not signed in, sending the sign-up form a body nested ATTACK_DEPTH levels deep, flat out. */
async function attack(appUrl: string, seconds: number): Promise<AttackRun> {
  const me = await fetch(`${appUrl}/api/auth/me`);
  const cookie = me.headers.getSetCookie().map((line) => line.split(";")[0]).join("; ");
  const { csrfToken } = (await me.json()) as { csrfToken: string };
  const latencies: number[] = [];
  let not400 = 0;
  const body = deeplyNested(ATTACK_DEPTH);
  const headers = { cookie, "content-type": "application/json", "x-csrf-token": csrfToken };
  const result = await oneRun({ url: appUrl, connections: 1, duration: seconds, requests: [{ method: "POST", path: "/api/auth/sign-up", headers, body }] }, (ms, status) => {
    latencies.push(ms);
    if (status !== 400) not400++;
  });
  return { requests: result.requests.total, not400: not400 + result.errors + result.timeouts, latencies };
}

function attackSummary(runs: AttackRun[], seconds: number) {
  const latencies = runs.flatMap((run) => run.latencies).sort((a, b) => a - b);
  const requests = runs.reduce((total, run) => total + run.requests, 0);
  const at = (p: number) => Math.round(percentile(latencies, p) * 10) / 10;
  return { requests, perSecond: Math.round(requests / seconds), not400: runs.reduce((total, run) => total + run.not400, 0), p50: at(50), p95: at(95) };
}

/**
 * Paced: one autocannon instance per client. autocannon's rate sends a connection's allowance for the
 * second back to back when the second starts (here: a page's few requests at once, as a browser does),
 * so the clients start spread across one second, or all fifty would send on the same tick.
 */
async function drivePaced(appUrl: string, clients: SignedIn[], requestsFor: RequestsFor, options: { seconds: number; rate: number }): Promise<Run> {
  const latencies: number[] = [];
  const results = await Promise.all(
    clients.map(async (client, index) => {
      await new Promise((resolve) => setTimeout(resolve, (index * 1000) / clients.length));
      return oneRun({ url: appUrl, connections: 1, duration: options.seconds, connectionRate: options.rate, requests: requestsFor(client, index) }, (ms) => latencies.push(ms));
    }),
  );
  const sum = (pick: (r: autocannon.Result) => number) => results.reduce((total, r) => total + pick(r), 0);
  const requests = sum((r) => r.requests.total);
  return { requests, perSecond: Math.round(requests / options.seconds), errors: sum((r) => r.errors + r.timeouts + r.non2xx), non2xx: sum((r) => r.non2xx), timeouts: sum((r) => r.timeouts), latencies };
}

/** Flat out: every client sends its next request as soon as the last is answered. */
async function driveFlatOut(appUrl: string, clients: SignedIn[], requestsFor: RequestsFor, options: { seconds: number }): Promise<Run> {
  const latencies: number[] = [];
  let nextClient = 0;
  const result = await oneRun(
    {
      url: appUrl,
      connections: clients.length,
      duration: options.seconds,
      requests: requestsFor(clients[0]!, 0),
      setupClient: (client) => {
        const index = nextClient++ % clients.length;
        client.setRequests(requestsFor(clients[index]!, index));
      },
    },
    (ms) => latencies.push(ms),
  );
  return { requests: result.requests.total, perSecond: Math.round(result.requests.average), errors: result.errors + result.timeouts + result.non2xx, non2xx: result.non2xx, timeouts: result.timeouts, latencies };
}

function summary(run: Run) {
  const sorted = [...run.latencies].sort((a, b) => a - b);
  const at = (p: number) => Math.round(percentile(sorted, p) * 10) / 10;
  return { ...run, p50: at(50), p95: at(95), p99: at(99) };
}

try {
  await main();
} finally {
  for (const stop of stops.reverse()) await stop();
  rmSync(work, { recursive: true, force: true });
}
