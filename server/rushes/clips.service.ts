import type { Request, Response } from "express";
import type { z } from "zod";
import { decodeCursor, encodeCursor, type FootageQuery } from "../../shared/rushes/footage-query";
import { roleMay } from "../../shared/access/roles";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import type { ClipDetail, ClipView, FootagePage, MarkPatch, MarkView, markInputSchema, updateClipSchema } from "../../shared/rushes/schemas";
import { type TimecodeFormat, describeFormat } from "../../shared/timecode/rates";
import { frameCount } from "../../shared/timecode/playhead";
import { markRangeAt } from "../../shared/timecode/schemas";
import { formatTimecode, parseTimecode } from "../../shared/timecode/timecode";
import { fieldMessages } from "../../shared/http/errors";
import type { Queryable } from "../db/client";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { viaStorage } from "../storage/storage";
import * as repo from "./clips.repository";
import { posterKey } from "./object-keys";
import type { RushesContext } from "./rushes.context";
import * as shootRepo from "./shoot.repository";
import { receiveStill } from "../storage/photo-stream";

type ClipRow = repo.ClipRow;
type MarkRow = Awaited<ReturnType<typeof repo.marksOf>>[number];

const POSTER_URL_SECONDS = 30 * 60;

/** A short-lived GET of a clip's poster frame, or null when it has none. */
export async function posterUrlOf(ctx: RushesContext, posterKey: string | null): Promise<string | null> {
  if (!posterKey) return null;
  // Signing is local arithmetic (no call to the store), so a list of fifty costs nothing to sign.
  return ctx.storage.presignGet(posterKey, { expiresInSeconds: POSTER_URL_SECONDS, contentType: "image/jpeg" });
}

/** The server's poster is read from the file itself; the browser's stands in until then. */
export const posterKeyOf = (row: { serverPosterKey: string | null; posterKey: string | null }) => row.serverPosterKey ?? row.posterKey;

const posterUrl = (ctx: RushesContext, row: ClipRow) => posterUrlOf(ctx, posterKeyOf(row));

export async function toClipView(ctx: RushesContext, row: ClipRow): Promise<ClipView> {
  return {
    id: row.id,
    episodeId: row.episodeId,
    episodeTitle: row.episodeTitle,
    shootDayId: row.shootDayId,
    shotId: row.shotId,
    shotDescription: row.shotDescription,
    benchRunId: row.benchRunId,
    buildIterationId: row.buildIterationId,
    fileName: row.fileName,
    contentType: row.contentType,
    size: row.size,
    storageEtag: row.storageEtag,
    sha256: row.sha256,
    durationMs: row.durationMs,
    frameRate: row.frameRateNumerator && row.frameRateDenominator ? { numerator: row.frameRateNumerator, denominator: row.frameRateDenominator } : null,
    dropFrame: row.dropFrame,
    width: row.width,
    height: row.height,
    codec: row.codec,
    startTimecode: row.startTimecode,
    camera: row.camera,
    recordedAt: row.recordedAt.toISOString(),
    kind: row.kind,
    rating: row.rating,
    tags: row.tags,
    notes: row.notes,
    markCount: row.markCount,
    posterUrl: await posterUrl(ctx, row),
    uploadedBy: row.uploadedBy,
    createdAt: row.createdAt.toISOString(),
    media: { state: row.mediaState, failure: row.mediaFailure, attempts: row.mediaAttempts, mismatches: row.mediaMismatches, hasProxy: row.proxyKey !== null },
  };
}

const toMarkView = (m: MarkRow): MarkView => ({
  id: m.id,
  in: m.inLabel,
  out: m.outLabel,
  inFrame: m.inFrame,
  outFrame: m.outFrame,
  note: m.note,
  benchRunId: m.benchRunId,
  buildIterationId: m.buildIterationId,
});

/**
 * What a clip or a mark says it shows must be a bench run or build iteration of the clip's own
 * episode; another episode's, another channel's or none at all is the same plain 400. Checked in the
 * write's transaction, the run or iteration held until it commits: one deleted meanwhile can't fail the key.
 */
async function checkShows(tx: Queryable, channelId: string, episodeId: string, links: { benchRunId?: string | null; buildIterationId?: string | null }, what: "clip" | "mark") {
  const whose = what === "clip" ? "this clip's episode" : "the episode of this mark's clip";
  const fields: Record<string, string> = {};
  if (links.benchRunId && (await repo.benchRunEpisode(tx, channelId, links.benchRunId)) !== episodeId) fields.benchRunId = `Choose a bench run of ${whose}.`;
  if (links.buildIterationId && (await repo.buildIterationEpisode(tx, channelId, links.buildIterationId)) !== episodeId) fields.buildIterationId = `Choose a build iteration of ${whose}.`;
  if (Object.keys(fields).length > 0) throw new AppError("validation_failed", "Some fields need attention.", fields);
}

