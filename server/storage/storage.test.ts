import net from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createS3Storage, viaStorage } from "./storage";

/** A store that accepts connections and never answers: a hung endpoint, not a refused one. */
let silent: net.Server;
let sockets: net.Socket[] = [];
let endpoint: string;

beforeAll(async () => {
  silent = net.createServer((socket) => sockets.push(socket));
  await new Promise<void>((resolve) => silent.listen(0, "127.0.0.1", resolve));
  endpoint = `http://127.0.0.1:${(silent.address() as net.AddressInfo).port}`;
});
afterAll(async () => {
  for (const socket of sockets) socket.destroy();
  sockets = [];
  await new Promise((resolve) => silent.close(resolve));
});

describe("a store that takes the connection and never answers", () => {
  it("then a call gives up after the idle timeout and answers as storage down (503)", async () => {
    const storage = createS3Storage({ endpoint, region: "us-east-1", bucket: "b", accessKeyId: "k", secretAccessKey: "s", forcePathStyle: true, timeouts: { connectMs: 1_000, idleMs: 300 } });
    try {
      await expect(viaStorage(() => storage.discardUpload("some/key", "upload-id"))).rejects.toMatchObject({ code: "unavailable" });
    } finally {
      storage.client.destroy();
    }
  });
});
