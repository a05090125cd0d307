import type { Readable } from "node:stream";
import type { Response } from "express";
import { ZipArchive } from "archiver";
import type { FootageQuery } from "../../shared/rushes/footage-query";
import type { ExportClip } from "../../shared/rushes/exports/clip-ranges";
import { footageCsv } from "../../shared/rushes/exports/footage-csv";
import { EdlError, footageEdl } from "../../shared/rushes/exports/edl";
import { footageOtio } from "../../shared/rushes/exports/otio";
import { AppError } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { attachmentDisposition, isMissingObject, viaStorage } from "../storage/storage";
import * as repo from "./clips.repository";
import type { RushesContext } from "./rushes.context";

/** Exports hold the whole filter, up to this many clips (the list's totals say when there are more). */
export const EXPORT_CAP = 5_000;
export const ZIP_CAP = 200;

export async function exportClips(ctx: RushesContext, caller: Caller, q: FootageQuery): Promise<ExportClip[]> {
  const rows = await repo.allClips(ctx.db, caller.channelId, q, EXPORT_CAP);
  const marks = await repo.marksOf(ctx.db, rows.map((r) => r.id));
  return rows.map((row) => ({
    id: row.id,
    fileName: row.fileName,
    objectKey: row.objectKey,
    episodeTitle: row.episodeTitle,
    shootDay: row.shootDay,
    shotDescription: row.shotDescription,
    kind: row.kind,
    rating: row.rating,
    tags: row.tags,
    camera: row.camera,
    recordedAt: row.recordedAt.toISOString(),
    durationMs: row.durationMs,
    frameRate: row.frameRateNumerator && row.frameRateDenominator ? { numerator: row.frameRateNumerator, denominator: row.frameRateDenominator } : null,
    dropFrame: row.dropFrame,
    startTimecode: row.startTimecode,
    size: row.size,
    notes: row.notes,
    marks: marks.filter((m) => m.clipId === row.id).map((m) => ({ in: m.inLabel, out: m.outLabel, inFrame: m.inFrame, outFrame: m.outFrame, note: m.note })),
  }));
}

export type ExportKind = "csv" | "edl" | "otio";

const exportTypes: Record<ExportKind, { type: string; extension: string }> = {
  csv: { type: "text/csv; charset=utf-8; header=present", extension: "csv" },
  edl: { type: "text/plain; charset=utf-8", extension: "edl" },
  otio: { type: "application/json; charset=utf-8", extension: "otio" },
};

export async function writeExport(ctx: RushesContext, caller: Caller, q: FootageQuery, kind: ExportKind, res: Response): Promise<void> {
  const clips = await exportClips(ctx, caller, q);
  const title = clips[0] && clips.every((c) => c.episodeTitle === clips[0]!.episodeTitle) ? clips[0].episodeTitle : "Kerf footage";
  let body: string;
  try {
    body = kind === "csv" ? footageCsv(clips) : kind === "edl" ? footageEdl(title, clips) : footageOtio(title, clips);
  } catch (error) {
    if (error instanceof EdlError) throw new AppError("unprocessable", error.message);
    throw error;
  }
  const stamp = new Date().toISOString().slice(0, 10);
  const { type, extension } = exportTypes[kind];
  res.set("Content-Type", type);
  res.set("Content-Disposition", attachmentDisposition(`footage-${stamp}.${extension}`));
  res.set("Cache-Control", "no-store");
  res.send(body);
}

/** Names inside the zip: the files' own names, made unique and stripped of any folder part. */
export function zipEntryNames(names: string[]): string[] {
  const used = new Set<string>();
  return names.map((raw) => {
    const base = raw.split(/[\\/]/).pop()!.replace(/^\.+/, "") || "clip";
    let name = base;
    for (let n = 2; used.has(name.toLowerCase()); n++) {
      const dot = base.lastIndexOf(".");
      name = dot > 0 ? `${base.slice(0, dot)} (${n})${base.slice(dot)}` : `${base} (${n})`;
    }
    used.add(name.toLowerCase());
    return name;
  });
}

