import cluster, { type Worker } from "node:cluster";
import { fileURLToPath } from "node:url";
import { readEnv } from "./env";
import type { RunningServer } from "./index";

/**
 * Several server processes on one port (node:cluster: the first process hands each new connection to
 * the next worker in turn), as several machines behind a balancer would be: they share only
 * PostgreSQL and storage. What each keeps in memory is listed, with why it is safe, in
 * docs/decisions/0012-server-processes-share-only-postgres.md.
 */
const workerEntry = fileURLToPath(new URL("./index.ts", import.meta.url));
const STOP_MS = 10_000;

/**
 * Starts `KERF_WORKERS` server processes with these settings (`source` as process.env would hold
 * them); with one, the server runs in this process. A worker that dies unasked is started again.
 */
export async function startServers(start: () => Promise<RunningServer>, source: NodeJS.ProcessEnv = process.env): Promise<RunningServer> {
  const count = readEnv(source).KERF_WORKERS;
  if (count === 1) return start();
  cluster.setupPrimary({ exec: workerEntry, execArgv: process.execArgv });
  const env = Object.fromEntries(Object.entries(source).filter((entry): entry is [string, string] => entry[1] !== undefined));
  let stopping = false;
  const fork = () => cluster.fork(env);
  const onExit = (worker: Worker, code: number | null, signal: string | null) => {
    if (stopping) return;
    console.error(`[kerf] server process ${worker.process.pid} ended (${signal ?? `code ${code}`}); starting another`);
    fork();
  };
  // The first starts alone, so on a new database the others find the job queues made instead of
  // making them at the same moment (makeQueue copes with that too, by trying again).
  const { port } = await listeningOrExit(fork());
  await Promise.all(Array.from({ length: count - 1 }, () => listeningOrExit(fork())));
  cluster.on("exit", onExit);
  return {
    url: `http://${readEnv(source).HOST}:${port}`,
    async stop() {
      stopping = true;
      cluster.off("exit", onExit);
      await Promise.all(Object.values(cluster.workers ?? {}).map((worker) => worker && stopWorker(worker)));
    },
  };
}

/** The worker's address once it listens; its exit before that fails the start. */
function listeningOrExit(worker: Worker): Promise<{ port: number }> {
  return new Promise((resolve, reject) => {
    worker.once("listening", (address) => resolve({ port: address.port }));
    worker.once("exit", (code) => reject(new Error(`a server process ended while starting (code ${code})`)));
  });
}

/** SIGTERM lets the worker drain its requests (server/index.ts); one still running after ten seconds is killed. */
function stopWorker(worker: Worker): Promise<void> {
  return new Promise((resolve) => {
    if (worker.isDead()) return resolve();
    const kill = setTimeout(() => worker.process.kill("SIGKILL"), STOP_MS);
    worker.once("exit", () => {
      clearTimeout(kill);
      resolve();
    });
    worker.process.kill("SIGTERM");
  });
}
