import type { IncomingMessage, Server, ServerResponse } from "node:http";

export interface Timing {
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
      timings.push({ method: req.method ?? "", url: req.url ?? "", status: res.statusCode, ms: Number(process.hrtime.bigint() - start) / 1e6 });
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
  };
}

/** A JSON text nested `depth` arrays deep at one key: `{"<key>":[[[…]]]}`. */
export const deeplyNested = (depth: number, key = "name") => `{"${key}":${"[".repeat(depth)}${"]".repeat(depth)}}`;
