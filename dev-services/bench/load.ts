import { spawn } from "node:child_process";
import { rmSync } from "node:fs";
import path from "node:path";
import autocannon from "autocannon";
import { connectDatabase } from "../../server/db/client";
import { migrateDatabase } from "../../server/db/migrate";
import { addMember, createUser } from "../../tests/factories/accounts";
import { DEMO_CHANNEL, seedDemo } from "../demo/channel";
import { startMailCatcher } from "../mail";
import { repoRoot, stateDir } from "../paths";
import { ensureDatabase, startCluster } from "../postgres";
import { freePort, stopChild, waitForHttp } from "../processes";
import { startS3StandIn } from "../s3";

/**
 * `npm run bench:load`: a bounded mixed workload from 50 signed-in clients for 30 s on loopback —
 * the board, an episode page, the footage list and the producer's desk, and a write (a comment) every
 * tenth request — against a Kerf server of its own on throwaway services. Last line: one JSON object.
 */
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const work = path.join(stateDir, `bench-load-${process.pid}`);
const stops: (() => Promise<void> | void)[] = [];

interface Client {
  cookie: string;
  csrf: string;
}

async function signIn(appUrl: string, email: string, password: string): Promise<Client> {
  const me = await fetch(`${appUrl}/api/auth/me`);
  const anonymous = (me.headers.get("set-cookie") ?? "").split(";")[0]!;
  const { csrfToken } = (await me.json()) as { csrfToken: string };
  const signed = await fetch(`${appUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { cookie: anonymous, "content-type": "application/json", "x-csrf-token": csrfToken },
    body: JSON.stringify({ email, password }),
  });
  if (!signed.ok) throw new Error(`sign-in failed: ${signed.status}`);
  return { cookie: (signed.headers.get("set-cookie") ?? "").split(";")[0]!, csrf: ((await signed.json()) as { csrfToken: string }).csrfToken };
}

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? 0;

async function main() {
  rmSync(work, { recursive: true, force: true });
  const cluster = startCluster({ dataDir: path.join(work, "pg"), port: await freePort(), fresh: true });
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
  const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, ...s3.env, NODE_ENV: "production", PORT: String(appPort), APP_URL: appUrl, DATABASE_URL: databaseUrl, SESSION_SECRET: "load-bench-secret-load-bench-secret-00", SMTP_PORT: String(mail.smtpPort) },
  });
  stops.push(() => stopChild(server));
  await waitForHttp(`${appUrl}/api/health`, 60_000);

  const clients = await Promise.all(people.map((p) => signIn(appUrl, p.email, password)));
  const base = `/api/channels/${channelId}`;
  const episodeIds = episodes.rows.map((r) => r.id);
  const reads = [`${base}/episodes`, `${base}/episodes/${episodeIds[0]}`, `${base}/clips?limit=50`, `${base}/desk`];
  const requestsFor = (client: Client, index: number) => {
    const headers = { cookie: client.cookie, accept: "application/json" };
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

  const latencies: number[] = [];
  let nextClient = 0;
  console.log(`Driving ${CONNECTIONS} signed-in clients for ${SECONDS} s against ${appUrl}…`);
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      {
        url: appUrl,
        connections: CONNECTIONS,
        duration: SECONDS,
        requests: requestsFor(clients[0]!, 0),
        setupClient: (client) => {
          const index = nextClient++ % clients.length;
          client.setRequests(requestsFor(clients[index]!, index));
        },
      },
      (error, finished) => (error ? reject(error) : resolve(finished)),
    );
    instance.on("response", (_client, _status, _bytes, responseTime) => latencies.push(responseTime));
  });

  latencies.sort((a, b) => a - b);
  const errors = result.errors + result.timeouts + result.non2xx;
  const figures = {
    connections: CONNECTIONS,
    seconds: SECONDS,
    requests: result.requests.total,
    requests_per_second: Math.round(result.requests.average),
    errors,
    p50_ms: Math.round(percentile(latencies, 50) * 10) / 10,
    p95_ms: Math.round(percentile(latencies, 95) * 10) / 10,
    p99_ms: Math.round(percentile(latencies, 99) * 10) / 10,
  };
  console.log(`
requests:   ${figures.requests} in ${SECONDS} s (${figures.requests_per_second}/s), ${errors} errors (${result.non2xx} non-2xx, ${result.timeouts} timeouts)
latency:    p50 ${figures.p50_ms} ms, p95 ${figures.p95_ms} ms, p99 ${figures.p99_ms} ms
target:     zero errors and p95 under 100 ms — ${errors === 0 && figures.p95_ms < 100 ? "met" : "NOT met"}`);
  console.log(JSON.stringify(figures));
}

try {
  await main();
} finally {
  for (const stop of stops.reverse()) await stop();
  rmSync(work, { recursive: true, force: true });
}
