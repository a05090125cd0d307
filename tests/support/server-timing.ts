import type { IncomingMessage, Server, ServerResponse } from "node:http";

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
