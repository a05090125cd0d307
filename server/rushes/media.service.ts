import { createReadStream } from "node:fs";
import { mkdtemp, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { codecWord, mediaMismatches, rateFromText, type ProbedMedia } from "../../shared/rushes/media-check";
import { frameRateName, labelsDroppedPerMinute } from "../../shared/timecode/rates";
import { checkTimecode } from "../../shared/timecode/timecode";
import { inTransaction, type SqlExecutor } from "../db/transaction";
import { AppError, notFound } from "../http/app-error";
import { type LeftAlone, settleGivenUp } from "../jobs/given-up";
import type { Jobs } from "../jobs/queue";
import type { Caller } from "../http/route-table";
import { isStorageDown } from "../storage/storage";
import { INPUT_GUARDS, MediaToolError, runTool } from "./media-tools";
import * as repo from "./media.repository";
import { posterKey, proxyKey } from "./object-keys";
import type { RushesContext } from "./rushes.context";

/**
 * Media made on the server: for each new clip a job reads the stored file through a presigned URL
 * with Debian's ffprobe and ffmpeg, and makes a poster, a small H.264/AAC proxy and the probed
 * metadata. Why the work is bounded as it is: docs/decisions/0010-media-jobs-bounded-per-channel.md.
 */
export const CLIP_MEDIA_QUEUE = "rushes-clip-media";
/** Jobs one app instance runs at once (each ffmpeg limited to two threads). */
export const MEDIA_WORKERS = 2;

const PROBE_LIMIT = { timeoutMs: 60_000, maxStdoutBytes: 1_000_000 };
const POSTER_LIMIT = { timeoutMs: 120_000, maxStdoutBytes: 0 };
/** A proxy is made at about real time or faster; a whole card's file of an hour fits in the limit. */
const PROXY_LIMIT = { timeoutMs: 60 * 60_000, maxStdoutBytes: 0 };
/** pg-boss gives up on a run past this (a worker that died); the tools' own limits end sooner. */
const JOB_EXPIRY_SECONDS = 2 * 60 * 60;
/** The URL the tools read from outlives the longest run. */
const SOURCE_URL_SECONDS = 3 * 60 * 60;

export interface ClipMediaJob {
  channelId: string;
  clipId: string;
  [key: string]: unknown;
}

/**
 * Where pg-boss puts a copy of a clip's media job it gave up on: the run failed (the clip says why),
 * ran past JOB_EXPIRY_SECONDS (its process died), or was running when its process was stopped.
 */
export const CLIP_MEDIA_GIVEN_UP_QUEUE = "rushes-clip-media-given-up";
/** Runs a clip gets, counting those that never finished, before one that never finished fails it. */
const RUNS_ALLOWED = 3;
const STOPPED_REASON = "The server stopped before it finished this clip's poster and proxy, after several tries; retry, and tell whoever runs Kerf if it happens again.";

/** Queued inside the transaction that completes (or retries) the clip: the job exists only if the clip does. */
export function queueClipMedia(ctx: Pick<RushesContext, "jobs">, job: { channelId: string; clipId: string }, sql: SqlExecutor): Promise<void> {
  const options = { retryLimit: 0, expireInSeconds: JOB_EXPIRY_SECONDS, deadLetter: CLIP_MEDIA_GIVEN_UP_QUEUE, db: sql };
  return ctx.jobs.enqueue(CLIP_MEDIA_QUEUE, { channelId: job.channelId, clipId: job.clipId }, options);
}

export type MediaOutcome = { outcome: "made"; poster: boolean; proxy: boolean; mismatches: number } | { outcome: "skipped"; reason: string };
export type GivenUpOutcome = { outcome: "queued again" } | { outcome: "failed"; reason: string } | LeftAlone;

/**
 * A media job pg-boss gave up on. A run that failed has already said why on the clip; one that never
 * finished (a restart, a crash) left the clip waiting or making with no job to move it on, so it is
 * queued again, until it has had RUNS_ALLOWED runs, and then fails, saying so. A clip with a job of
 * its own still to run or running (a retry since) is left to that job; the clip's row is held while
 * this looks, as a retry holds it while it queues.
 */
export function settleGivenUpMedia(ctx: Pick<RushesContext, "db"> & { jobs: Pick<Jobs, "enqueue" | "countLive"> }, job: ClipMediaJob): Promise<GivenUpOutcome> {
  return settleGivenUp(ctx.db, ctx.jobs, {
    noun: "clip",
    queue: CLIP_MEDIA_QUEUE,
    key: "clipId",
    value: job.clipId,
    lock: (tx) => repo.lockMediaState(tx, job.channelId, job.clipId),
    unfinished: ["waiting", "making"],
    settle: async (tx, sql) => {
      const state = await repo.settleGivenUpClip(tx, job.channelId, job.clipId, RUNS_ALLOWED, STOPPED_REASON);
      if (state === "failed") return { outcome: "failed", reason: STOPPED_REASON };
      await queueClipMedia(ctx, job, sql);
      return { outcome: "queued again" };
    },
  });
}

interface ProbeAnswer {
  streams?: { codec_type?: string; codec_name?: string; width?: number; height?: number; avg_frame_rate?: string; r_frame_rate?: string; duration?: string }[];
  format?: { duration?: string };
}

function readProbe(json: string): { probed: ProbedMedia; hasVideo: boolean; hasAudio: boolean } {
  let answer: ProbeAnswer;
  try {
    answer = JSON.parse(json) as ProbeAnswer;
  } catch {
    throw new MediaToolError("Reading the file's details failed: the server got an answer it couldn't read.", "probe output not JSON");
  }
  const streams = Array.isArray(answer.streams) ? answer.streams : [];
  const video = streams.find((s) => s.codec_type === "video");
  const audio = streams.find((s) => s.codec_type === "audio");
  const seconds = Number(answer.format?.duration ?? video?.duration ?? audio?.duration);
  const rate = video ? (rateFromText(video.avg_frame_rate) ?? rateFromText(video.r_frame_rate)) : null;
  return {
    probed: {
      durationMs: Number.isFinite(seconds) && seconds >= 0 ? Math.round(seconds * 1000) : null,
      frameRate: rate,
      width: video?.width && video.width > 0 ? video.width : null,
      height: video?.height && video.height > 0 ? video.height : null,
      codec: video?.codec_name ? codecWord(video.codec_name) : null,
      audioCodec: audio?.codec_name ?? null,
    },
    hasVideo: Boolean(video),
    hasAudio: Boolean(audio),
  };
}

/** The clip's own columns take the file's values; a rate Kerf's timecode can't count stays as it was. */
function fileValues(clip: repo.ClaimedClip, probed: ProbedMedia) {
  const values: Record<string, unknown> = {};
  if (probed.durationMs !== null) values.durationMs = probed.durationMs;
  if (probed.width && probed.height) Object.assign(values, { width: probed.width, height: probed.height });
  if (probed.codec) values.codec = probed.codec;
  const rate = probed.frameRate;
  // Marks are frames counted at the clip's rate: once there are marks, the rate they count in stays.
  if (rate && frameRateName(rate) && clip.markCount === 0) {
    const dropFrame = clip.dropFrame && labelsDroppedPerMinute(rate) !== undefined;
    values.frameRateNumerator = rate.numerator;
    values.frameRateDenominator = rate.denominator;
    values.dropFrame = dropFrame;
    if (clip.startTimecode && !checkTimecode(clip.startTimecode, { rate, dropFrame }).ok) values.startTimecode = null;
  }
  return values;
}

async function upload(ctx: RushesContext, key: string, file: string, contentType: string): Promise<void> {
  const { size } = await stat(file);
  await ctx.storage.putStream(key, createReadStream(file), { contentType, size });
}

/** The words a failure shows on the clip. */
function reasonFor(error: unknown): string {
  if (error instanceof MediaToolError) return error.reason;
  if (isStorageDown(error)) return "Footage storage could not be reached while making the poster and proxy; retry in a moment.";
  return "Something went wrong on the server while making the poster and proxy; retry, and tell whoever runs Kerf if it happens again.";
}

/** The job: probe, poster, proxy, all from the stored file; the clip says "failed" and why, or "ready". */
export async function makeClipMedia(ctx: RushesContext, job: ClipMediaJob): Promise<MediaOutcome> {
  const clip = await repo.claimClip(ctx.db, job.channelId, job.clipId);
  if (!clip) return { outcome: "skipped", reason: "the clip is gone or not waiting" };
  const made: string[] = [];
  const folder = await mkdtemp(path.join(tmpdir(), "kerf-media-"));
  try {
    const source = await ctx.storage.presignGet(clip.objectKey, { expiresInSeconds: SOURCE_URL_SECONDS });
    const { probed, hasVideo, hasAudio } = readProbe(
      await runTool("ffprobe", [...INPUT_GUARDS, "-print_format", "json", "-show_format", "-show_streams", source], PROBE_LIMIT, "Reading the file's details"),
    );
    if (!hasVideo && !hasAudio) throw new MediaToolError("The file holds neither picture nor sound the server can read.", "no streams");
    let poster: string | null = null;
    let proxy: string | null = null;
    if (hasVideo) {
      const posterFile = path.join(folder, "poster.jpg");
      // A second in, as the browser's poster is; a clip shorter than two seconds from its middle.
      const at = probed.durationMs !== null ? Math.min(1, probed.durationMs / 2000) : 0;
      const posterArgs = (seek: number) => ["-ss", seek.toFixed(3), ...INPUT_GUARDS, "-i", source, "-frames:v", "1", "-vf", "scale=480:-2", "-q:v", "3", "-y", posterFile];
      await runTool("ffmpeg", posterArgs(at), POSTER_LIMIT, "Making the poster");
      if ((await stat(posterFile).catch(() => null))?.size) poster = posterFile;
      else if (at > 0) {
        await runTool("ffmpeg", posterArgs(0), POSTER_LIMIT, "Making the poster");
        if ((await stat(posterFile).catch(() => null))?.size) poster = posterFile;
      }
      if (!poster) throw new MediaToolError("The server couldn't take a picture from this file for its poster.", "no frame");
      proxy = path.join(folder, "proxy.mp4");
      await runTool(
        "ffmpeg",
        [
          ...INPUT_GUARDS,
          "-i", source,
          "-map", "0:v:0", "-map", "0:a:0?",
          // At most 720 lines, even sizes (4:2:0 needs them); 8-bit 4:2:0 H.264 plays in every browser.
          "-vf", "scale=-2:'2*trunc(min(720,ih)/2)'",
          "-c:v", "libx264", "-preset", "veryfast", "-crf", "26", "-pix_fmt", "yuv420p", "-threads", "2",
          "-c:a", "aac", "-b:a", "128k", "-ac", "2",
          "-movflags", "+faststart", "-y", proxy,
        ],
        PROXY_LIMIT,
        "Making the proxy",
      );
    }
    const posterObject = poster ? posterKey(clip.channelId, clip.episodeId) : null;
    const proxyObject = proxy ? proxyKey(clip.channelId, clip.episodeId) : null;
    if (poster && posterObject) {
      await upload(ctx, posterObject, poster, "image/jpeg");
      made.push(posterObject);
    }
    if (proxy && proxyObject) {
      await upload(ctx, proxyObject, proxy, "video/mp4");
      made.push(proxyObject);
    }
    const mismatches = mediaMismatches(probed, {
      durationMs: clip.durationMs,
      frameRate: clip.frameRateNumerator && clip.frameRateDenominator ? { numerator: clip.frameRateNumerator, denominator: clip.frameRateDenominator } : null,
      width: clip.width,
      height: clip.height,
      codec: clip.codec,
    });
    const kept = await repo.finishClip(ctx.db, clip.channelId, clip.id, {
      ...fileValues(clip, probed),
      probed,
      mediaMismatches: mismatches,
      serverPosterKey: posterObject,
      proxyKey: proxyObject,
    });
    if (!kept) {
      // Deleted (or taken by another run) meanwhile: what this run stored goes.
      await removeAll(ctx, made);
      return { outcome: "skipped", reason: "the clip was deleted while its media was made" };
    }
    // A run before this one that died after storing leaves objects the row no longer names.
    await removeAll(ctx, [clip.serverPosterKey, clip.proxyKey].filter((key): key is string => key !== null && !made.includes(key)));
    return { outcome: "made", poster: Boolean(posterObject), proxy: Boolean(proxyObject), mismatches: mismatches.length };
  } catch (error) {
    await removeAll(ctx, made);
    await repo.failClip(ctx.db, clip.channelId, clip.id, reasonFor(error));
    const detail = error instanceof MediaToolError ? error.detail : (error as Error).message;
    console.error(`[rushes] media for clip ${clip.id} of channel ${clip.channelId} failed: ${detail}`);
    throw error;
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

async function removeAll(ctx: RushesContext, keys: string[]): Promise<void> {
  await Promise.all(keys.map((key) => ctx.storage.remove(key).catch(() => undefined)));
}

/** Retry: a failed clip waits again, its job queued in the same transaction. Anything but failed is a 409. */
export async function retryClipMedia(ctx: RushesContext, caller: Caller, clipId: string): Promise<void> {
  await inTransaction(ctx.db, async (tx, sql) => {
    const state = await repo.lockMediaState(tx, caller.channelId, clipId);
    if (state === null) throw notFound("Clip");
    if (state !== "failed") {
      const why = { waiting: "This clip's poster and proxy are already queued.", making: "This clip's poster and proxy are being made now.", ready: "This clip's poster and proxy are already made." }[state];
      throw new AppError("conflict", why, undefined, { state });
    }
    await repo.requeueClip(tx, caller.channelId, clipId);
    await queueClipMedia(ctx, { channelId: caller.channelId, clipId }, sql);
  });
}
