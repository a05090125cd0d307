import { roleMay } from "../../shared/access/roles";
import { checkClipFile, partRange, planParts, PART_URL_SECONDS, ABANDONED_AFTER_HOURS } from "../../shared/rushes/limits";
import { sha256Pattern, type ChecksumAnswer, type ClipMetadata, type PartUrlsAnswer, type UploadPart, type UploadView } from "../../shared/rushes/schemas";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { eachItem, emptyTally, mergeTallies, type ItemTally } from "../jobs/each-item";
import { isStorageDown, storageDown, viaStorage } from "../storage/storage";
import { inTransaction } from "../db/transaction";
import { queueClipMedia } from "./media.service";
import { footageKey } from "./object-keys";
import type { RushesContext } from "./rushes.context";
import * as repo from "./uploads.repository";

type UploadRow = repo.UploadRow;

function toView(row: UploadRow, parts: { partNumber: number; etag: string; size: number }[]): UploadView {
  return {
    id: row.id,
    episodeId: row.episodeId,
    fileName: row.fileName,
    contentType: row.contentType,
    size: row.sizeBytes,
    partSize: row.partSize,
    partCount: row.partCount,
    status: row.status,
    fingerprint: row.fingerprint,
    parts,
    clipId: row.clipId,
    createdAt: row.createdAt.toISOString(),
  };
}

function fileRefusal(check: Exclude<ReturnType<typeof checkClipFile>, { ok: true }>): AppError {
  const code = check.status === 413 ? "payload_too_large" : check.status === 415 ? "unsupported_media_type" : "validation_failed";
  return new AppError(code, check.message, check.status === 400 ? { size: check.message } : undefined);
}

/** A person starts an upload: Kerf checks the file, makes the key, and opens a multipart upload. */
export async function startUpload(
  ctx: RushesContext,
  caller: Caller,
  input: { episodeId: string; fileName: string; size: number; fingerprint: string; metadata?: ClipMetadata },
): Promise<UploadView> {
  const episode = await repo.episodeInChannel(ctx.db, caller.channelId, input.episodeId);
  if (!episode) throw new AppError("validation_failed", "Some fields need attention.", { episodeId: "That episode is not in this channel." });
  const check = checkClipFile(input.fileName, input.size);
  if (!check.ok) throw fileRefusal(check);
  const { partSize, partCount } = planParts(input.size);
  const objectKey = footageKey(caller.channelId, episode.id);
  // Storage first: if it is down nothing is written, and the 503 says so.
  const storageUploadId = await viaStorage(() => ctx.storage.createMultipart(objectKey, check.contentType));
  const row = await repo.insertUpload(ctx.db, {
    channelId: caller.channelId,
    episodeId: episode.id,
    createdBy: caller.userId,
    fileName: input.fileName,
    contentType: check.contentType,
    sizeBytes: input.size,
    partSize,
    partCount,
    objectKey,
    storageUploadId,
    fingerprint: input.fingerprint,
    metadata: input.metadata ?? null,
  });
  return toView(row, []);
}

async function openUpload(ctx: RushesContext, caller: Caller, uploadId: string): Promise<UploadRow> {
  const row = await repo.findUpload(ctx.db, caller.channelId, uploadId);
  if (!row) throw notFound("Upload");
  return row;
}

function mustBeUploading(row: UploadRow): void {
  if (row.status === "uploading") return;
  const why = {
    completed: "This upload is already complete.",
    cancelled: "This upload was cancelled; start the file again.",
    abandoned: "This upload was stopped after a day without progress; start the file again.",
    refused: "Storage refused this file as it was sent; start the file again.",
  }[row.status];
  throw new AppError("conflict", why, undefined, { status: row.status });
}

function checkPartNumber(row: UploadRow, partNumber: number): void {
  if (!Number.isInteger(partNumber) || partNumber < 1 || partNumber > row.partCount) {
    throw new AppError("validation_failed", `This file has parts 1 to ${row.partCount}.`, { partNumber: `Part ${partNumber} is not one of this file's ${row.partCount} parts.` });
  }
}

export async function getUpload(ctx: RushesContext, caller: Caller, uploadId: string): Promise<UploadView> {
  const row = await openUpload(ctx, caller, uploadId);
  return toView(row, await repo.partsOf(ctx.db, row.id));
}

/** The person's unfinished uploads with the parts already stored: what the page resumes after a reload. */
export async function listOpenUploads(ctx: RushesContext, caller: Caller, episodeId?: string): Promise<UploadView[]> {
  const rows = await repo.openUploads(ctx.db, caller.channelId, { episodeId, createdBy: caller.userId });
  const parts = await repo.partsOfMany(ctx.db, rows.map((r) => r.id));
  return rows.map((row) => toView(row, parts.filter((p) => p.uploadId === row.id).map(({ partNumber, etag, size }) => ({ partNumber, etag, size }))));
}

/**
 * Before a file is sent: is a clip with this SHA-256 in the channel already? Only this channel's clips
 * are looked at; a checksum that isn't 64 hex digits is refused.
 */
