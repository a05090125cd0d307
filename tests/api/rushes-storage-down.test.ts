import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { MiB } from "../../shared/rushes/limits";
import { sweepAbandonedUploads } from "../../server/rushes/uploads.service";
import type { Storage } from "../../server/storage/storage";
import { startTestApp, type TestApp } from "../support/test-app";
import { patternBytes, rushesWorld, sendPart, uploadFile } from "./rushes-helpers";

/** The real stand-in, with a switch that makes every call fail as an unreachable store does. */
const calm = { down: false, refuseParts: false, unreachableKey: null as string | null };
const faults = { ...calm };
const unreachable = () => Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:9"), { code: "ECONNREFUSED" });

function switchable(real: Storage): Storage {
  const wrap =
    <A extends unknown[], R>(call: (...args: A) => Promise<R>) =>
    async (...args: A): Promise<R> => {
      if (faults.down) throw unreachable();
      return call(...args);
    };
  return {
    bucket: real.bucket,
    publicOrigin: real.publicOrigin,
    up: async () => !faults.down && real.up(),
    createMultipart: wrap(real.createMultipart),
    presignPart: wrap(real.presignPart),
    completeMultipart: async (key, uploadId, parts) => {
      if (faults.down) throw unreachable();
      // What a store answers for a list naming a part it doesn't hold, without sending a wrong ETag.
      if (faults.refuseParts) throw Object.assign(new Error("One or more of the specified parts could not be found."), { name: "InvalidPart", $metadata: { httpStatusCode: 400 } });
      return real.completeMultipart(key, uploadId, parts);
    },
    discardUpload: async (key, uploadId) => {
      if (faults.down || faults.unreachableKey === key) throw unreachable();
      return real.discardUpload(key, uploadId);
    },
    head: wrap(real.head),
    presignGet: wrap(real.presignGet),
    putStream: wrap(real.putStream),
    getStream: wrap(real.getStream),
    remove: wrap(real.remove),
  };
}

let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;
beforeAll(async () => {
  app = await startTestApp({ storage: switchable });
  world = await rushesWorld(app);
});
afterAll(() => app.close());
// A test that fails while a switch is on must not leave storage "down" for the tests after it.
afterEach(() => Object.assign(faults, calm));

const count = async (table: string) => (await app.database.pool.query(`select count(*)::int as n from ${table}`)).rows[0].n as number;

describe("when storage is down", () => {
  it("then health says storage is down while Kerf itself stays up", async () => {
    faults.down = true;
    const response = await world.as.editor.get("/api/health").expect(200);
    faults.down = false;
    expect(response.body).toMatchObject({ status: "ok", database: "up", storage: "down" });
  });

  it("then starting an upload answers a clear 503 and writes no upload row", async () => {
    const before = await count("uploads");
    faults.down = true;
    const response = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "down.mov", size: 9 * MiB });
    faults.down = false;
    expect(response.status).toBe(503);
    expect(response.body.error).toEqual({ code: "unavailable", message: "Footage storage is not reachable right now; nothing was changed. Try again in a moment." });
    expect(await count("uploads")).toBe(before);
  });

  it("then completing answers 503, makes no clip, and the upload can complete once storage is back", async () => {
    const bytes = patternBytes(8 * MiB + 99);
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "later.mov", size: bytes.length }).expect(201);
    const upload = started.body.upload;
    await sendPart(world.as.editor, world.base, upload, bytes, 1);
    await sendPart(world.as.editor, world.base, upload, bytes, 2);
    const clipsBefore = await count("clips");
    faults.down = true;
    const response = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {});
    faults.down = false;
    expect(response.status).toBe(503);
    expect(await count("clips")).toBe(clipsBefore);
    expect((await app.database.pool.query("select status from uploads where id = $1", [upload.id])).rows).toEqual([{ status: "uploading" }]);
    await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(201);
  });

  it("then deleting a clip answers 503 and the clip stays", async () => {
    const done = await uploadFile(world.as.editor, world.base, world.episode.id, "keep.mov", patternBytes(1000));
    faults.down = true;
    const response = await world.as.editor.send("delete", `${world.base}/clips/${done.body.clip.id}`);
    faults.down = false;
    expect(response.status).toBe(503);
    await world.as.editor.get(`${world.base}/clips/${done.body.clip.id}`).expect(200);
  });

  it("then a photo upload answers 503 and records no photo", async () => {
    const before = await count("stills");
    faults.down = true;
    const response = await world.as.crew.agent
      .post(`${world.base}/stills`)
      .set("x-csrf-token", world.as.crew.csrf)
      .field("size", "4")
      .attach("file", Buffer.from([0xff, 0xd8, 0xff, 0xd9]), { filename: "joint.jpg", contentType: "image/jpeg" });
    faults.down = false;
    expect(response.status).toBe(503);
    expect(await count("stills")).toBe(before);
  });
});

describe("when storage refuses the recorded parts", () => {
  it("then completion answers 409, no clip exists, and the upload stays open", async () => {
    const bytes = patternBytes(8 * MiB + 10);
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "refused.mov", size: bytes.length }).expect(201);
    const upload = started.body.upload;
    await sendPart(world.as.editor, world.base, upload, bytes, 1);
    await sendPart(world.as.editor, world.base, upload, bytes, 2);
    faults.refuseParts = true;
    const response = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {});
    faults.refuseParts = false;
    expect(response.status).toBe(409);
    expect(response.body.error.message).toBe("Storage refused the parts as recorded; send the file again.");
    expect((await app.database.pool.query("select 1 from clips where file_name = 'refused.mov'")).rows).toEqual([]);
  });
});

describe("when storage can't discard one abandoned upload", () => {
  it("then the sweep leaves that one open for the next run and abandons the rest", async () => {
    const ids: string[] = [];
    for (const fileName of ["stuck.mov", "gone.mov"]) {
      const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName, size: 1000 }).expect(201);
      ids.push(started.body.upload.id);
    }
    await app.database.pool.query("update uploads set last_activity_at = now() - interval '25 hours' where id = any($1)", [ids]);
    const status = async () => (await app.database.pool.query("select file_name, status from uploads where id = any($1) order by file_name", [ids])).rows;
    faults.unreachableKey = (await app.database.pool.query("select object_key from uploads where id = $1", [ids[0]])).rows[0].object_key;

    expect(await sweepAbandonedUploads({ db: app.db, storage: app.deps.storage })).toMatchObject({ abandoned: 1, deferred: 1 });
    expect(await status()).toEqual([
      { file_name: "gone.mov", status: "abandoned" },
      { file_name: "stuck.mov", status: "uploading" },
    ]);
    faults.unreachableKey = null;
    expect(await sweepAbandonedUploads({ db: app.db, storage: app.deps.storage })).toMatchObject({ abandoned: 1, deferred: 0 });
    expect((await status()).map((r) => r.status)).toEqual(["abandoned", "abandoned"]);
  });
});

describe("when storage is down as an upload is cancelled", () => {
  it("then it answers 503 and the upload stays open, to be cancelled again or swept", async () => {
    const started = await world.as.crew.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "later-cancel.mov", size: 1000 }).expect(201);
    faults.down = true;
    const response = await world.as.crew.send("delete", `${world.base}/uploads/${started.body.upload.id}`);
    faults.down = false;
    expect(response.status).toBe(503);
    expect((await app.database.pool.query("select status from uploads where id = $1", [started.body.upload.id])).rows).toEqual([{ status: "uploading" }]);
    await world.as.crew.send("delete", `${world.base}/uploads/${started.body.upload.id}`).expect(200);
  });
});

