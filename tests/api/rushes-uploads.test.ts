import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MiB } from "../../shared/rushes/limits";
import { sweepAbandonedUploads } from "../../server/rushes/uploads.service";
import { ABANDONED_UPLOADS_QUEUE, scheduleRushesJobs } from "../../server/rushes/rushes.jobs";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createClip } from "../factories/rushes";
import { startTestApp, type TestApp } from "../support/test-app";
import { patternBytes, rushesWorld, sampleMetadata, sendPart, uploadFile } from "./rushes-helpers";

let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;

beforeAll(async () => {
  app = await startTestApp();
  world = await rushesWorld(app);
});
afterAll(() => app.close());

const rows = async (sql: string, params: unknown[] = []) => (await app.database.pool.query(sql, params)).rows;

describe("starting an upload", () => {
  it("when an editor starts a 17 MiB file, then Kerf plans 8 MiB parts and makes the key itself", async () => {
    const response = await world.as.editor
      .send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "../../etc/A001_C002.mov", size: 17 * MiB, metadata: sampleMetadata })
      .expect(201);
    const upload = response.body.upload;
    expect(upload).toMatchObject({ partSize: 8 * MiB, partCount: 3, status: "uploading", contentType: "video/quicktime", parts: [] });
    const [row] = await rows("select object_key from uploads where id = $1", [upload.id]);
    // channel/episode/uuid: nothing of the file's name reaches the key.
    expect(row.object_key).toMatch(new RegExp(`^${world.channel.id}/${world.episode.id}/[0-9a-f-]{36}$`));
    expect(row.object_key).not.toContain("A001");
  });

  it("when the file is a type Kerf doesn't take, then it answers 415 with the accepted types and opens nothing", async () => {
    const before = await rows("select count(*)::int as n from uploads");
    const response = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "budget.xlsx", size: 1000 }).expect(415);
    expect(response.body.error.message).toMatch(/doesn't take \.xlsx files.*\.mov/);
    expect(await rows("select count(*)::int as n from uploads")).toEqual(before);
  });

  it("when the file is larger than the limit, then it answers 413 saying how large it may be", async () => {
    const response = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "huge.mov", size: 600 * 1024 * MiB }).expect(413);
    expect(response.body.error.message).toBe('"huge.mov" is 600 GiB; footage can be at most 500 GiB.');
  });

  it("when the episode is another channel's, then it refuses with a message on the field", async () => {
    const response = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: "00000000-0000-4000-8000-000000000000", fileName: "a.mov", size: 10 }).expect(400);
    expect(response.body.error.fields.episodeId).toBe("That episode is not in this channel.");
  });

  it("when the start timecode is a label drop-frame skips, then the metadata is refused", async () => {
    const response = await world.as.editor
      .send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "a.mov", size: 10, metadata: { ...sampleMetadata, startTimecode: "00:01:00;00" } })
      .expect(400);
    expect(response.body.error.fields["metadata.startTimecode"]).toMatch(/does not exist in 29.97 fps drop-frame/);
  });
});

describe("presigned part URLs", () => {
  it("when parts are signed, then each URL is for one part, signed, short-lived and carries no checksum", async () => {
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "b.mp4", size: 20 * MiB }).expect(201);
    const parts = [
      { partNumber: 1, size: 8 * MiB },
      { partNumber: 3, size: 4 * MiB },
    ];
    const signed = await world.as.editor.send("post", `${world.base}/uploads/${started.body.upload.id}/part-urls`, { parts }).expect(200);
    expect(signed.body.urls.map((u: { partNumber: number }) => u.partNumber)).toEqual([1, 3]);
    expect(signed.body.urls[1]).toMatchObject({ start: 16 * MiB, end: 20 * MiB });
    for (const { url, partNumber } of signed.body.urls as { url: string; partNumber: number }[]) {
      const params = new URL(url).searchParams;
      expect(params.get("X-Amz-Algorithm")).toBe("AWS4-HMAC-SHA256");
      expect(params.get("X-Amz-Signature")).toMatch(/^[0-9a-f]{64}$/);
      expect(params.get("X-Amz-Expires")).toBe("900");
      expect(params.get("partNumber")).toBe(String(partNumber));
      expect(params.get("uploadId")).toBeTruthy();
      // The SDK's default would sign the checksum of an empty body, which real stores reject for a part.
      expect([...params.keys()].filter((k) => /checksum/i.test(k))).toEqual([]);
      // The part's length is signed: storage takes exactly those bytes (rushes-signed-urls.test.ts).
      expect(params.get("X-Amz-SignedHeaders")).toBe("content-length;host");
    }
  });

  it("when a part number is outside the file, then it answers 400", async () => {
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "c.mp4", size: 9 * MiB }).expect(201);
    const response = await world.as.editor.send("post", `${world.base}/uploads/${started.body.upload.id}/part-urls`, { parts: [{ partNumber: 3, size: 1 }] }).expect(400);
    expect(response.body.error.message).toBe("This file has parts 1 to 2.");
  });

  it("when a part's size is not the one the file's plan gives it, then it answers 400 and signs nothing", async () => {
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "d.mp4", size: 9 * MiB }).expect(201);
    const url = `${world.base}/uploads/${started.body.upload.id}/part-urls`;
    const response = await world.as.editor.send("post", url, { parts: [{ partNumber: 2, size: 20 * MiB }] }).expect(400);
    expect(response.body.error).toMatchObject({ message: `Part 2 should be ${MiB} bytes, not ${20 * MiB}.`, fields: { size: `Part 2 should be ${MiB} bytes.` } });
    expect(response.body.urls).toBeUndefined();
    const unsized = await world.as.editor.send("post", url, { parts: [{ partNumber: 1 }] }).expect(400);
    expect(unsized.body.error.fields["parts.0.size"]).toBe("Give each part's size in bytes.");
  });
});

