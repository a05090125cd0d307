import { execFileSync } from "node:child_process";
import type { ChildProcess } from "node:child_process";
import http from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signIn } from "../../dev-services/bench/measure";
import { repoRoot } from "../../dev-services/paths";
import { spawnTied, stopChild } from "../../dev-services/processes";
import { createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createTestDatabase, type TestDatabase } from "../support/database";
import { testEnv } from "../support/test-env";

/*
 * Real server processes (`npm run serve`'s entry) on one database, as several machines behind a
 * balancer would be: what one process counts or keeps must hold for the others.
 */
let database: TestDatabase;
const running: ChildProcess[] = [];
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(async () => {
  for (const child of running) await stopChild(child);
  await database.drop();
});

/** `server/index.ts` with `workers` processes on the test database; resolves to its address once it serves. */
function serve(workers: number): Promise<{ url: string; pid: number }> {
  const child = spawnTied(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "pipe", "inherit"],
    env: {
      ...process.env,
      NODE_ENV: "test",
      HOST: "127.0.0.1",
      PORT: "0",
      KERF_WORKERS: String(workers),
      DATABASE_URL: database.url,
      SESSION_SECRET: "processes-test-secret-processes-test-secret",
      SMTP_PORT: String(testEnv.smtpPort),
      S3_ENDPOINT: testEnv.s3.endpoint,
      S3_BUCKET: testEnv.s3.bucket,
      S3_ACCESS_KEY_ID: testEnv.s3.accessKeyId,
      S3_SECRET_ACCESS_KEY: testEnv.s3.secretAccessKey,
      PAYMENTS_API_URL: testEnv.payments.apiUrl,
      PAYMENTS_SECRET_KEY: testEnv.payments.secretKey,
      PAYMENTS_WEBHOOK_SECRET: testEnv.payments.webhookSecret,
    },
  });
  running.push(child);
  return new Promise((resolve, reject) => {
    let out = "";
    child.stdout!.on("data", (chunk: Buffer) => {
      out += chunk.toString();
      const serving = /Kerf is serving (\S+)/.exec(out);
      if (serving) resolve({ url: serving[1]!, pid: child.pid! });
    });
    child.once("exit", (code) => reject(new Error(`the server ended while starting (code ${code})`)));
  });
}

async function visitor(url: string) {
  const me = await fetch(`${url}/api/auth/me`);
  const cookie = me.headers.getSetCookie().map((line) => line.split(";")[0]).join("; ");
  return { cookie, csrf: ((await me.json()) as { csrfToken: string }).csrfToken };
}

const signInTo = (url: string, as: { cookie: string; csrf: string }, email: string, password: string) =>
  fetch(`${url}/api/auth/sign-in`, { method: "POST", headers: { cookie: as.cookie, "x-csrf-token": as.csrf, "content-type": "application/json" }, body: JSON.stringify({ email, password }) });

/** One request on a connection of its own (fetch would keep one open): the processes take new connections in turn. */
function onNewConnection(url: string, options: { method?: string; headers: Record<string, string>; body?: string }): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const request = http.request(url, { method: options.method ?? "GET", headers: options.headers, agent: false }, (response) => {
      let body = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (body += chunk));
      response.on("end", () => resolve({ status: response.statusCode!, body }));
    });
    request.on("error", reject);
    request.end(options.body);
  });
}

describe("several server processes on one database", () => {
  it("when wrong passwords for one account go to two processes in turn, then the limit counts them together", async () => {
    const [a, b] = await Promise.all([serve(1), serve(1)]);
    const person = await createUser(database.db);
    const guesser = await visitor(a.url);
    // The default limit: five wrong passwords for one account from one address in fifteen minutes.
    for (let i = 0; i < 5; i++) expect((await signInTo(i % 2 ? b.url : a.url, guesser, person.email, `wrong-${i}`)).status).toBe(401);
    expect((await signInTo(b.url, guesser, person.email, "wrong-again")).status).toBe(429);
    expect((await signInTo(a.url, guesser, person.email, person.password)).status).toBe(429);
  }, 400_000);

  it("when one server runs two processes, then both serve, and a board read after each move shows it whichever process answers", async () => {
    const server = await serve(2);
    const children = execFileSync("ps", ["-o", "pid=", "--ppid", String(server.pid)]).toString().trim().split("\n");
    expect(children).toHaveLength(2);

    const { channel, owner } = await createCrewedChannel(database.db);
    const card = await createEpisode(database.db, channel.id, { title: "Moving", stage: "build", rank: "a1" });
    await createEpisode(database.db, channel.id, { title: "Staying", stage: "build", rank: "a2" });
    const session = await signIn(server.url, owner);
    const headers = { cookie: session.cookie, accept: "application/json" };
    const boardPath = `${server.url}/api/channels/${channel.id}/episodes`;
    let version = card.version;
    for (const stage of ["shoot", "build", "edit", "build", "shoot", "build"]) {
      expect((await onNewConnection(boardPath, { headers })).status).toBe(200);
      const moved = await onNewConnection(`${server.url}/api/channels/${channel.id}/episodes/${card.id}/move`, {
        method: "POST",
        headers: { ...headers, "content-type": "application/json", "x-csrf-token": session.csrf },
        body: JSON.stringify({ version, stage, reason: "Moving on for the test." }),
      });
      expect(moved.status, moved.body).toBe(200);
      version = (JSON.parse(moved.body) as { episode: { version: number } }).episode.version;
      for (let read = 0; read < 2; read++) {
        const board = JSON.parse((await onNewConnection(boardPath, { headers })).body) as { episodes: { id: string; stage: string; version: number }[] };
        expect(board.episodes.find((e) => e.id === card.id)).toMatchObject({ stage, version });
      }
    }
  }, 400_000);
});