export async function listFootage(ctx: RushesContext, caller: Caller, q: FootageQuery): Promise<FootagePage> {
  const cursor = q.cursor ? decodeCursor(q.cursor, q.sort) : null;
  if (q.cursor && !cursor) throw new AppError("validation_failed", "That page link is out of date; start from the first page.", { cursor: "Not a page of this list." });
  const [rows, totals] = await Promise.all([repo.listClips(ctx.db, caller.channelId, q, cursor), repo.footageTotals(ctx.db, caller.channelId, q)]);
  const page = rows.slice(0, q.limit);
  const last = page.at(-1);
  const nextCursor = rows.length > q.limit && last ? encodeCursor({ v: last.sortValue, id: last.id }) : null;
  return { clips: await Promise.all(page.map((row) => toClipView(ctx, row))), nextCursor, totals };
}

async function clipOrNotFound(ctx: RushesContext, caller: Caller, clipId: string): Promise<ClipRow> {
  const row = await repo.findClip(ctx.db, caller.channelId, clipId);
  if (!row) throw notFound("Clip");
  return row;
}

export async function getClip(ctx: RushesContext, caller: Caller, clipId: string): Promise<ClipDetail> {
  const row = await clipOrNotFound(ctx, caller, clipId);
  const marks = await repo.marksOf(ctx.db, [row.id]);
  return { ...(await toClipView(ctx, row)), marks: marks.map(toMarkView) };
}

type ClipPatch = z.infer<typeof updateClipSchema>;

/** Logging: links, tags, rating, notes. Linking a shot marks it captured; unlinking may plan it again. */
export async function updateClip(ctx: RushesContext, caller: Caller, clipId: string, patch: ClipPatch): Promise<ClipDetail> {
  const row = await clipOrNotFound(ctx, caller, clipId);
  const values: Record<string, unknown> = { ...patch };
  if (patch.shotId) {
    const shot = await shootRepo.findShot(ctx.db, caller.channelId, patch.shotId);
    if (!shot || shot.episodeId !== row.episodeId) throw new AppError("validation_failed", "Some fields need attention.", { shotId: "Choose a shot of this clip's episode." });
    // The shot says what kind of footage this is and which day it belongs to, unless the person says otherwise.
    if (patch.kind === undefined && row.kind === null) values.kind = shot.kind;
    if (patch.shootDayId === undefined && row.shootDayId === null && shot.shootDayId) values.shootDayId = shot.shootDayId;
  }
  const shootDayId = values.shootDayId as string | null | undefined;
  if (shootDayId) {
    const day = await shootRepo.findShootDay(ctx.db, caller.channelId, shootDayId);
    if (!day || day.episodeId !== row.episodeId) throw new AppError("validation_failed", "Some fields need attention.", { shootDayId: "Choose a shoot day of this clip's episode." });
  }
  await ctx.db.transaction(async (tx) => {
    await checkShows(tx, caller.channelId, row.episodeId, patch, "clip");
    await repo.updateClip(tx, caller.channelId, clipId, values);
    if (patch.shotId !== undefined && patch.shotId !== row.shotId) {
      if (row.shotId) await shootRepo.refreshShotStatus(tx, row.shotId);
      if (patch.shotId) await shootRepo.refreshShotStatus(tx, patch.shotId);
    }
  });
  return getClip(ctx, caller, clipId);
}

/** Deleting footage (the role table's "footageRemoval"). The object goes first, so a store that is down changes nothing. */
export async function deleteClip(ctx: RushesContext, caller: Caller, clipId: string): Promise<void> {
  const row = await clipOrNotFound(ctx, caller, clipId);
  await viaStorage(() => ctx.storage.remove(row.objectKey));
  for (const key of [row.posterKey, row.serverPosterKey, row.proxyKey]) if (key) await ctx.storage.remove(key).catch(() => undefined);
  await ctx.db.transaction(async (tx) => {
    await repo.deleteClip(tx, caller.channelId, clipId);
    if (row.shotId) await shootRepo.refreshShotStatus(tx, row.shotId);
  });
}

/** A poster frame streamed into storage; the one it replaces is removed (best effort). */
export async function setPoster(ctx: RushesContext, caller: Caller, clipId: string, req: Request, res: Response): Promise<ClipDetail> {
  const clip = await clipOrNotFound(ctx, caller, clipId);
  const { file } = await receiveStill(req, res, ctx.storage, () => posterKey(caller.channelId, clip.episodeId));
  await repo.updateClip(ctx.db, caller.channelId, clip.id, { posterKey: file.key });
  if (clip.posterKey) await ctx.storage.remove(clip.posterKey).catch(() => undefined);
  return getClip(ctx, caller, clip.id);
}

export function clipFormat(row: Pick<ClipRow, "frameRateNumerator" | "frameRateDenominator" | "dropFrame">): TimecodeFormat | null {
  return row.frameRateNumerator && row.frameRateDenominator ? { rate: { numerator: row.frameRateNumerator, denominator: row.frameRateDenominator }, dropFrame: row.dropFrame } : null;
}

