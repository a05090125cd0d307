import { HeadObjectCommand, ListMultipartUploadsCommand, ListObjectsV2Command, ListPartsCommand, UploadPartCommand, type S3Client } from "@aws-sdk/client-s3";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { MiB, PART_URL_SECONDS } from "../../shared/rushes/limits";
import { ABANDONED_UPLOADS_QUEUE, scheduleRushesJobs } from "../../server/rushes/rushes.jobs";
import { createS3Storage, makeS3Client, storageSettingsFrom } from "../../server/storage/storage";
import { waitForJobStates } from "../support/jobs";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { patternBytes, rushesWorld, sendPart } from "./rushes-helpers";

/**
 * Kerf's presigned URLs against the storage stand-in, which checks signatures as a real store does
 * (dev-services/s3.ts): a URL works for its own upload, part and length, for a quarter of an hour,
 * and nothing a refused, cancelled or abandoned upload sent stays in storage.
 */
let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;
let s3: S3Client;
let bucket: string;

beforeAll(async () => {
  app = await startTestApp();
  world = await rushesWorld(app);
  const settings = storageSettingsFrom(app.deps.env);
  s3 = makeS3Client(settings);
  bucket = settings.bucket;
});
afterEach(() => vi.useRealTimers());
afterAll(async () => {
  s3?.destroy();
  await app?.close();
});

async function startUpload(agent: Visitor, fileName: string, size: number) {
  const started = await agent.send("post", `${world.base}/uploads`, { episodeId: world.episode.id, fileName, size }).expect(201);
  const upload = started.body.upload as { id: string; partSize: number; partCount: number };
  const [row] = (await app.database.pool.query("select object_key, storage_upload_id from uploads where id = $1", [upload.id])).rows;
  return { ...upload, key: row.object_key as string, storageUploadId: row.storage_upload_id as string };
}

/** Kerf's URL for one part, as the browser asks for it. */
async function partUrl(agent: Visitor, uploadId: string, partNumber: number, size: number): Promise<string> {
  const signed = await agent.send("post", `${world.base}/uploads/${uploadId}/part-urls`, { parts: [{ partNumber, size }] }).expect(200);
  return signed.body.urls[0].url as string;
}

/** A PUT as a browser sends it: the status, or "closed" when storage hangs up mid-body. */
async function put(url: string, bytes: number): Promise<number | "closed"> {
  try {
    const response = await fetch(url, { method: "PUT", body: new Uint8Array(bytes) });
    await response.arrayBuffer();
    return response.status;
  } catch {
    return "closed";
  }
}

const refused = (outcome: number | "closed") => outcome === "closed" || outcome >= 400;

async function storedParts(upload: { key: string; storageUploadId: string }) {
  const listed = await s3.send(new ListPartsCommand({ Bucket: bucket, Key: upload.key, UploadId: upload.storageUploadId }));
  return (listed.Parts ?? []).map((p) => ({ partNumber: p.PartNumber, size: p.Size }));
}

/** What storage holds for an upload's key: open multipart uploads, their parts, the object itself. */
async function leftInStorage(upload: { key: string; storageUploadId: string }) {
  const open = await s3.send(new ListMultipartUploadsCommand({ Bucket: bucket, Prefix: upload.key }));
  const parts = await storedParts(upload).catch((error: Error) => (error.name === "NoSuchUpload" ? [] : Promise.reject(error)));
  const objects = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: upload.key }));
  return { uploads: (open.Uploads ?? []).map((u) => u.Key), parts, objects: (objects.Contents ?? []).map((o) => o.Key) };
}
const nothing = { uploads: [], parts: [], objects: [] };

