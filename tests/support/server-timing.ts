import http, { type IncomingMessage, type Server, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";

export interface Timing {
  /** The request's `x-timing-label` header: lets a test pick out the requests it means. */
  label: string;
  method: string;
  url: string;
  status: number;
  /** From the request's headers arriving to the answer's last byte handed to the socket. */
  ms: number;
}

/**
 * Measures each request the server handles, inside the server (process.hrtime), so the figure is
 * the server's own cost and not the test client's or the machine's scheduling around it.
 */
export function timeRequests(server: Server) {
  const timings: Timing[] = [];
  const listener = (req: IncomingMessage, res: ServerResponse) => {
    const start = process.hrtime.bigint();
    res.once("finish", () => {
      timings.push({ label: String(req.headers["x-timing-label"] ?? ""), method: req.method ?? "", url: req.url ?? "", status: res.statusCode, ms: Number(process.hrtime.bigint() - start) / 1e6 });
    });
  };
  server.prependListener("request", listener);
  return {
    timings,
    stop: () => void server.off("request", listener),
    average: (pick: (t: Timing) => boolean = () => true) => {
      const chosen = timings.filter(pick);
      return chosen.reduce((sum, t) => sum + t.ms, 0) / Math.max(1, chosen.length);
    },
    /**
     * The middle request's time: what a request costs the server. On a busy machine other work
     * lands in the slow tail (the average moves with the machine), not in the middle.
     */
    median: (pick: (t: Timing) => boolean = () => true) => {
      const sorted = timings
        .filter(pick)
        .map((t) => t.ms)
        .sort((a, b) => a - b);
      return sorted[Math.floor(sorted.length / 2)] ?? 0;
    },
  };
}

/** A JSON text nested `depth` arrays deep at one key: `{"<key>":[[[…]]]}`. */
export const deeplyNested = (depth: number, key = "name") => `{"${key}":${"[".repeat(depth)}${"]".repeat(depth)}}`;

/**
 * The CPU time this process spends on the middle one of `times` calls in a row (after a few to warm
 * the code up): the server's cost of a request plus the test client's, which bounds the server's from
 * above. CPU time, unlike the clock, doesn't grow while the machine gives the process no turn, so
 * the figure holds on a busy machine too. The middle call, not the average: the process's CPU time
 * also counts its other threads and a garbage collection, which land on a few calls (one such burst
 * once made a 2 ms average read 9.7 ms).
 */
export async function cpuMsPerCall(times: number, call: () => Promise<unknown>, warmUps = 10): Promise<number> {
  for (let i = 0; i < warmUps; i++) await call();
  const each: number[] = [];
  for (let i = 0; i < times; i++) {
    const start = process.cpuUsage();
    await call();
    const used = process.cpuUsage(start);
    each.push((used.user + used.system) / 1000);
  }
  return each.sort((a, b) => a - b)[Math.floor(times / 2)]!;
}

/** A plain HTTP client on one kept-alive connection: as little client work per request as Node allows. */
export function plainClient(server: Server) {
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const { port } = server.address() as AddressInfo;
  return {
    send(method: string, path: string, body: string, headers: Record<string, string> = {}): Promise<{ status: number; text: string }> {
      return new Promise((resolve, reject) => {
        const req = http.request({ host: "127.0.0.1", port, method, path, agent, headers: { "content-type": "application/json", ...headers } }, (res) => {
          const chunks: Buffer[] = [];
          res.on("data", (chunk: Buffer) => chunks.push(chunk));
          res.on("end", () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString() }));
        });
        req.on("error", reject);
        req.end(body);
      });
    },
    close: () => agent.destroy(),
  };
}