export async function findByChecksum(ctx: RushesContext, caller: Caller, sha256: string): Promise<ChecksumAnswer> {
  if (!sha256Pattern.test(sha256)) {
    throw new AppError("validation_failed", "A checksum is 64 hex digits (SHA-256).", { sha256: "Write the SHA-256 as 64 hex digits, lower case." });
  }
  return { clip: await repo.clipWithChecksum(ctx.db, caller.channelId, sha256) };
}

/** A part's size must be the one the upload's plan gives it: that length is what its URL will accept. */
function checkPartSize(row: UploadRow, part: { partNumber: number; size: number }): void {
  const { start, end } = partRange(part.partNumber, row.partSize, row.sizeBytes);
  if (part.size !== end - start) {
    throw new AppError("validation_failed", `Part ${part.partNumber} should be ${end - start} bytes, not ${part.size}.`, { size: `Part ${part.partNumber} should be ${end - start} bytes.` });
  }
}

/**
 * Presigned URLs for some parts: each for one part of one upload, for exactly that part's bytes
 * (the length is signed), for a quarter of an hour.
 */
export async function signParts(ctx: RushesContext, caller: Caller, uploadId: string, parts: { partNumber: number; size: number }[]): Promise<PartUrlsAnswer> {
  const row = await openUpload(ctx, caller, uploadId);
  mustBeUploading(row);
  for (const part of parts) {
    checkPartNumber(row, part.partNumber);
    checkPartSize(row, part);
  }
  const partNumbers = [...new Set(parts.map((p) => p.partNumber))];
  const urls = await viaStorage(() =>
    Promise.all(
      partNumbers.map(async (partNumber) => {
        const { start, end } = partRange(partNumber, row.partSize, row.sizeBytes);
        return { partNumber, start, end, url: await ctx.storage.presignPart(row.objectKey, row.storageUploadId, partNumber, end - start, PART_URL_SECONDS) };
      }),
    ),
  );
  await repo.touchUpload(ctx.db, row.id);
  return { urls, expiresAt: new Date(Date.now() + PART_URL_SECONDS * 1000).toISOString() };
}

/** The browser reports parts stored (each one's number, its ETag from the store, its size), a few at a time. */
export async function recordParts(ctx: RushesContext, caller: Caller, uploadId: string, parts: UploadPart[]): Promise<{ parts: UploadPart[] }> {
  const row = await openUpload(ctx, caller, uploadId);
  mustBeUploading(row);
  for (const part of parts) {
    checkPartNumber(row, part.partNumber);
    checkPartSize(row, part);
  }
  const recorded = await ctx.db.transaction((tx) => repo.recordParts(tx, row.id, parts));
  // Completed or cancelled since it was read: say so as if it had been so before.
  if (!recorded) mustBeUploading(await openUpload(ctx, caller, uploadId));
  return { parts };
}

function missingParts(partCount: number, stored: { partNumber: number }[]): number[] {
  const have = new Set(stored.map((p) => p.partNumber));
  const missing: number[] = [];
  for (let n = 1; n <= partCount; n++) if (!have.has(n)) missing.push(n);
  return missing;
}

const listNumbers = (numbers: number[]) => (numbers.length > 8 ? `${numbers.slice(0, 8).join(", ")} and ${numbers.length - 8} more` : numbers.join(", "));

function clipValues(row: UploadRow, metadata: ClipMetadata | null, storageEtag: string | null, sha256: string | undefined) {
  return {
    channelId: row.channelId,
    episodeId: row.episodeId,
    uploadedBy: row.createdBy,
    objectKey: row.objectKey,
    fileName: row.fileName,
    contentType: row.contentType,
    sizeBytes: row.sizeBytes,
    storageEtag,
    sha256: sha256 ?? null,
    durationMs: metadata?.durationMs ?? 0,
    frameRateNumerator: metadata?.frameRate?.numerator ?? null,
    frameRateDenominator: metadata?.frameRate?.denominator ?? null,
    dropFrame: metadata?.dropFrame ?? false,
    width: metadata?.width ?? null,
    height: metadata?.height ?? null,
    codec: metadata?.codec ?? null,
    startTimecode: metadata?.startTimecode ?? null,
    camera: metadata?.camera ?? "",
    recordedAt: metadata?.recordedAt ? new Date(metadata.recordedAt) : new Date(),
    mediaState: "waiting" as const,
  };
}

/**
 * Completion: only when Kerf holds a record of every part, storage accepts the list, and the stored
 * object has the file's size. Then, and only then, the clip row exists. An object of any other size
 * is removed from storage and the upload closed as refused, so nothing Kerf didn't accept stays.
 */