/** In and out at the clip's own rate and count, inside the clip, out after in. */
function checkMark(row: ClipRow, input: { in: string; out: string }): { inFrame: number; outFrame: number; inLabel: string; outLabel: string } {
  const format = clipFormat(row);
  if (!format) throw new AppError("unprocessable", "This clip has no frame rate, so it can't take timecode marks.");
  const parsed = markRangeAt(format).safeParse({ in: input.in, out: input.out });
  if (!parsed.success) throw new AppError("validation_failed", "Check the in and out points.", fieldMessages(parsed.error.issues));
  const inFrame = parseTimecode(input.in, format);
  const outFrame = parseTimecode(input.out, format);
  const start = row.startTimecode ? parseTimecode(row.startTimecode, format) : 0;
  const length = frameCount(row.durationMs, format.rate);
  const fields: Record<string, string> = {};
  const label = (f: number) => formatTimecode(f, format);
  if (inFrame < start) fields.in = `The clip starts at ${label(start)}; the in point can't be before it.`;
  if (row.durationMs > 0 && outFrame > start + length) fields.out = `The clip ends at ${label(start + length)} (${describeFormat(format)}); the out point can't be after it.`;
  if (Object.keys(fields).length > 0) throw new AppError("validation_failed", "Check the in and out points.", fields);
  // Stored as Kerf writes labels, so "1:00:00:00"-style spacing differences never show.
  return { inFrame, outFrame, inLabel: label(inFrame), outLabel: label(outFrame) };
}

export async function addMark(ctx: RushesContext, caller: Caller, clipId: string, input: z.infer<typeof markInputSchema>): Promise<MarkView> {
  const row = await clipOrNotFound(ctx, caller, clipId);
  const range = checkMark(row, input);
  const mark = await ctx.db.transaction(async (tx) => {
    await checkShows(tx, caller.channelId, row.episodeId, input, "mark");
    const made = await repo.insertMark(tx, {
      channelId: caller.channelId,
      clipId,
      ...range,
      note: input.note,
      benchRunId: input.benchRunId ?? null,
      buildIterationId: input.buildIterationId ?? null,
      createdBy: caller.userId,
    });
    await repo.refreshMarkCount(tx, clipId);
    return made;
  });
  return toMarkView(mark);
}

/** A mark's in, out and note, and what it shows; a field the patch leaves out stays as it is. */
export async function updateMark(ctx: RushesContext, caller: Caller, clipId: string, markId: string, input: MarkPatch): Promise<MarkView> {
  const row = await clipOrNotFound(ctx, caller, clipId);
  const mark = await repo.findMark(ctx.db, caller.channelId, clipId, markId);
  if (!mark) throw notFound("Mark");
  const range = input.in !== undefined || input.out !== undefined ? checkMark(row, { in: input.in ?? mark.inLabel, out: input.out ?? mark.outLabel }) : {};
  const values = {
    ...range,
    ...(input.note !== undefined && { note: input.note }),
    ...(input.benchRunId !== undefined && { benchRunId: input.benchRunId }),
    ...(input.buildIterationId !== undefined && { buildIterationId: input.buildIterationId }),
  };
  return ctx.db.transaction(async (tx) => {
    await checkShows(tx, caller.channelId, row.episodeId, input, "mark");
    return toMarkView(Object.keys(values).length > 0 ? await repo.updateMark(tx, markId, values) : mark);
  });
}

/** A role that may not remove footage (crew) logs and marks, and takes back only the marks it made. */
export async function deleteMark(ctx: RushesContext, caller: Caller, clipId: string, markId: string): Promise<void> {
  await clipOrNotFound(ctx, caller, clipId);
  const mark = await repo.findMark(ctx.db, caller.channelId, clipId, markId);
  if (!mark) throw notFound("Mark");
  if (!roleMay(caller.role, "footageRemoval", "W") && mark.createdBy !== caller.userId) throw new AppError("forbidden", "Crew can delete only the marks they made.");
  await ctx.db.transaction(async (tx) => {
    await repo.deleteMark(tx, markId);
    await repo.refreshMarkCount(tx, clipId);
  });
}

/** A short-lived link to one object: the preview player streams straight from the store. */
export async function previewUrl(ctx: RushesContext, caller: Caller, clipId: string, download: boolean) {
  const row = await clipOrNotFound(ctx, caller, clipId);
  // The player gets the server's proxy once there is one (any browser plays it); a download is always the original.
  const proxy = !download && row.proxyKey !== null;
  const url = await viaStorage(() =>
    proxy
      ? ctx.storage.presignGet(row.proxyKey!, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: "video/mp4" })
      : ctx.storage.presignGet(row.objectKey, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: row.contentType, fileName: download ? row.fileName : undefined }),
  );
  return { url, expiresAt: new Date(Date.now() + PREVIEW_URL_SECONDS * 1000).toISOString(), source: proxy ? ("proxy" as const) : ("original" as const) };
}
