import { spawn } from "node:child_process";
import http from "node:http";
import { closeSync, openSync, readFileSync, rmSync, writeSync, mkdirSync } from "node:fs";
import { open } from "node:fs/promises";
import path from "node:path";
import { CompleteMultipartUploadCommand, CreateMultipartUploadCommand, UploadPartCommand } from "@aws-sdk/client-s3";
import { footageQuerySchema } from "../../shared/rushes/footage-query";
import { MiB, partRange, planParts } from "../../shared/rushes/limits";
import type { PartUrlsAnswer } from "../../shared/rushes/schemas";
import { connectDatabase } from "../../server/db/client";
import { listClips } from "../../server/rushes/clips.repository";
import { makeS3Client } from "../../server/storage/storage";
import { createCrewedChannel } from "../../tests/factories/accounts";
import { createEpisode } from "../../tests/factories/episodes";
import { freePort, stopChild, waitForHttp } from "../processes";
import { repoRoot, stateDir } from "../paths";
import { percentile, signIn } from "./measure";
import { benchExport, EXPORT_CLIPS, seedExportChannel } from "./rushes-export";
import { crowdedCluster } from "./kept-crowd";
import { startS3StandIn } from "../s3";
import { PartRecords } from "../../src/features/rushes/uploader/part-records";
import { PartSigner } from "../../src/features/rushes/uploader/part-signer";

/**
 * `npm run bench:rushes`: among 10,000 other channels (crowd.ts), (a) the footage list over 50,000 seeded clips with a three-field filter,
 * its p95 and its query plan; (b) a 1 GiB upload through the presigned multipart path next to a direct
 * SDK upload of the same file to the same stand-in, in turns, with the app server's resident memory
 * watched: the same parts, four at a time, over the same transport (node:http, keep-alive), the
 * presigned path signing and recording its parts with Kerf in batches as the browser does;
 * (c) the CSV export of a channel of 5,000 clips × 10 marks, and how long another channel waits meanwhile.
 * Everything runs on throwaway services of its own; the last line is one JSON object.
 */
const CLIPS = Number(process.env.BENCH_CLIPS ?? 50_000);
const UPLOAD_MIB = Number(process.env.BENCH_UPLOAD_MIB ?? 1024);
// Rounds of one direct and one presigned upload each.
const UPLOAD_ROUNDS = Number(process.env.BENCH_UPLOAD_ROUNDS ?? 2);
const LIST_RUNS = 200;
const PARALLEL = 4;

const work = path.join(stateDir, `bench-rushes-${process.pid}`);
const stops: (() => Promise<void> | void)[] = [];

async function seedClips(url: string, channelId: string, episodeIds: string[]) {
  const handle = connectDatabase(url);
  // One statement with generate_series: ratings, tags and cameras spread so a three-field filter keeps a few hundred rows.
  await handle.pool.query(
    `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms,
       frame_rate_numerator, frame_rate_denominator, drop_frame, width, height, codec, start_timecode, camera, recorded_at, rating, tags, notes, mark_count)
     select $1::uuid, ($2::uuid[])[1 + (i % array_length($2::uuid[], 1))], $1::text || '/bench/' || i, 'C' || lpad(i::text, 6, '0') || '.mov', 'video/quicktime',
       50000000 + (i * 7919) % 900000000, 2000 + (i * 37) % 600000, 30000, 1001, true, 3840, 2160, 'HEVC', '01:00:00;00',
       (array['A cam','B cam','Drone','Phone'])[1 + i % 4], timestamptz '2026-01-01' + (i || ' minutes')::interval,
       (array['select','maybe','reject',null])[1 + (i / 5) % 4]::clip_rating,
       case when i % 7 = 0 then array['wiring','close-up'] when i % 5 = 0 then array['failure'] else '{}'::text[] end,
       case when i % 11 = 0 then 'prop stalls at full throttle' else '' end, (i % 3 = 0)::int
     from generate_series(1, $3) as i`,
    [channelId, `{${episodeIds.join(",")}}`, CLIPS],
  );
  await handle.pool.query("analyze clips");
  return handle;
}

/** A GET as a signed-in member: the raw response, for bodies that are not JSON. */
async function signedInGet(appUrl: string, person: { email: string; password: string }) {
  const { cookie } = await signIn(appUrl, person);
  return (url: string) => fetch(`${appUrl}${url}`, { headers: { cookie } });
}

