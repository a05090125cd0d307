import { spawnSync } from "node:child_process";
import { accessSync, constants, existsSync, mkdirSync, readdirSync, rmSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import { giveTo, isRoot, reachableFolder } from "./service-user";

/**
 * A private PostgreSQL cluster for one checkout: loopback only, its own port, trust auth for the
 * `kerf` role. initdb and pg_ctl refuse to run as root, so as root they run as the `postgres` user,
 * which must be able to enter every parent folder of the data folder.
 */
export interface Cluster {
  dataDir: string;
  port: number;
  url(database: string): string;
  stop(): void;
}

const SUPERUSER = "kerf";

export function postgresBinDir(): string {
  const base = "/usr/lib/postgresql";
  const versions = existsSync(base) ? readdirSync(base).filter((v) => existsSync(path.join(base, v, "bin", "initdb"))) : [];
  const newest = versions.sort((a, b) => Number(b) - Number(a))[0];
  if (!newest) {
    throw new Error("PostgreSQL server binaries are missing: run `npm start` (it installs Debian's postgresql) or `apt-get install -y postgresql`.");
  }
  return path.join(base, newest, "bin");
}

function runPg(bin: string, args: string[], opts: { quiet?: boolean } = {}): void {
  const [cmd, cmdArgs] = isRoot() ? ["runuser", ["-u", "postgres", "--", bin, ...args]] : [bin, args];
  const result = spawnSync(cmd, cmdArgs, { stdio: opts.quiet ? "pipe" : "inherit", encoding: "utf8" });
  if (result.status !== 0) {
    throw new Error(`${path.basename(bin)} failed (${result.status}): ${result.stderr ?? ""}${result.stdout ?? ""}`);
  }
}

function initCluster(bin: string, dataDir: string): void {
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  giveTo("postgres", dataDir);
  runPg(path.join(bin, "initdb"), ["-D", dataDir, "-U", SUPERUSER, "--auth=trust", "--encoding=UTF8", "--locale=C.UTF-8", "--no-sync"], { quiet: true });
}

export function isPortOpen(port: number): boolean {
  // pg_isready exits 0 when the server accepts connections.
  return spawnSync(path.join(postgresBinDir(), "pg_isready"), ["-h", "127.0.0.1", "-p", String(port), "-q"]).status === 0;
}

/** Server settings for a cluster that takes millions of rows at once (the benchmarks' crowd): memory and WAL room. */
export const BULK_LOAD_SETTINGS = ["shared_buffers=2GB", "max_wal_size=16GB", "checkpoint_timeout=1h", "wal_level=minimal", "max_wal_senders=0", "work_mem=64MB"];

export function startCluster(options: { dataDir: string; port: number; fresh?: boolean; settings?: string[] }): Cluster {
  const bin = postgresBinDir();
  const dataDir = reachableFolder(options.dataDir, "postgres", "pg");
  if (options.fresh && existsSync(dataDir)) {
    if (isPortOpen(options.port)) stopAt(bin, dataDir);
    rmSync(dataDir, { recursive: true, force: true });
  }
  if (!existsSync(path.join(dataDir, "PG_VERSION"))) initCluster(bin, dataDir);
  accessSync(dataDir, constants.F_OK);

  let startedHere = false;
  if (!isPortOpen(options.port)) {
    const settings = `-c listen_addresses=127.0.0.1 -p ${options.port} -c unix_socket_directories='' -c fsync=off -c max_connections=200${(options.settings ?? []).map((setting) => ` -c ${setting}`).join("")}`;
    runPg(path.join(bin, "pg_ctl"), ["-D", dataDir, "-o", settings, "-l", path.join(dataDir, "server.log"), "-w", "-t", "60", "start"], { quiet: true });
    startedHere = true;
  }
  const url = (database: string) => `postgres://${SUPERUSER}@127.0.0.1:${options.port}/${database}`;
  return {
    dataDir,
    port: options.port,
    url,
    stop: () => {
      if (startedHere) stopAt(bin, dataDir);
    },
  };
}

/** A cluster left running by a run that was killed (pg_ctl starts it detached): stopped at once. */
export function stopLeftoverCluster(dataDir: string): void {
  if (existsSync(path.join(dataDir, "postmaster.pid"))) stopAt(postgresBinDir(), dataDir, "immediate");
}

function stopAt(bin: string, dataDir: string, mode: "fast" | "immediate" = "fast"): void {
  try {
    runPg(path.join(bin, "pg_ctl"), ["-D", dataDir, "-m", mode, "-w", "stop"], { quiet: true });
  } catch (error) {
    console.error(`[postgres] stop failed: ${(error as Error).message}`);
  }
}

export async function ensureDatabase(cluster: Cluster, name: string, template?: string): Promise<string> {
  const admin = new pg.Client({ connectionString: cluster.url("postgres") });
  await admin.connect();
  try {
    const found = await admin.query("select 1 from pg_database where datname = $1", [name]);
    if (found.rowCount === 0) {
      const from = template ? ` template "${template}"` : "";
      await admin.query(`create database "${name}"${from}`);
    }
  } finally {
    await admin.end();
  }
  return cluster.url(name);
}

export async function dropDatabase(cluster: Cluster, name: string): Promise<void> {
  const admin = new pg.Client({ connectionString: cluster.url("postgres") });
  await admin.connect();
  try {
    await admin.query(`drop database if exists "${name}" with (force)`);
  } finally {
    await admin.end();
  }
}