describe("a part URL Kerf signed, sent to a store that checks signatures", () => {
  it("when its signature is altered, then storage refuses it and holds no part", async () => {
    const upload = await startUpload(world.as.editor, "tampered.mov", 1000);
    const url = new URL(await partUrl(world.as.editor, upload.id, 1, 1000));
    const signature = url.searchParams.get("X-Amz-Signature")!;
    url.searchParams.set("X-Amz-Signature", `${signature[0] === "0" ? "1" : "0"}${signature.slice(1)}`);
    expect(await put(url.toString(), 1000)).toBe(403);
    expect(await storedParts(upload)).toEqual([]);
  });

  it("when it has expired, then storage refuses it", async () => {
    const upload = await startUpload(world.as.editor, "expired.mov", 1000);
    // Kerf's own signing code with a clock an hour behind: the URL's quarter of an hour is long over.
    const storage = createS3Storage(storageSettingsFrom(app.deps.env));
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(Date.now() - 3600 * 1000);
    const url = await storage.presignPart(upload.key, upload.storageUploadId, 1, 1000, PART_URL_SECONDS);
    vi.useRealTimers();
    storage.client.destroy();
    expect(await put(url, 1000)).toBe(403);
    expect(await storedParts(upload)).toEqual([]);
  });

  it("when it is used for another upload's key, then storage refuses it", async () => {
    const mine = await startUpload(world.as.crew, "mine.mov", 1000);
    const theirs = await startUpload(world.as.editor, "theirs.mov", 1000);
    const url = new URL(await partUrl(world.as.crew, mine.id, 1, 1000));
    url.pathname = `/${bucket}/${theirs.key}`;
    url.searchParams.set("uploadId", theirs.storageUploadId);
    expect(await put(url.toString(), 1000)).toBe(403);
    expect(await storedParts(theirs)).toEqual([]);
  });

  it("when it is used for another part number, then storage refuses it", async () => {
    const upload = await startUpload(world.as.editor, "renumbered.mov", 16 * MiB);
    const url = new URL(await partUrl(world.as.editor, upload.id, 1, 8 * MiB));
    url.searchParams.set("partNumber", "2");
    expect(await put(url.toString(), 8 * MiB)).toBe(403);
    expect(await storedParts(upload)).toEqual([]);
  });

  it("when a PUT carries no signature at all, then storage refuses it", async () => {
    const upload = await startUpload(world.as.editor, "unsigned.mov", 1000);
    const url = new URL(await partUrl(world.as.editor, upload.id, 1, 1000));
    const bare = `${url.origin}${url.pathname}?partNumber=1&uploadId=${encodeURIComponent(upload.storageUploadId)}`;
    expect(refused(await put(bare, 1000))).toBe(true);
    expect(refused(await put(`${url.origin}${url.pathname}`, 1000))).toBe(true);
    expect(await storedParts(upload)).toEqual([]);
    expect((await leftInStorage(upload)).objects).toEqual([]);
  });

  it("when the signed URL is read, then it signs the part's length and carries no checksum", async () => {
    const upload = await startUpload(world.as.editor, "form.mov", 20 * MiB);
    const url = new URL(await partUrl(world.as.editor, upload.id, 3, 4 * MiB));
    expect(url.searchParams.get("X-Amz-SignedHeaders")!.split(";")).toEqual(["content-length", "host"]);
    expect([...url.searchParams.keys()].filter((k) => /checksum/i.test(k))).toEqual([]);
  });
});