/** A clip's file, or null when the store no longer holds it (the clip row outlived its object). */
async function openIfPresent(ctx: RushesContext, objectKey: string): Promise<Readable | null> {
  try {
    return await viaStorage(() => ctx.storage.getStream(objectKey));
  } catch (error) {
    if (isMissingObject(error)) return null;
    throw error;
  }
}

const missingNote = (names: string[]) =>
  `These chosen clips are in Kerf but their files are no longer in footage storage, so this zip leaves them out:\r\n\r\n${names.join("\r\n")}\r\n`;

/**
 * The selection as one zip, streamed: each object is read from the store and written straight out,
 * stored without compression (camera files don't shrink), one at a time, so memory stays flat. A clip
 * whose file is gone from the store is left out and named in MISSING.txt; when none is there, a 404.
 */
export async function streamZip(ctx: RushesContext, caller: Caller, clipIds: string[], res: Response): Promise<void> {
  const unique = [...new Set(clipIds)];
  if (unique.length === 0) throw new AppError("validation_failed", "Choose at least one clip.", { ids: "Choose at least one clip." });
  if (unique.length > ZIP_CAP) throw new AppError("validation_failed", `A zip holds at most ${ZIP_CAP} clips; choose fewer.`, { ids: `At most ${ZIP_CAP}.` });
  const rows = await repo.clipsByIds(ctx.db, caller.channelId, unique);
  if (rows.length !== unique.length) throw new AppError("not_found", "Some of those clips are not in this channel.");
  const ordered = unique.map((id) => rows.find((r) => r.id === id)!);
  const names = zipEntryNames([...ordered.map((r) => r.fileName), "MISSING.txt"]);
  const missing: string[] = [];
  // The first file that is there is opened before any byte is sent, so a store that is down is still a
  // clean 503 and a selection whose files are all gone a clean 404.
  let next = 0;
  let first: Readable | null = null;
  while (!first && next < ordered.length) {
    first = await openIfPresent(ctx, ordered[next]!.objectKey);
    if (!first) missing.push(names[next]!);
    next++;
  }
  if (!first) throw new AppError("not_found", `The files of those clips are no longer in footage storage: ${missing.join(", ")}.`);

  res.set("Content-Type", "application/zip");
  res.set("Content-Disposition", attachmentDisposition(`footage-${new Date().toISOString().slice(0, 10)}.zip`));
  res.set("Cache-Control", "no-store");
  const archive = new ZipArchive({ store: true, forceZip64: false });
  archive.on("warning", (error: Error) => console.error(`[rushes] zip warning: ${error.message}`));
  archive.on("error", (error: Error) => res.destroy(error));
  archive.pipe(res);
  for (let index = next - 1; index < ordered.length; index++) {
    try {
      const present = await appendClip(ctx, archive, index === next - 1 ? first : ordered[index]!.objectKey, names[index]!);
      if (!present) missing.push(names[index]!);
    } catch (error) {
      const failed = error as Error;
      // Bytes are already on their way: the only honest signal left is to cut the download short.
      console.error(`[rushes] zip cut short: ${failed.message}`);
      archive.abort();
      res.destroy(failed);
      return;
    }
  }
  if (missing.length > 0) archive.append(missingNote(missing), { name: names.at(-1)!, store: true });
  await archive.finalize();
}

/** Writes one file into the zip; false when its object is gone from the store. */
async function appendClip(ctx: RushesContext, archive: ZipArchive, source: Readable | string, name: string): Promise<boolean> {
  const stream = typeof source === "string" ? await openIfPresent(ctx, source) : source;
  if (!stream) return false;
  const written = new Promise<void>((resolve, reject) => {
    archive.once("entry", () => resolve());
    stream.once("error", reject);
  });
  archive.append(stream, { name, store: true });
  await written;
  return true;
}
