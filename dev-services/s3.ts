import type { ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, writeFileSync } from "node:fs";
import { userInfo } from "node:os";
import path from "node:path";
import { CreateBucketCommand } from "@aws-sdk/client-s3";
import { makeS3Client } from "../server/storage/storage";
import { freePorts, portIsFree, run, spawnTied, stopChild, waitForHttp } from "./processes";
import { giveTo, isRoot, reachableFolder } from "./service-user";
import { proxyConf, serveScript, storageServerConf, storageServers, swiftConf, type StorageServer, type SwiftPorts, type SwiftSettings } from "./swift-config";

/**
 * The local S3-compatible stand-in: Debian's OpenStack Swift with its S3 layer (s3api), tempauth and
 * memcached, all in one private folder, on loopback ports of its own. Unlike simpler stand-ins it
 * verifies every signature, so tests can prove that Kerf's presigned URLs are scoped.
 * Each daemon runs in the foreground, tied to this process (spawnTied): if it dies, they die too.
 */
export interface S3StandIn {
  endpoint: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** The settings the app reads (server/env.ts), ready to spread into an env. */
  env: Record<string, string>;
  stop(): Promise<void>;
}

export interface S3StandInOptions {
  /** The S3 endpoint's port (Swift's proxy). */
  port: number;
  /** The folder for everything: configuration, rings, data, logs. Reused when it exists. */
  dataDir: string;
  /** Account, container and object servers and memcached; free ones are picked when absent. */
  backendPorts?: Omit<SwiftPorts, "proxy">;
  bucket?: string;
  origins: string[];
}

/** What a folder keeps between starts: its hash suffix, its key and the ports its rings name. */
interface FolderState {
  hashSuffix: string;
  key: string;
  ports?: SwiftPorts;
}

const ACCOUNT = "kerf";
const USER = "dev";
// Debian's Python, which has Swift (a python3 earlier on PATH may not).
const PYTHON = "/usr/bin/python3";
const swiftUser = () => (isRoot() ? "swift" : userInfo().username);
const swiftRunAs = () => (isRoot() ? "swift" : null);
// Each daemon's start is mostly imports. Eventlet's DNS support costs a fifth of a second (all here is
// loopback); setuptools' own copy of distutils, which eventlet pulls in, costs twice that of Python's.
const pythonEnv = { ...process.env, EVENTLET_NO_GREENDNS: "yes", SETUPTOOLS_USE_DISTUTILS: "stdlib" };

export async function startS3StandIn(options: S3StandInOptions): Promise<S3StandIn> {
  const bucket = options.bucket ?? "kerf-rushes";
  const folder = await prepareFolder(options);
  const { settings } = folder;
  const daemons = new Daemons(settings.dir);
  try {
    await startServers(daemons, folder);
    const endpoint = `http://127.0.0.1:${settings.ports.proxy}`;
    const accessKeyId = `${ACCOUNT}:${USER}`;
    await daemons.whileRunning(ensureBucket(endpoint, bucket, accessKeyId, settings.key));
    return {
      endpoint,
      bucket,
      accessKeyId,
      secretAccessKey: settings.key,
      env: {
        S3_ENDPOINT: endpoint,
        S3_REGION: "us-east-1",
        S3_BUCKET: bucket,
        S3_ACCESS_KEY_ID: accessKeyId,
        S3_SECRET_ACCESS_KEY: settings.key,
        S3_FORCE_PATH_STYLE: "true",
      },
      stop: () => daemons.stop(),
    };
  } catch (error) {
    await daemons.stop();
    throw error;
  }
}

/** A folder ready for a start: its settings, the ports its rings name, and how to record new ones. */
interface PreparedFolder {
  settings: SwiftSettings;
  recorded?: SwiftPorts;
  /** Notes this start's ports as the rings' own: called only once the rings name them. */
  rememberPorts(): void;
}

/** The folder, its kept state, the ports for this start and the configuration files, written. */
async function prepareFolder(options: S3StandInOptions): Promise<PreparedFolder> {
  const dir = reachableFolder(path.resolve(options.dataDir), swiftUser(), "s3");
  mkdirSync(path.join(dir, "devices", "d1"), { recursive: true });
  mkdirSync(path.join(dir, "logs"), { recursive: true });
  const stateFile = path.join(dir, "stand-in.json");
  const state: FolderState = existsSync(stateFile)
    ? (JSON.parse(readFileSync(stateFile, "utf8")) as FolderState)
    : { hashSuffix: randomBytes(16).toString("hex"), key: randomBytes(18).toString("base64url") };
  const ports: SwiftPorts = { proxy: options.port, ...(options.backendPorts ?? (await backendPorts(options.port, state.ports))) };
  await mustBeFree(ports);
  const settings: SwiftSettings = { dir, ports, user: swiftUser(), hashSuffix: state.hashSuffix, account: ACCOUNT, userName: USER, key: state.key, origins: options.origins };

  // The configuration holds the key: readable by the servers' user only. The rings are public.
  const files: Record<string, string> = { "swift.conf": swiftConf(settings), "proxy-server.conf": proxyConf(settings), "serve.py": serveScript };
  for (const server of storageServers) files[`${server}-server.conf`] = storageServerConf(settings, server);
  for (const [name, text] of Object.entries(files)) writeFileSync(path.join(dir, name), text, { mode: 0o600 });
  giveTo(settings.user, dir, path.join(dir, "devices"), path.join(dir, "devices", "d1"), ...Object.keys(files).map((name) => path.join(dir, name)));
  const rememberPorts = () => writeFileSync(stateFile, JSON.stringify({ ...state, ports }, null, 2), { mode: 0o600 });
  return { settings, recorded: state.ports, rememberPorts };
}

