import type { Server } from "node:http";
import request from "supertest";
import { createApp, mailRenderers } from "../../server/app";
import { readEnv } from "../../server/env";
import { startJobs, type Jobs } from "../../server/jobs/queue";
import { createMailer } from "../../server/mail/mailer";
import type { SignInLimits } from "../../server/auth/rate-limits";
import { CSRF_HEADER } from "../../server/http/csrf";
import type { AppDeps } from "../../server/seams/app-deps";
import { createS3Storage, storageSettingsFrom, type Storage } from "../../server/storage/storage";
import { createTestDatabase, type TestDatabase } from "./database";
import { testEnv } from "./test-env";

export interface TestApp {
  server: Server;
  database: TestDatabase;
  db: TestDatabase["db"];
  deps: AppDeps;
  jobs: Jobs;
  /** Starts this app's mail worker (already running unless the app was started with `holdMail`). */
  startMailWorker(): Promise<void>;
  /** A visitor with its own cookie jar, holding a CSRF token. */
  visitor(): Promise<Visitor>;
  /** A visitor already signed in as this person. */
  signedIn(person: { email: string; password: string }): Promise<Visitor>;
  close(): Promise<void>;
}

export interface Visitor {
  agent: request.Agent;
  csrf: string;
  get(path: string): request.Test;
  send(method: "post" | "put" | "patch" | "delete", path: string, body?: unknown): request.Test;
  refreshCsrf(): Promise<void>;
}

export interface TestAppOptions {
  signInLimits?: SignInLimits;
  storage?: (real: Storage) => Storage;
  /** Another app's database (two instances on one database) or one on a private cluster. */
  database?: TestDatabase;
  /** A mail server of the test's own (e.g. one it stops and starts). */
  smtpPort?: number;
  /** A storage stand-in of the test's own (e.g. one it stops and starts). */
  s3?: { endpoint: string; bucket: string; accessKeyId: string; secretAccessKey: string };
  /** Behind a proxy: the caller's address is read from X-Forwarded-For, so a test can call from several. */
  trustProxy?: boolean;
  /** Queue mail but send none until the test calls `startMailWorker` (to line up a queue first). */
  holdMail?: boolean;
  /** A payments account of the test's own (createPaymentsAccount); else the stand-in's default account. */
  payments?: { apiUrl: string; secretKey: string; webhookSecret: string };
  /** A built client to serve (a test's own folder); else none unless one was built into dist/client. */
  clientDist?: string;
}

export async function startTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const database = options.database ?? (await createTestDatabase());
  const env = readEnv({
    NODE_ENV: "test",
    DATABASE_URL: database.url,
    SESSION_SECRET: "test-secret-test-secret-test-secret-0123",
    SMTP_PORT: String(options.smtpPort ?? testEnv.smtpPort),
    APP_URL: "http://kerf.test",
    S3_ENDPOINT: (options.s3 ?? testEnv.s3).endpoint,
    S3_BUCKET: (options.s3 ?? testEnv.s3).bucket,
    S3_ACCESS_KEY_ID: (options.s3 ?? testEnv.s3).accessKeyId,
    S3_SECRET_ACCESS_KEY: (options.s3 ?? testEnv.s3).secretAccessKey,
    TRUST_PROXY: options.trustProxy ? "true" : "false",
    PAYMENTS_API_URL: (options.payments ?? testEnv.payments).apiUrl,
    PAYMENTS_SECRET_KEY: (options.payments ?? testEnv.payments).secretKey,
    PAYMENTS_WEBHOOK_SECRET: (options.payments ?? testEnv.payments).webhookSecret,
    ...(options.clientDist ? { CLIENT_DIST: options.clientDist } : {}),
  });
  const mailer = createMailer(env);
  const jobs = await startJobs({ databaseUrl: database.url, mailer, pollSeconds: 0.5 });
  const realStorage = createS3Storage(storageSettingsFrom(env));
  // A test may wrap the real store (e.g. to take it down mid-request).
  const storage = options.storage ? options.storage(realStorage) : realStorage;
  const deps: AppDeps = { env, database, mailer, jobs, storage };
  const startMailWorker = () => jobs.startMailWorker(mailRenderers(deps));
  if (!options.holdMail) await startMailWorker();
  const app = createApp(deps, { signInLimits: options.signInLimits ?? { perAccount: 5, perAddress: 1000, signUpsPerAddress: 1000, resetsPerAddress: 1000, windowMs: 60_000 } });
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, "127.0.0.1", () => resolve(s));
  });

  async function visitor(): Promise<Visitor> {
    const agent = request.agent(server);
    const v: Visitor = {
      agent,
      csrf: "",
      get: (path) => agent.get(path),
      send: (method, path, body) => {
        const test = agent[method](path).set(CSRF_HEADER, v.csrf);
        return body === undefined ? test : test.send(body as object);
      },
      async refreshCsrf() {
        v.csrf = (await agent.get("/api/auth/me").expect(200)).body.csrfToken;
      },
    };
    await v.refreshCsrf();
    return v;
  }

  return {
    server,
    database,
    db: database.db,
    deps,
    jobs,
    startMailWorker,
    visitor,
    async signedIn(person) {
      const v = await visitor();
      const response = await v.send("post", "/api/auth/sign-in", { email: person.email, password: person.password });
      if (response.status !== 200) throw new Error(`sign-in failed: ${response.status} ${JSON.stringify(response.body)}`);
      v.csrf = response.body.csrfToken;
      return v;
    },
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await jobs.stop();
      mailer.close();
      // A database handed in belongs to the caller, who drops it.
      if (!options.database) await database.drop();
    },
  };
}