describe("completing an upload", () => {
  it("when every part is stored and recorded, then storage joins them and a clip exists with the file's bytes", async () => {
    const bytes = patternBytes(8 * MiB + 1234);
    const response = await uploadFile(world.as.crew, world.base, world.episode.id, "A002_C010.mov", bytes);
    expect(response.status).toBe(201);
    const clip = response.body.clip;
    expect(clip).toMatchObject({ fileName: "A002_C010.mov", size: bytes.length, startTimecode: "01:00:00;00", dropFrame: true, camera: "A cam", markCount: 0 });
    const preview = await world.as.crew.get(`${world.base}/clips/${clip.id}/preview`).expect(200);
    const stored = Buffer.from(await (await fetch(preview.body.url)).arrayBuffer());
    expect(stored.equals(bytes)).toBe(true);
    const [upload] = await rows("select status, clip_id from uploads where clip_id = $1", [clip.id]);
    expect(upload.status).toBe("completed");
  });

  it("when a part is missing, then it refuses to complete, names the part, and no clip exists", async () => {
    const bytes = patternBytes(8 * MiB + 10);
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "half.mov", size: bytes.length }).expect(201);
    const upload = started.body.upload;
    await sendPart(world.as.editor, world.base, upload, bytes, 1);
    const response = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(409);
    expect(response.body.error.message).toBe("Storage doesn't have every part yet: part 2 of 2 still to send.");
    expect(response.body.missing).toEqual([2]);
    expect(await rows("select 1 from clips where file_name = 'half.mov'")).toEqual([]);
  });

  it("when a part reached storage but Kerf never heard of it, then completion still waits for its record", async () => {
    const bytes = patternBytes(8 * MiB + 10);
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "unreported.mov", size: bytes.length }).expect(201);
    const upload = started.body.upload;
    await sendPart(world.as.editor, world.base, upload, bytes, 1);
    await sendPart(world.as.editor, world.base, upload, bytes, 2, false);
    const refused = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(409);
    expect(refused.body.error.message).toBe("Storage doesn't have every part yet: part 2 of 2 still to send.");
    expect(await rows("select status from uploads where id = $1", [upload.id])).toEqual([{ status: "uploading" }]);
    expect(await rows("select 1 from clips where file_name = 'unreported.mov'", [])).toEqual([]);
  });

  it("when the page reloads mid-upload, then the open upload comes back with the parts already stored", async () => {
    const bytes = patternBytes(16 * MiB + 5);
    const started = await world.as.owner
      .send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "resume.mov", size: bytes.length, fingerprint: "resume.mov:16777221:1700000000000" })
      .expect(201);
    const upload = started.body.upload;
    const first = await sendPart(world.as.owner, world.base, upload, bytes, 1);
    await sendPart(world.as.owner, world.base, upload, bytes, 3);
    const open = await world.as.owner.get(`${world.base}/uploads?episodeId=${world.episode.id}`).expect(200);
    const found = open.body.uploads.find((u: { id: string }) => u.id === upload.id);
    expect(found.fingerprint).toBe("resume.mov:16777221:1700000000000");
    expect(found.parts.map((p: { partNumber: number }) => p.partNumber)).toEqual([1, 3]);
    expect(found.parts[0].etag).toBe(first.etag.replaceAll('"', ""));
    // Another person's open uploads are theirs to resume.
    const others = await world.as.editor.get(`${world.base}/uploads?episodeId=${world.episode.id}`).expect(200);
    expect(others.body.uploads.some((u: { id: string }) => u.id === upload.id)).toBe(false);

    await sendPart(world.as.owner, world.base, upload, bytes, 2);
    const done = await world.as.owner.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(201);
    expect(done.body.clip.size).toBe(bytes.length);
    // A second completion (a lost answer, retried) gives the same clip.
    const again = await world.as.owner.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(200);
    expect(again.body.clip.id).toBe(done.body.clip.id);
  });
});