/** memcached and the four servers, each answering its health check; the rings built when the ports moved. */
async function startServers(daemons: Daemons, { settings, recorded, rememberPorts }: PreparedFolder): Promise<void> {
  const { dir, ports } = settings;
  // The storage servers read no ring: they start while the rings are built; the proxy needs them.
  daemons.start("memcached", "memcached", ["-l", "127.0.0.1", "-p", String(ports.memcached), "-U", "0", "-m", "32"], isRoot() ? "memcache" : null);
  const serve = (server: StorageServer | "proxy") => daemons.start(server, PYTHON, [path.join(dir, "serve.py"), dir, server, path.join(dir, `${server}-server.conf`), "-v"], swiftRunAs());
  for (const server of storageServers) serve(server);
  // A start stopped while the rings are built must not leave them recorded for ports they don't name.
  if (!ringsMatch(dir, recorded, ports)) await daemons.whileRunning(buildRings(dir, ports));
  rememberPorts();
  serve("proxy");
  const servers = ["account", "container", "object", "proxy"] as const;
  await daemons.whileRunning(Promise.all(servers.map((s) => waitForHttp(`http://127.0.0.1:${ports[s]}/healthcheck`, 60_000))));
}

/** The ports the folder's rings already name when they are still free; otherwise new free ones. */
async function backendPorts(proxy: number, recorded: SwiftPorts | undefined): Promise<Omit<SwiftPorts, "proxy">> {
  if (recorded) {
    const { proxy: _proxy, ...backends } = recorded;
    const free = await Promise.all(Object.values(backends).map(portIsFree));
    if (free.every(Boolean) && !Object.values(backends).includes(proxy)) return backends;
  }
  const [account, container, object, memcached] = (await freePorts(5)).filter((port) => port !== proxy);
  return { account: account!, container: container!, object: object!, memcached: memcached! };
}

/** A taken port would only show as a daemon that stops after its bind timeout: say so at once instead. */
async function mustBeFree(ports: SwiftPorts): Promise<void> {
  for (const [server, port] of Object.entries(ports)) {
    if (!(await portIsFree(port))) throw new Error(`port ${port} (the S3 stand-in's ${server === "memcached" ? "memcached" : `${server} server`}) is in use`);
  }
}

function ringsMatch(dir: string, recorded: SwiftPorts | undefined, ports: SwiftPorts): boolean {
  if (!recorded || storageServers.some((s) => recorded[s] !== ports[s])) return false;
  return storageServers.every((s) => existsSync(path.join(dir, `${s}.ring.gz`)));
}

/**
 * One device and one replica per ring, 2^6 partitions. Built with Swift's own RingBuilder (what
 * swift-ring-builder runs) in one Python process: nine swift-ring-builder runs cost ten times the CPU,
 * which on a busy machine was most of the stand-in's start.
 */
const ringScript = `
import sys
from swift.common.ring import RingBuilder
folder = sys.argv[1]
for name, port in zip(("account", "container", "object"), sys.argv[2:5]):
    builder = RingBuilder(6, 1, 1)
    builder.add_dev({"region": 1, "zone": 1, "ip": "127.0.0.1", "port": int(port), "device": "d1", "weight": 1})
    builder.rebalance()
    builder.save(f"{folder}/{name}.builder")
    builder.get_ring().save(f"{folder}/{name}.ring.gz")
`;

async function buildRings(dir: string, ports: SwiftPorts): Promise<void> {
  const code = await run(PYTHON, ["-c", ringScript, dir, ...storageServers.map((s) => String(ports[s]))], { stdio: ["ignore", "ignore", "inherit"], env: pythonEnv });
  if (code !== 0) throw new Error(`building the storage stand-in's rings failed (${code})`);
}

async function ensureBucket(endpoint: string, bucket: string, accessKeyId: string, secretAccessKey: string): Promise<void> {
  const client = makeS3Client({ endpoint, region: "us-east-1", bucket, accessKeyId, secretAccessKey, forcePathStyle: true });
  try {
    await client.send(new CreateBucketCommand({ Bucket: bucket }));
  } catch (error) {
    if (!["BucketAlreadyOwnedByYou", "BucketAlreadyExists"].includes((error as Error).name)) throw error;
  } finally {
    client.destroy();
  }
}

/** The stand-in's processes: each logs to its own file in the folder and dies with this process. */
class Daemons {
  private children: { name: string; child: ChildProcess }[] = [];
  private exited: Promise<never>;
  private rejectExit: (error: Error) => void = () => undefined;

  constructor(private readonly dir: string) {
    this.exited = new Promise<never>((_, reject) => (this.rejectExit = reject));
    this.exited.catch(() => undefined);
  }

  start(name: string, command: string, args: string[], asUser: string | null): void {
    const log = openSync(path.join(this.dir, "logs", `${name}.log`), "a");
    const child = spawnTied(command, args, { stdio: ["ignore", log, log], env: pythonEnv, asUser });
    closeSync(log);
    child.once("exit", (code, signal) => this.rejectExit(new Error(`${name} stopped (${signal ?? code}); see ${path.join(this.dir, "logs", `${name}.log`)}:\n${this.tail(name)}`)));
    this.children.push({ name, child });
  }

  /** Waits for `work`, failing at once if a daemon exits first (a port taken, a bad setting). */
  whileRunning<T>(work: Promise<T>): Promise<T> {
    return Promise.race([work, this.exited]);
  }

  private tail(name: string): string {
    const text = readFileSync(path.join(this.dir, "logs", `${name}.log`), "utf8");
    return text.split("\n").slice(-15).join("\n");
  }

  async stop(): Promise<void> {
    const children = this.children;
    this.children = [];
    await Promise.all(children.map(({ child }) => stopChild(child)));
  }
}