export async function completeUpload(ctx: RushesContext, caller: Caller, uploadId: string, body: { sha256?: string; metadata?: ClipMetadata }) {
  const done = await inTransaction(ctx.db, async (tx, sql) => {
    const row = await repo.lockUpload(tx, caller.channelId, uploadId);
    if (!row) throw notFound("Upload");
    if (row.status === "completed" && row.clipId) return { clipId: row.clipId, alreadyComplete: true };
    mustBeUploading(row);
    const parts = await repo.partsOf(tx, row.id);
    const missing = missingParts(row.partCount, parts);
    if (missing.length > 0) {
      throw new AppError("conflict", `Storage doesn't have every part yet: part ${listNumbers(missing)} of ${row.partCount} still to send.`, undefined, { missing });
    }
    const stored = parts.reduce((sum, p) => sum + p.size, 0);
    if (stored !== row.sizeBytes) throw new AppError("conflict", `The parts add up to ${stored} bytes; the file is ${row.sizeBytes}.`);

    let etag: string | null = null;
    try {
      ({ etag } = await ctx.storage.completeMultipart(row.objectKey, row.storageUploadId, parts));
    } catch (error) {
      if (isStorageDown(error)) throw storageDown();
      // A completion that reached the store before (and whose answer was lost) leaves the object there.
      if (!(await viaStorage(() => ctx.storage.head(row.objectKey)))) {
        throw new AppError("conflict", "Storage refused the parts as recorded; send the file again.", undefined, { storage: (error as Error).name });
      }
    }
    const object = await viaStorage(() => ctx.storage.head(row.objectKey));
    if (!object || object.size !== row.sizeBytes) return { refused: await refuse(ctx, tx, row, object?.size ?? 0) };
    const clip = await repo.insertClip(tx, clipValues(row, body.metadata ?? row.metadata, etag ?? object.etag, body.sha256));
    await repo.finishUpload(tx, row.id, "completed", clip.id);
    // The server's poster, proxy and probe: queued with the clip, so neither exists without the other.
    await queueClipMedia(ctx, { channelId: row.channelId, clipId: clip.id }, sql);
    return { clipId: clip.id, alreadyComplete: false };
  });
  // Thrown after the commit: the refusal (and the removal it records) stands.
  if ("refused" in done) throw done.refused;
  return done;
}

/** Bytes in storage that are not the file: removed, and the upload closed as refused. */
async function refuse(ctx: RushesContext, tx: repo.Executor, row: UploadRow, heldBytes: number): Promise<AppError> {
  await viaStorage(() => ctx.storage.discardUpload(row.objectKey, row.storageUploadId));
  await repo.finishUpload(tx, row.id, "refused");
  return new AppError("conflict", `Storage held ${heldBytes} bytes for this file, not ${row.sizeBytes}, so Kerf removed them; send the file again.`);
}

/**
 * Cancel: storage aborts the upload and drops anything of it, then the upload is marked cancelled.
 * The row stays locked meanwhile, so a completion under way finishes first (and the cancel is refused).
 * With storage down it answers 503 and changes nothing; the sweep clears it a day later. A role that
 * may not remove footage (crew) cancels only its own uploads.
 */
export async function cancelUpload(ctx: RushesContext, caller: Caller, uploadId: string) {
  return ctx.db.transaction(async (tx) => {
    const row = await repo.lockUpload(tx, caller.channelId, uploadId);
    if (!row) throw notFound("Upload");
    if (!roleMay(caller.role, "footageRemoval", "W") && row.createdBy !== caller.userId) {
      throw new AppError("forbidden", "Crew can cancel only their own uploads.");
    }
    if (row.status === "completed") throw new AppError("conflict", "This upload is already complete; the clip stays in the footage list.");
    if (row.status !== "uploading") return { status: row.status, storage: "nothing to do" as const };
    await viaStorage(() => ctx.storage.discardUpload(row.objectKey, row.storageUploadId));
    await repo.finishUpload(tx, row.id, "cancelled");
    return { status: "cancelled" as const, storage: "aborted" as const };
  });
}

/**
/**
 * The scheduled sweep: each upload with no progress for a day is discarded in storage and marked
 * abandoned, one at a time. One that fails (storage can't discard it now, a row that can't change) is
 * logged, counted and stays open for the next sweep; the sweep goes on with the rest.
 */
export async function sweepAbandonedUploads(ctx: Pick<RushesContext, "db" | "storage">, now = new Date()): Promise<{ abandoned: number; deferred: number } & ItemTally> {
  const before = new Date(now.getTime() - ABANDONED_AFTER_HOURS * 3600 * 1000);
  let abandoned = 0;
  let tally = emptyTally();
  for (let after: string | null = null; ; ) {
    const batch = await repo.staleUploads(ctx.db, before, after);
    if (batch.length === 0) return { abandoned, deferred: tally.failed, ...tally };
    const round = await eachItem("abandoned uploads", batch, (upload) => `upload ${upload.id} of channel ${upload.channelId}`, async (upload) => {
      if (await abandon(ctx, upload.id, before)) abandoned++;
    });
    tally = mergeTallies(tally, round);
    after = batch.at(-1)!.id;
  }
}

async function abandon(ctx: Pick<RushesContext, "db" | "storage">, uploadId: string, before: Date): Promise<boolean> {
  return ctx.db.transaction(async (tx) => {
    // Still open and still stale: a completion or a part since the list was read keeps it alive.
    const row = await repo.lockStaleUpload(tx, uploadId, before);
    if (!row) return false;
    await ctx.storage.discardUpload(row.objectKey, row.storageUploadId);
    await repo.finishUpload(tx, row.id, "abandoned");
    return true;
  });
}