describe("cancelling and abandoned uploads", () => {
  it("when an upload is cancelled, then storage aborts it, it is marked cancelled, and takes no more parts", async () => {
    const started = await world.as.crew.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "cancel.mov", size: 9 * MiB }).expect(201);
    const id = started.body.upload.id;
    const response = await world.as.crew.send("delete", `${world.base}/uploads/${id}`).expect(200);
    expect(response.body).toEqual({ status: "cancelled", storage: "aborted" });
    expect((await world.as.crew.send("post", `${world.base}/uploads/${id}/part-urls`, { parts: [{ partNumber: 1, size: 8 * MiB }] }).expect(409)).body.error.message).toBe(
      "This upload was cancelled; start the file again.",
    );
    await world.as.crew.send("post", `${world.base}/uploads/${id}/complete`, {}).expect(409);
  });

  it("when crew try to cancel someone else's upload, then it answers 403 and the upload goes on", async () => {
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "theirs.mov", size: 9 * MiB }).expect(201);
    await world.as.crew.send("delete", `${world.base}/uploads/${started.body.upload.id}`).expect(403);
    expect(await rows("select status from uploads where id = $1", [started.body.upload.id])).toEqual([{ status: "uploading" }]);
  });

  it("when an upload has had no progress for a day, then the sweep marks it abandoned and leaves fresh ones alone", async () => {
    const old = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "old.mov", size: 9 * MiB }).expect(201);
    const fresh = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "fresh.mov", size: 9 * MiB }).expect(201);
    await app.database.pool.query("update uploads set last_activity_at = now() - interval '25 hours' where id = $1", [old.body.upload.id]);
    const result = await sweepAbandonedUploads({ db: app.db, storage: app.deps.storage });
    expect(result.abandoned).toBe(1);
    expect(await rows("select status from uploads where id = $1", [old.body.upload.id])).toEqual([{ status: "abandoned" }]);
    expect(await rows("select status from uploads where id = $1", [fresh.body.upload.id])).toEqual([{ status: "uploading" }]);
  });

  it("when the app starts its jobs, then the sweep is scheduled hourly on pg-boss", async () => {
    await scheduleRushesJobs(app.jobs.boss, { db: app.db, storage: app.deps.storage });
    const schedules = await app.jobs.boss.getSchedules();
    expect(schedules.find((s) => s.name === ABANDONED_UPLOADS_QUEUE)).toMatchObject({ cron: "17 * * * *" });
  });
});

describe("the file's checksum", () => {
  it("when the browser sends the file's SHA-256 at completion, then the clip keeps it beside the store's ETag", async () => {
    const { createHash } = await import("node:crypto");
    const bytes = patternBytes(4000, 3);
    const sha256 = createHash("sha256").update(bytes).digest("hex");
    const started = await world.as.editor.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName: "hashed.mov", size: bytes.length }).expect(201);
    await sendPart(world.as.editor, world.base, started.body.upload, bytes, 1);
    const done = await world.as.editor.send("post", `${world.base}/uploads/${started.body.upload.id}/complete`, { sha256 }).expect(201);
    expect(done.body.clip.sha256).toBe(sha256);
    expect(done.body.clip.storageEtag).toMatch(/^[0-9a-f]{32}(-\d+)?$/);
  });
});

describe("asking whether a file is in the channel already", () => {
  const digest = (text: string) => import("node:crypto").then(({ createHash }) => createHash("sha256").update(text).digest("hex"));

  it("when a clip of the channel has the checksum, then the answer names the clip and its episode", async () => {
    const sha256 = await digest("kerf-duplicate-one");
    const clip = await createClip(app.db, world.channel.id, world.episode.id, { fileName: "A003_C010.mov", sha256 });
    const response = await world.as.crew.get(`${world.base}/footage-checksums/${sha256}`).expect(200);
    expect(response.body).toEqual({ clip: { id: clip.id, fileName: "A003_C010.mov", episodeId: world.episode.id, episodeTitle: "Bottle rocket" } });
  });

  it("when no clip has it, then the answer is no clip", async () => {
    const response = await world.as.editor.get(`${world.base}/footage-checksums/${await digest("kerf-nowhere")}`).expect(200);
    expect(response.body).toEqual({ clip: null });
  });

  it("when only another channel's clip has the checksum, then this channel hears nothing of it", async () => {
    const sha256 = await digest("kerf-elsewhere");
    const other = await createCrewedChannel(app.db, "Other Channel");
    const otherEpisode = await createEpisode(app.db, other.channel.id, { title: "Their episode", stage: "shoot" });
    await createClip(app.db, other.channel.id, otherEpisode.id, { fileName: "theirs.mov", sha256 });
    const response = await world.as.editor.get(`${world.base}/footage-checksums/${sha256}`).expect(200);
    expect(response.body).toEqual({ clip: null });
  });

  it("when the checksum isn't 64 lower-case hex digits, then it answers 400 naming the field", async () => {
    for (const bad of ["abc", "G".repeat(64), "A".repeat(64), "0".repeat(65)]) {
      const response = await world.as.editor.get(`${world.base}/footage-checksums/${bad}`).expect(400);
      expect(response.body.error.fields.sha256).toBe("Write the SHA-256 as 64 hex digits, lower case.");
    }
  });
});
