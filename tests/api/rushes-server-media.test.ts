import { execFile } from "node:child_process";
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CLIP_MEDIA_QUEUE } from "../../server/rushes/media.service";
import { runTool } from "../../server/rushes/media-tools";
import { startClipMediaWorkers } from "../../server/rushes/rushes.jobs";
import { jobsIn, settledJobs } from "../support/jobs";
import { startTestApp, type TestApp } from "../support/test-app";
import { patternBytes, rushesWorld, uploadFile } from "./rushes-helpers";

/*
 * The server's poster, proxy and probe, made by the real job (pg-boss, Debian's ffmpeg) from files
 * uploaded through the real upload routes. The fixtures are made here with ffmpeg's own test sources
 * (testsrc: colour bars, a gradient and a counter; sine: a 440 Hz tone), 1.5 s at 320x180 and 25 fps:
 *   HEVC:   ffmpeg -f lavfi -i testsrc=size=320x180:rate=25:duration=1.5 -f lavfi -i sine=frequency=440:duration=1.5
 *             -c:v libx265 -preset ultrafast -tag:v hvc1 -c:a aac -shortest clip.mp4
 *   ProRes: the same sources with -c:v prores_ks -profile:v 0 -c:a pcm_s16le clip.mov
 * Chromium decodes neither (Debian's build), which is why the browser's poster of such a file is black.
 */
const run = promisify(execFile);
let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;
let folder: string;

const sources = ["-f", "lavfi", "-i", "testsrc=size=320x180:rate=25:duration=1.5", "-f", "lavfi", "-i", "sine=frequency=440:duration=1.5"];

async function makeFixture(name: string, codecArgs: string[]): Promise<Buffer> {
  const file = path.join(folder, name);
  await run("ffmpeg", ["-hide_banner", "-loglevel", "error", "-y", ...sources, ...codecArgs, "-shortest", file]);
  return readFile(file);
}

beforeAll(async () => {
  app = await startTestApp();
  world = await rushesWorld(app);
  folder = await mkdtemp(path.join(tmpdir(), "kerf-media-test-"));
  await startClipMediaWorkers(app.jobs.boss, { db: app.db, storage: app.deps.storage, jobs: app.jobs }, { pollSeconds: 0.5 });
});
afterAll(async () => {
  await app.close();
  await rm(folder, { recursive: true, force: true });
});

/** What the browser said: 320x180 as the file is, but 29.97 fps where the file says 25. */
const browserSaid = (codec: string) => ({
  durationMs: 1_500,
  frameRate: { numerator: 30000, denominator: 1001 },
  dropFrame: false,
  width: 320,
  height: 180,
  codec,
  startTimecode: null,
  recordedAt: null,
  camera: "B cam",
});

async function upload(fileName: string, bytes: Buffer, metadata: object) {
  const done = await uploadFile(world.as.editor, world.base, world.episode.id, fileName, bytes, metadata);
  expect(done.status).toBe(201);
  return done.body.clip.id as string;
}

/** Waits on pg-boss's record of the clip's n-th media job, and answers it. */
async function settledMediaJob(clipId: string, nth = 1) {
  const jobs = await settledJobs(app.database.pool, CLIP_MEDIA_QUEUE, (job) => job.data.clipId === clipId, nth, 120_000);
  return jobs[nth - 1]!;
}

const getClip = async (clipId: string) => (await world.as.editor.get(`${world.base}/clips/${clipId}`).expect(200)).body.clip;

/** The picture as 8-bit gray values (ffmpeg decodes the JPEG), and how far they spread. */
async function graySpread(jpeg: Buffer): Promise<{ min: number; max: number; deviation: number; pixels: number }> {
  const file = path.join(folder, `poster-${Date.now()}.jpg`);
  await writeFile(file, jpeg);
  const { stdout } = await run("ffmpeg", ["-hide_banner", "-loglevel", "error", "-i", file, "-f", "rawvideo", "-pix_fmt", "gray", "-"], { encoding: "buffer", maxBuffer: 10_000_000 });
  const bytes = stdout as unknown as Buffer;
  let sum = 0;
  let min = 255;
  let max = 0;
  for (const v of bytes) {
    sum += v;
    min = Math.min(min, v);
    max = Math.max(max, v);
  }
  const mean = sum / bytes.length;
  let squares = 0;
  for (const v of bytes) squares += (v - mean) ** 2;
  return { min, max, deviation: Math.sqrt(squares / bytes.length), pixels: bytes.length };
}

async function probeStreams(url: string) {
  const { stdout } = await run("ffprobe", ["-hide_banner", "-loglevel", "error", "-print_format", "json", "-show_streams", url]);
  return (JSON.parse(stdout) as { streams: { codec_type: string; codec_name: string; width?: number; height?: number; pix_fmt?: string }[] }).streams;
}