async function signedInCaller(appUrl: string, person: { email: string; password: string }) {
  const { cookie, csrf: token } = await signIn(appUrl, person);
  return async (method: string, url: string, body?: unknown) => {
    const response = await fetch(`${appUrl}${url}`, {
      method,
      headers: { cookie, "x-csrf-token": token, ...(body === undefined ? {} : { "content-type": "application/json" }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!response.ok) throw new Error(`${method} ${url}: ${response.status} ${await response.text()}`);
    return response.json() as Promise<Record<string, unknown>>;
  };
}

function makeFile(file: string, mib: number) {
  const fd = openSync(file, "w");
  const block = Buffer.alloc(MiB);
  for (let i = 0; i < mib; i++) {
    block.fill(i & 0xff);
    block.writeUInt32BE(i, 0);
    writeSync(fd, block);
  }
  closeSync(fd);
}

async function readPart(file: string, partNumber: number, partSize: number, size: number) {
  const { start, end } = partRange(partNumber, partSize, size);
  const handle = await open(file, "r");
  try {
    const buffer = Buffer.allocUnsafe(end - start);
    await handle.read(buffer, 0, buffer.length, start);
    return buffer;
  } finally {
    await handle.close();
  }
}

/**
 * One part's PUT to its signed URL, sent as the direct SDK sends its parts (node:http with the Buffer,
 * Content-Length set, a keep-alive agent of 50 sockets as the SDK's NodeHttpHandler makes), so both
 * paths use the same transport. A browser sends these with its own network stack, not the page's
 * JavaScript; Node's fetch would copy each 8 MiB body and measure fetch, not Kerf.
 */
const storageAgent = new http.Agent({ keepAlive: true, maxSockets: 50 });
function putPart(url: string, body: Buffer): Promise<string> {
  return new Promise((resolve, reject) => {
    const request = http.request(url, { method: "PUT", agent: storageAgent, headers: { "content-length": body.length } }, (response) => {
      response.resume();
      response.on("end", () => {
        const etag = response.headers.etag;
        if (response.statusCode === 200 && etag) resolve(etag);
        else reject(new Error(`PUT ${new URL(url).pathname}: ${response.statusCode}`));
      });
    });
    request.on("error", reject);
    request.end(body);
  });
}

/** Runs `task(n)` for parts 1..count with `PARALLEL` in flight, as the browser's queue does. */
async function inParallel(count: number, task: (n: number) => Promise<void>) {
  let next = 1;
  await Promise.all(Array.from({ length: PARALLEL }, async () => {
    while (next <= count) await task(next++);
  }));
}

function rssMb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, "utf8").split("\n").find((l) => l.startsWith("VmRSS:"))!;
  return Number(line.replace(/\D+/g, "")) / 1024;
}

async function main() {
  mkdirSync(work, { recursive: true });
  console.log("── services ──");
  const { cluster, databaseUrl: url, crowd } = await crowdedCluster(path.join(work, "pg"), "kerf_bench");
  stops.push(() => cluster.stop());
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const s3 = await startS3StandIn({ port: await freePort(), dataDir: path.join(work, "s3"), origins: [appUrl] });
  stops.push(() => s3.stop());

  const setup = connectDatabase(url);
  const crewed = await createCrewedChannel(setup.db, "Bench Channel");
  const episodes: Awaited<ReturnType<typeof createEpisode>>[] = [];
  for (let i = 0; i < 12; i++) episodes.push(await createEpisode(setup.db, crewed.channel.id, { title: `Bench episode ${i + 1}` }));
  const exporting = await createCrewedChannel(setup.db, "Export Channel");
  const exportEpisodes = [await createEpisode(setup.db, exporting.channel.id, { title: "Export half one" }), await createEpisode(setup.db, exporting.channel.id, { title: "Export half two" })] as const;
  await setup.close();

  console.log(`seeding ${CLIPS.toLocaleString("en")} clips…`);
  const seeded = await seedClips(url, crewed.channel.id, episodes.map((e) => e.id));
  console.log(`seeding ${EXPORT_CLIPS.toLocaleString("en")} clips × 10 marks in another channel…`);
  await seedExportChannel(seeded.pool, exporting.channel.id, [exportEpisodes[0].id, exportEpisodes[1].id]);

  const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, NODE_ENV: "production", PORT: String(port), APP_URL: appUrl, DATABASE_URL: url, SESSION_SECRET: "bench-secret-bench-secret-bench-secret-00", ...s3.env, NODE_NO_WARNINGS: "1" },
  });
  stops.push(() => stopChild(server));
  await waitForHttp(`${appUrl}/api/health`, 60_000);
  const call = await signedInCaller(appUrl, crewed.editor);

  // (a) the list: episode + rating + tag, first page and a page further on.
  const filter = `episodeId=${episodes[3]!.id}&rating=select&tag=wiring`;
  const first = (await call("GET", `/api/channels/${crewed.channel.id}/clips?${filter}`)) as { nextCursor: string | null; totals: { clips: number } };
  const timings: number[] = [];
  for (let i = 0; i < LIST_RUNS; i++) {
    const cursor = i % 2 === 1 && first.nextCursor ? `&cursor=${first.nextCursor}` : "";
    const started = performance.now();
    await call("GET", `/api/channels/${crewed.channel.id}/clips?${filter}${cursor}`);
    timings.push(performance.now() - started);
  }
  timings.sort((a, b) => a - b);
  const q = footageQuerySchema.parse({ episodeId: episodes[3]!.id, rating: "select", tag: "wiring" });
  const query = listClips(seeded.db, crewed.channel.id, q, null).toSQL();
  const plan = await seeded.pool.query(`explain (analyze, buffers) ${query.sql}`, query.params);
  console.log("\n── footage list ──");
  console.log(`filter: episode + rating=select + tag=wiring → ${first.totals.clips} of ${CLIPS} clips; ${LIST_RUNS} requests over HTTP (list page + totals)`);
  console.log(`p50 ${percentile(timings, 50).toFixed(1)} ms, p95 ${percentile(timings, 95).toFixed(1)} ms, max ${timings.at(-1)!.toFixed(1)} ms`);
  console.log("EXPLAIN ANALYZE of the page query:");
  for (const row of plan.rows as { "QUERY PLAN": string }[]) console.log(`  ${row["QUERY PLAN"]}`);
  const oneClip = (await seeded.pool.query("select id from clips where channel_id = $1 limit 1", [crewed.channel.id])).rows[0] as { id: string };
  await seeded.close();

  // (c) the export, while another channel's editor asks for one clip again and again.
  const exportFigures = await benchExport({
    exporter: await signedInGet(appUrl, exporting.editor),
    other: await signedInGet(appUrl, crewed.editor),
    exportBase: `/api/channels/${exporting.channel.id}`,
    episodeId: exportEpisodes[0].id,
    oneRowUrl: `/api/channels/${crewed.channel.id}/clips/${oneClip.id}`,
    serverPid: server.pid!,
  });

  // (b) the upload: the same file by the direct SDK and by the presigned path through the app, in turns.
  const file = path.join(work, "upload.bin");
  makeFile(file, UPLOAD_MIB);
  const size = UPLOAD_MIB * MiB;
  const { partSize, partCount } = planParts(size);
  const client = makeS3Client({ endpoint: s3.endpoint, region: "us-east-1", bucket: s3.bucket, accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey, forcePathStyle: true });

  console.log(`\n── upload of ${UPLOAD_MIB} MiB in ${partCount} parts of ${partSize / MiB} MiB, ${PARALLEL} at a time, ${UPLOAD_ROUNDS} rounds ──`);
  const direct = async (round: number) => {
    const key = `bench/direct-${round}`;
    const started = performance.now();
    const created = await client.send(new CreateMultipartUploadCommand({ Bucket: s3.bucket, Key: key }));
    const directParts: { PartNumber: number; ETag: string }[] = [];
    await inParallel(partCount, async (n) => {
      const body = await readPart(file, n, partSize, size);
      const out = await client.send(new UploadPartCommand({ Bucket: s3.bucket, Key: key, UploadId: created.UploadId, PartNumber: n, Body: body, ContentLength: body.length }));
      directParts.push({ PartNumber: n, ETag: out.ETag! });
    });
    directParts.sort((a, b) => a.PartNumber - b.PartNumber);
    await client.send(new CompleteMultipartUploadCommand({ Bucket: s3.bucket, Key: key, UploadId: created.UploadId, MultipartUpload: { Parts: directParts } }));
    return (performance.now() - started) / 1000;
  };

  const base = `/api/channels/${crewed.channel.id}`;
  const presigned = async () => {
    const started = performance.now();
    const { upload } = (await call("POST", `${base}/uploads`, { episodeId: episodes[0]!.id, fileName: "bench.mov", size })) as { upload: { id: string } };
    // The browser's own signer and records (src/features/rushes/uploader): URLs asked SIGN_AHEAD parts
    // per request ahead of their turn, stored parts recorded in batches, all records sent before completing.
    const plan = { uploadId: upload.id, partSize, size, partCount };
    const signer = new PartSigner(async (uploadId, parts) => ((await call("POST", `${base}/uploads/${uploadId}/part-urls`, { parts })) as unknown as PartUrlsAnswer).urls);
    const records = new PartRecords((parts) => call("POST", `${base}/uploads/${upload.id}/parts`, { parts }), () => undefined);
    await inParallel(partCount, async (n) => {
      const body = await readPart(file, n, partSize, size);
      const url = await signer.urlFor(plan, n, body.length, (p) => records.has(p));
      records.add({ partNumber: n, etag: await putPart(url, body), size: body.length });
    });
    await records.flush();
    await call("POST", `${base}/uploads/${upload.id}/complete`, {});
    return (performance.now() - started) / 1000;
  };

  // The SDK hashes each part for its signature (SHA-256 of the Buffer, @smithy/signature-v4's
  // getPayloadHash) and asks for 100-continue first (@aws-sdk/middleware-sdk-s3); a presigned URL
  // signs the length, not the bytes. So on a busy machine the presigned path may be the faster one.
  // Direct and presigned take turns, so a drift of the machine's speed during the run (storage's disk,
  // other work) falls on both: the ratio is of their summed times.
  const baseline = rssMb(server.pid!);
  let peak = baseline;
  let directSeconds = 0;
  let presignedSeconds = 0;
  for (let round = 1; round <= UPLOAD_ROUNDS; round++) {
    const d = await direct(round);
    const sampler = setInterval(() => (peak = Math.max(peak, rssMb(server.pid!))), 100);
    const p = await presigned();
    clearInterval(sampler);
    directSeconds += d;
    presignedSeconds += p;
    console.log(`round ${round}: direct SDK ${(UPLOAD_MIB / d).toFixed(1)} MiB/s, presigned path ${(UPLOAD_MIB / p).toFixed(1)} MiB/s (sign, PUT to storage, record, complete), ratio ${(d / p).toFixed(3)}`);
  }
  directSeconds /= UPLOAD_ROUNDS;
  presignedSeconds /= UPLOAD_ROUNDS;
  console.log(`all rounds:      direct ${(UPLOAD_MIB / directSeconds).toFixed(1)} MiB/s, presigned ${(UPLOAD_MIB / presignedSeconds).toFixed(1)} MiB/s, ratio ${(directSeconds / presignedSeconds).toFixed(3)}`);
  console.log(`app server RSS:  ${baseline.toFixed(0)} MB before, ${peak.toFixed(0)} MB at most during the presigned uploads`);

  const result = {
    other_channels: crowd.channels,
    other_episodes: crowd.episodes,
    other_clips: crowd.clips,
    clips: CLIPS,
    list_filter_matches: first.totals.clips,
    list_p50_ms: Number(percentile(timings, 50).toFixed(1)),
    list_p95_ms: Number(percentile(timings, 95).toFixed(1)),
    list_uses_index: plan.rows.some((r: { "QUERY PLAN": string }) => /Index|Bitmap/.test(r["QUERY PLAN"])),
    upload_mib: UPLOAD_MIB,
    upload_rounds: UPLOAD_ROUNDS,
    direct_mib_per_s: Number((UPLOAD_MIB / directSeconds).toFixed(1)),
    presigned_mib_per_s: Number((UPLOAD_MIB / presignedSeconds).toFixed(1)),
    upload_ratio: Number((directSeconds / presignedSeconds).toFixed(3)),
    server_rss_growth_mb: Number((peak - baseline).toFixed(1)),
    ...exportFigures,
  };
  console.log("");
  console.log(JSON.stringify(result));
}

let code = 1;
try {
  await main();
  code = 0;
} catch (error) {
  console.error(`[bench] ${(error as Error).stack ?? error}`);
} finally {
  for (const stop of stops.reverse()) await stop();
  rmSync(work, { recursive: true, force: true });
}
process.exit(code);
