import { spawn, type ChildProcess, type SpawnOptions } from "node:child_process";
import net from "node:net";

/** A free loopback port, found by letting the kernel pick one. */
export async function freePort(): Promise<number> {
  const [port] = await freePorts(1);
  return port!;
}

/** Several different free loopback ports: each is held until all are picked, so none comes twice. */
export async function freePorts(count: number): Promise<number[]> {
  const servers = await Promise.all(
    Array.from(
      { length: count },
      () =>
        new Promise<net.Server>((resolve, reject) => {
          const server = net.createServer();
          server.unref();
          server.on("error", reject);
          server.listen(0, "127.0.0.1", () => resolve(server));
        }),
    ),
  );
  const ports = servers.map((server) => (server.address() as net.AddressInfo).port);
  await Promise.all(servers.map((server) => new Promise((resolve) => server.close(resolve))));
  return ports;
}

/** Whether a loopback port can be listened on right now. */
export function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.unref();
    server.once("error", () => resolve(false));
    server.listen(port, "127.0.0.1", () => server.close(() => resolve(true)));
  });
}

export async function waitForHttp(url: string, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const response = await fetch(url);
      if (response.status < 500) return;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/**
 * Starts a process that dies with this one: `setpriv --pdeathsig` sends it SIGTERM when this process
 * ends, even by SIGKILL, so no service outlives its run. `asUser` drops to that user first (as root).
 */
export function spawnTied(command: string, args: string[], options: SpawnOptions & { asUser?: string | null } = {}): ChildProcess {
  const { asUser, ...spawnOptions } = options;
  const identity = asUser ? ["--reuid", asUser, "--regid", asUser, "--init-groups"] : [];
  return spawn("setpriv", [...identity, "--pdeathsig", "TERM", "--", command, ...args], spawnOptions);
}

/** Runs a command to completion, streaming its output; resolves to its exit code. */
export function run(command: string, args: string[], options: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve) => {
    const child = spawnTied(command, args, { stdio: "inherit", ...options });
    child.on("exit", (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on("error", () => resolve(127));
  });
}

/** Runs a command to completion keeping its output (stdout and stderr as they came); resolves to its exit code and that output. */
export function runCollected(command: string, args: string[], options: SpawnOptions = {}): Promise<{ code: number; output: string }> {
  return new Promise((resolve) => {
    const child = spawnTied(command, args, { ...options, stdio: ["ignore", "pipe", "pipe"] });
    const chunks: Buffer[] = [];
    child.stdout?.on("data", (chunk: Buffer) => chunks.push(chunk));
    child.stderr?.on("data", (chunk: Buffer) => chunks.push(chunk));
    child.on("close", (code, signal) => resolve({ code: code ?? (signal ? 1 : 0), output: Buffer.concat(chunks).toString() }));
    child.on("error", (error) => resolve({ code: 127, output: String(error) }));
  });
}

export function stopChild(child: ChildProcess | undefined): Promise<void> {
  return new Promise((resolve) => {
    if (!child || child.exitCode !== null || child.signalCode !== null) return resolve();
    const timer = setTimeout(() => child.kill("SIGKILL"), 5_000);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill("SIGTERM");
  });
}
