import path from "node:path";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { stateDir } from "../../dev-services/paths";
import { freePort } from "../../dev-services/processes";
import { startS3StandIn, type S3StandIn } from "../../dev-services/s3";
import { removeFolder } from "../../dev-services/service-user";
import { MiB } from "../../shared/rushes/limits";
import { startTestApp, type TestApp } from "../support/test-app";
import { patternBytes, rushesWorld, sendPart } from "./rushes-helpers";

/**
 * The real storage stand-in, stopped in the middle of an upload and started again on the same
 * port and data folder, as a storage outage and its recovery look to Kerf.
 */
let dataDir: string;
let port: number;
let storage: S3StandIn;
let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;

let running = false;

async function startStorage() {
  storage = await startS3StandIn({ port, dataDir, origins: ["http://kerf.test"] });
  running = true;
}
async function stopStorage() {
  running = false;
  await storage.stop();
}

beforeAll(async () => {
  port = await freePort();
  // A folder of this test process's own: the run's cleanup knows the name if the process is killed.
  dataDir = path.join(stateDir, `s3-fault-${process.pid}-${port}`);
  await startStorage();
  app = await startTestApp({ s3: storage });
  world = await rushesWorld(app);
});
// A failed assertion while storage was stopped must not leave it stopped for what follows.
afterEach(async () => {
  if (!running) await startStorage();
});
afterAll(async () => {
  await app?.close();
  await storage?.stop();
  removeFolder(dataDir);
});

const count = async (table: string) => (await app.database.pool.query(`select count(*)::int as n from ${table}`)).rows[0].n as number;

describe("when the storage service stops during an upload", () => {
  it("then new uploads and the completion answer 503 with nothing written, and the same upload finishes once it is back", async () => {
    const bytes = patternBytes(8 * MiB + 4321, 11);
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "outage.mov", size: bytes.length }).expect(201);
    const upload = started.body.upload as { id: string; partSize: number; partCount: number };
    expect(upload.partCount).toBe(2);
    await sendPart(world.as.editor, world.base, upload, bytes, 1);
    const clipsBefore = await count("clips");

    await stopStorage();
    const health = await world.as.editor.get("/api/health").expect(200);
    expect(health.body).toMatchObject({ database: "up", storage: "down" });
    // The browser's PUT of the next part fails at the store itself; a new upload can't start.
    await expect(sendPart(world.as.editor, world.base, upload, bytes, 2)).rejects.toThrow();
    const uploadsBefore = await count("uploads");
    const another = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "another.mov", size: bytes.length });
    expect(another.status).toBe(503);
    expect(another.body.error.code).toBe("unavailable");
    expect(await count("uploads")).toBe(uploadsBefore);

    // Back up: the part sent before the outage is still recorded, so only the missing one is sent.
    await startStorage();
    expect((await world.as.editor.get("/api/health").expect(200)).body).toMatchObject({ storage: "up" });
    const state = await world.as.editor.get(`${world.base}/uploads/${upload.id}`).expect(200);
    expect(state.body.upload.parts.map((p: { partNumber: number }) => p.partNumber)).toEqual([1]);
    await sendPart(world.as.editor, world.base, upload, bytes, 2);

    // Down again just as the editor finishes: a clear 503, no clip, the upload still open.
    await stopStorage();
    const completing = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {});
    expect(completing.status).toBe(503);
    expect(completing.body.error.code).toBe("unavailable");
    expect(await count("clips")).toBe(clipsBefore);
    expect((await app.database.pool.query("select status from uploads where id = $1", [upload.id])).rows).toEqual([{ status: "uploading" }]);

    await startStorage();
    const done = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(201);
    expect(await count("clips")).toBe(clipsBefore + 1);
    expect(done.body.clip.size).toBe(bytes.length);
    // The stored file is the one sent, byte for byte, across the outage.
    const link = await world.as.editor.get(`${world.base}/clips/${done.body.clip.id}/preview`).expect(200);
    const stored = Buffer.from(await (await fetch(link.body.url)).arrayBuffer());
    expect(stored.equals(bytes)).toBe(true);
    // Three starts of the stand-in: about 4 CPU-seconds each, several times that on a busy machine.
  }, 180_000);
});