describe.each([
  { label: "HEVC", fileName: "C001_HEVC.mp4", codec: "HEVC", args: ["-c:v", "libx265", "-preset", "ultrafast", "-x265-params", "log-level=error", "-tag:v", "hvc1", "-c:a", "aac"] },
  { label: "ProRes", fileName: "C002_PRORES.mov", codec: "ProRes", args: ["-c:v", "prores_ks", "-profile:v", "0", "-c:a", "pcm_s16le"] },
])("a $label clip", ({ fileName, codec, args }) => {
  let clipId: string;

  beforeAll(async () => {
    clipId = await upload(fileName, await makeFixture(fileName, args), browserSaid(codec));
  }, 60_000);

  it("when its upload completes, then the clip says its poster and proxy are on the way", async () => {
    const clip = await getClip(clipId);
    // Waiting, or already being made (or made) by the worker that took it.
    expect(["waiting", "making", "ready"]).toContain(clip.media.state);
  });

  it("when the job has run, then the clip has a poster from the file itself that is not one flat colour", async () => {
    const job = await settledMediaJob(clipId);
    expect(job.state).toBe("completed");
    expect(job.output).toMatchObject({ outcome: "made", poster: true, proxy: true });
    const clip = await getClip(clipId);
    expect(clip.media).toMatchObject({ state: "ready", failure: null, attempts: 1, hasProxy: true });
    const [row] = (await app.database.pool.query("select server_poster_key, poster_key from clips where id = $1", [clipId])).rows;
    expect(row.server_poster_key).toBeTruthy();
    expect(clip.posterUrl).toContain(row.server_poster_key);
    const poster = await fetch(clip.posterUrl);
    expect(poster.status).toBe(200);
    const spread = await graySpread(Buffer.from(await poster.arrayBuffer()));
    // 480 wide as asked, 16:9 kept: 480x270.
    expect(spread.pixels).toBe(480 * 270);
    // A black (or any uniform) frame has no spread; testsrc's bars and gradient span most of the range.
    expect(spread.max - spread.min).toBeGreaterThan(150);
    expect(spread.deviation).toBeGreaterThan(30);
  });

  it("when the player asks for the clip, then it gets the proxy, which probes as H.264 video and AAC sound", async () => {
    await settledMediaJob(clipId);
    const preview = (await world.as.editor.get(`${world.base}/clips/${clipId}/preview`).expect(200)).body;
    expect(preview.source).toBe("proxy");
    const streams = await probeStreams(preview.url);
    expect(streams.find((s) => s.codec_type === "video")).toMatchObject({ codec_name: "h264", pix_fmt: "yuv420p", width: 320, height: 180 });
    expect(streams.find((s) => s.codec_type === "audio")).toMatchObject({ codec_name: "aac" });
    // A download is still the original file.
    const download = (await world.as.editor.get(`${world.base}/clips/${clipId}/preview?download=1`).expect(200)).body;
    expect(download.source).toBe("original");
  });

  it("when the browser reported another frame rate, then the mismatch is stored and the clip uses the file's", async () => {
    await settledMediaJob(clipId);
    const clip = await getClip(clipId);
    expect(clip.media.mismatches).toEqual([{ field: "frameRate", file: { numerator: 25, denominator: 1 }, browser: { numerator: 30000, denominator: 1001 } }]);
    expect(clip.frameRate).toEqual({ numerator: 25, denominator: 1 });
    expect(clip.codec).toBe(codec);
    expect(clip.durationMs).toBeGreaterThan(1_400);
    expect(clip.durationMs).toBeLessThan(1_600);
  });

  it("when someone asks to retry a clip that is ready, then it answers 409 and queues nothing", async () => {
    await settledMediaJob(clipId);
    const answer = await world.as.editor.send("post", `${world.base}/clips/${clipId}/media/retry`).expect(409);
    expect(answer.body.error.message).toBe("This clip's poster and proxy are already made.");
    expect((await jobsIn(app.database.pool, CLIP_MEDIA_QUEUE)).filter((job) => job.data.clipId === clipId)).toHaveLength(1);
  });
});

describe("a file the server can't read", () => {
  it("when the job fails, then the clip says why, and a retry queues it again", async () => {
    const clipId = await upload("C003_BROKEN.mov", patternBytes(20_000), browserSaid("AVC"));
    const first = await settledMediaJob(clipId);
    expect(first.state).toBe("failed");
    let clip = await getClip(clipId);
    expect(clip.media).toMatchObject({ state: "failed", attempts: 1, hasProxy: false });
    expect(clip.media.failure).toBe("Reading the file's details failed: the file may be damaged, unfinished or not a video the server can read.");
    // Nothing of the clip's server media is in storage or named by the row.
    const [row] = (await app.database.pool.query("select server_poster_key, proxy_key from clips where id = $1", [clipId])).rows;
    expect(row).toEqual({ server_poster_key: null, proxy_key: null });

    const retried = await world.as.crew.send("post", `${world.base}/clips/${clipId}/media/retry`).expect(202);
    expect(["waiting", "making", "failed"]).toContain(retried.body.clip.media.state);
    const second = await settledMediaJob(clipId, 2);
    expect(second.state).toBe("failed");
    clip = await getClip(clipId);
    expect(clip.media).toMatchObject({ state: "failed", attempts: 2 });
  });

  it("when a tool runs past its time limit, then it is stopped and the reason says so", async () => {
    const endless = runTool("ffmpeg", ["-f", "lavfi", "-i", "testsrc=size=320x180:rate=25", "-f", "null", "-"], { timeoutMs: 300 }, "Making the proxy");
    await expect(endless).rejects.toMatchObject({ reason: "Making the proxy took longer than 1 second, so the server stopped it." });
  });

  it("when a tool prints more than the server reads, then it is stopped", async () => {
    const chatty = runTool("ffmpeg", ["-f", "lavfi", "-i", "testsrc=size=320x180:rate=25", "-f", "rawvideo", "-"], { timeoutMs: 60_000, maxStdoutBytes: 10_000 }, "Reading the file's details");
    await expect(chatty).rejects.toMatchObject({ detail: "output limit" });
  });
});