describe("a 100-byte upload that is sent 20 MiB", () => {
  it("then storage refuses the 20 MiB, and once the upload is cancelled nothing of it stays in storage", async () => {
    const upload = await startUpload(world.as.crew, "tiny.mov", 100);
    const url = await partUrl(world.as.crew, upload.id, 1, 100);
    expect(refused(await put(url, 20 * MiB))).toBe(true);
    expect(refused(await put(url, 101))).toBe(true);
    expect(await storedParts(upload)).toEqual([]);
    // The exact length still goes in: the URL was only ever for these 100 bytes.
    expect(await put(url, 100)).toBe(200);
    expect(await storedParts(upload)).toEqual([{ partNumber: 1, size: 100 }]);

    await world.as.crew.send("delete", `${world.base}/uploads/${upload.id}`).expect(200);
    expect(await leftInStorage(upload)).toEqual(nothing);
  });

  it("then a completion that finds more bytes than the file has is refused and deletes what storage joined", async () => {
    const upload = await startUpload(world.as.editor, "swollen.mov", 100);
    // Bytes that reached storage some other way than Kerf's URL (a store that checks no lengths).
    const sent = await s3.send(new UploadPartCommand({ Bucket: bucket, Key: upload.key, UploadId: upload.storageUploadId, PartNumber: 1, Body: patternBytes(20 * MiB) }));
    await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/parts`, { parts: [{ partNumber: 1, etag: sent.ETag, size: 100 }] }).expect(200);

    const response = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(409);
    expect(response.body.error.message).toBe(`Storage held ${20 * MiB} bytes for this file, not 100, so Kerf removed them; send the file again.`);
    expect(await leftInStorage(upload)).toEqual(nothing);
    await expect(s3.send(new HeadObjectCommand({ Bucket: bucket, Key: upload.key }))).rejects.toMatchObject({ name: "NotFound" });
    expect((await app.database.pool.query("select status from uploads where id = $1", [upload.id])).rows).toEqual([{ status: "refused" }]);
    expect(await app.database.pool.query("select 1 from clips where file_name = 'swollen.mov'")).toMatchObject({ rowCount: 0 });
    const again = await world.as.editor.send("post", `${world.base}/uploads/${upload.id}/complete`, {}).expect(409);
    expect(again.body.error.message).toBe("Storage refused this file as it was sent; start the file again.");
  });
});

describe("an upload that is cancelled after some parts", () => {
  it("then storage lists no open upload, no part and no object for it", async () => {
    const bytes = patternBytes(16 * MiB + 7);
    const upload = await startUpload(world.as.editor, "dropped.mov", bytes.length);
    await sendPart(world.as.editor, world.base, upload, bytes, 1);
    await sendPart(world.as.editor, world.base, upload, bytes, 3);
    expect((await storedParts(upload)).map((p) => p.partNumber)).toEqual([1, 3]);

    const response = await world.as.editor.send("delete", `${world.base}/uploads/${upload.id}`).expect(200);
    expect(response.body).toEqual({ status: "cancelled", storage: "aborted" });
    expect(await leftInStorage(upload)).toEqual(nothing);
  });
});

describe("the abandoned-uploads job", () => {
  it("when it runs, then a stale upload is aborted in storage with its parts, marked abandoned, and fresh ones stay", async () => {
    const bytes = patternBytes(8 * MiB + 5);
    const stale = await startUpload(world.as.editor, "stale.mov", bytes.length);
    await sendPart(world.as.editor, world.base, stale, bytes, 1);
    const fresh = await startUpload(world.as.editor, "fresh.mov", bytes.length);
    await sendPart(world.as.editor, world.base, fresh, bytes, 1);
    await app.database.pool.query("update uploads set last_activity_at = now() - interval '25 hours' where id = $1", [stale.id]);

    await scheduleRushesJobs(app.jobs.boss, { db: app.db, storage: app.deps.storage }, { pollSeconds: 0.5 });
    const jobId = (await app.jobs.boss.send(ABANDONED_UPLOADS_QUEUE, {}))!;
    expect(await waitForJobStates(app.database.pool, [jobId])).toEqual(["completed"]);
    expect((await app.jobs.boss.getJobById(ABANDONED_UPLOADS_QUEUE, jobId))!.output).toMatchObject({ abandoned: 1, deferred: 0 });

    expect(await leftInStorage(stale)).toEqual(nothing);
    expect((await app.database.pool.query("select status from uploads where id = $1", [stale.id])).rows).toEqual([{ status: "abandoned" }]);
    expect((await leftInStorage(fresh)).uploads).toEqual([fresh.key]);
    expect(await storedParts(fresh)).toEqual([{ partNumber: 1, size: 8 * MiB }]);
  });
});

