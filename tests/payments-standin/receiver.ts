import http from "node:http";
import type { AddressInfo } from "node:net";

/**
 * A webhook endpoint of the test's own: it keeps every request's raw body and Stripe-Signature
 * header, in the order they came, and answers 200 unless told to answer otherwise first.
 */
export interface Received {
  body: string;
  signature: string;
}

export interface Receiver {
  url: string;
  port: number;
  received: Received[];
  /** The statuses to answer the next requests with, in order; 200 after them. */
  answerNext(...statuses: number[]): void;
  close(): Promise<void>;
}

export async function startReceiver(port = 0): Promise<Receiver> {
  const received: Received[] = [];
  const answers: number[] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (chunk: Buffer) => chunks.push(chunk));
    req.on("end", () => {
      received.push({ body: Buffer.concat(chunks).toString("utf8"), signature: String(req.headers["stripe-signature"]) });
      const status = answers.shift() ?? 200;
      res.writeHead(status, status >= 300 && status < 400 ? { location: "http://127.0.0.1:9/elsewhere" } : {}).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(port, "127.0.0.1", () => resolve()));
  const actualPort = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${actualPort}/webhook`,
    port: actualPort,
    received,
    answerNext: (...statuses) => answers.push(...statuses),
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
