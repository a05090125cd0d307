import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { setImmediate as nextTurn } from "node:timers/promises";
import type { Response } from "express";
import { ZipArchive } from "archiver";
import type { FootageQuery } from "../../shared/rushes/footage-query";
import type { ExportClip } from "../../shared/rushes/exports/clip-ranges";
import { footageCsvHead, footageCsvRecords } from "../../shared/rushes/exports/footage-csv";
import { EdlError, footageEdls } from "../../shared/rushes/exports/edl";
import { type EdlRate, type EdlRatesView, edlRateLabel, edlRateOf } from "../../shared/rushes/exports/edl-rates";
import { TIMELINE_NAME, mediaFileNames } from "../../shared/rushes/exports/media-names";
import { footageOtio, otioWriter } from "../../shared/rushes/exports/otio";
import { AppError } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { attachmentDisposition, isMissingObject, viaStorage } from "../storage/storage";
import { type ExportRow, type MarkRow, clipBatches, clipsWithMarks, filterOutline } from "./exports.repository";
import type { RushesContext } from "./rushes.context";

/** Exports hold the whole filter, up to this many clips (the list's totals say when there are more). */
export const EXPORT_CAP = 5_000;
export const ZIP_CAP = 200;
/** Clips read per query of a streamed export. */
const BATCH = 250;
/** Clips written per turn of the event loop (a few hundred records): other requests are served in between. */
const TURN = 25;

type Row = Pick<ExportRow, Exclude<keyof ExportRow, "sortValue">>;

function exportClip(row: Row, marks: MarkRow[]): ExportClip {
  return {
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
    marks: marks.map((m) => ({ in: m.inLabel, out: m.outLabel, inFrame: m.inFrame, outFrame: m.outFrame, note: m.note })),
  };
}

/** Rows and their marks (sorted by clip) as export clips, in the rows' order: one pass, no search per clip. */
function exportClips(rows: Row[], marks: MarkRow[]): ExportClip[] {
  const byClip = new Map<string, MarkRow[]>();
  for (const mark of marks) {
    const list = byClip.get(mark.clipId);
    if (list) list.push(mark);
    else byClip.set(mark.clipId, [mark]);
  }
  return rows.map((row) => exportClip(row, byClip.get(row.id) ?? []));
}

async function* exportBatches(ctx: RushesContext, caller: Caller, q: FootageQuery): AsyncGenerator<ExportClip[]> {
  for await (const { rows, marks } of clipBatches(ctx.db, caller.channelId, q, BATCH, EXPORT_CAP)) yield exportClips(rows, marks);
}

/** Writes clips a few at a time, giving the event loop a turn after each piece. */
async function* inTurns(clips: ExportClip[], write: (part: ExportClip[]) => string): AsyncGenerator<string> {
  for (let i = 0; i < clips.length; i += TURN) {
    yield write(clips.slice(i, i + TURN));
    await nextTurn();
  }
}

const exportTypes = {
  csv: { type: "text/csv; charset=utf-8; header=present", extension: "csv" },
  edl: { type: "text/plain; charset=utf-8", extension: "edl" },
  otio: { type: "application/json; charset=utf-8", extension: "otio" },
  zip: { type: "application/zip", extension: "zip" },
} as const;

const stamp = () => new Date().toISOString().slice(0, 10);

function startDownload(res: Response, kind: keyof typeof exportTypes, fileName = `footage-${stamp()}.${exportTypes[kind].extension}`) {
  res.set("Content-Type", exportTypes[kind].type);
  res.set("Content-Disposition", attachmentDisposition(fileName));
  res.set("Cache-Control", "no-store");
}

const untitled = "Kerf footage";
/** The episode's title when every clip is of one episode. */
const titleOf = (titles: string[]) => (titles.length > 0 && titles.every((t) => t === titles[0]) ? titles[0]! : untitled);

/**
 * The filter as CSV or OpenTimelineIO, streamed: clips are read a batch at a time and each batch is written
 * before the next is read, with the response's own backpressure, so a channel of thousands of clips costs
 * time in step with its size, flat memory, and only short turns of the event loop. The first batch is read
 * before the first byte is sent, so a database that fails then is still a clean error answer.
 */
export async function streamExport(ctx: RushesContext, caller: Caller, q: FootageQuery, kind: "csv" | "otio", res: Response): Promise<void> {
  const batches = exportBatches(ctx, caller, q);
  const first = await batches.next();
  const firstClips = first.done ? [] : first.value;
  let body: AsyncGenerator<string>;
  if (kind === "csv") {
    body = (async function* () {
      yield footageCsvHead();
      yield* inTurns(firstClips, footageCsvRecords);
      for await (const clips of batches) yield* inTurns(clips, footageCsvRecords);
    })();
  } else {
    // Names must be unique over the whole list before the first clip is written: read them first, lightly.
    const outline = await filterOutline(ctx.db, caller.channelId, q, EXPORT_CAP);
    const names = mediaFileNames(outline);
    const oneEpisode = outline.length > 0 && outline.every((c) => c.episodeId === outline[0]!.episodeId);
    const writer = otioWriter(oneEpisode ? (firstClips[0]?.episodeTitle ?? untitled) : untitled);
    const write = (part: ExportClip[]) => writer.clips(part, names);
    body = (async function* () {
      yield writer.head;
      yield* inTurns(firstClips, write);
      for await (const clips of batches) yield* inTurns(clips, write);
      yield writer.tail;
    })();
  }
  startDownload(res, kind);
  try {
    await pipeline(Readable.from(body), res);
  } catch (error) {
    // Bytes are already on their way (or the downloader left): cutting the download short is the only signal.
    if ((error as { code?: string }).code !== "ERR_STREAM_PREMATURE_CLOSE") console.error(`[rushes] export cut short: ${(error as Error).message}`);
  }
}

/** The frame rates of the filter's clips, for the footage list to offer one EDL per rate. */
export async function edlRates(ctx: RushesContext, caller: Caller, q: FootageQuery): Promise<EdlRatesView> {
  const outline = await filterOutline(ctx.db, caller.channelId, q, EXPORT_CAP);
  const counts = new Map<EdlRate, number>();
  let withoutRate = 0;
  for (const clip of outline) {
    const format = clip.frameRateNumerator && clip.frameRateDenominator ? { rate: { numerator: clip.frameRateNumerator, denominator: clip.frameRateDenominator }, dropFrame: clip.dropFrame } : null;
    const rate = edlRateOf(format);
    if (rate === null) withoutRate++;
    else counts.set(rate, (counts.get(rate) ?? 0) + 1);
  }
  const rates = [...counts.entries()].map(([rate, clips]) => ({ rate, label: edlRateLabel(rate), clips })).sort((a, b) => b.clips - a.clips);
  return { rates, withoutRate };
}

/**
 * The filter as CMX 3600: one list when its clips share a rate (or `rate` picks one), else a zip of one list
 * per rate. A list holds at most 999 events, so it is built whole (from batched reads) before it is sent.
 */
export async function writeEdl(ctx: RushesContext, caller: Caller, q: FootageQuery, rate: EdlRate | undefined, res: Response): Promise<void> {
  const clips: ExportClip[] = [];
  for await (const batch of exportBatches(ctx, caller, q)) clips.push(...batch);
  let lists;
  try {
    lists = footageEdls(titleOf(clips.map((c) => c.episodeTitle)), clips, mediaFileNames(clips), rate);
  } catch (error) {
    if (error instanceof EdlError) throw new AppError("unprocessable", error.message);
    throw error;
  }
  const fileOf = (listRate: EdlRate) => `footage-${stamp()}-${listRate}.edl`;
  if (lists.length === 1) {
    startDownload(res, "edl", rate === undefined ? undefined : fileOf(lists[0]!.rate));
    res.send(lists[0]!.text);
    return;
  }
  startDownload(res, "zip", `footage-${stamp()}-edls.zip`);
  const archive = new ZipArchive({ forceZip64: false });
  archive.on("error", (error: Error) => res.destroy(error));
  archive.pipe(res);
  for (const list of lists) archive.append(list.text, { name: fileOf(list.rate) });
  await archive.finalize();
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
 * stored without compression (camera files don't shrink), one at a time, so memory stays flat. Beside the
 * files, a timeline (OpenTimelineIO) of the same clips whose target URLs are the files' names in the zip.
 * A clip whose file is gone from the store is left out and named in MISSING.txt; when none is there, a 404.
 */
export async function streamZip(ctx: RushesContext, caller: Caller, clipIds: string[], res: Response): Promise<void> {
  const unique = [...new Set(clipIds)];
  if (unique.length === 0) throw new AppError("validation_failed", "Choose at least one clip.", { ids: "Choose at least one clip." });
  if (unique.length > ZIP_CAP) throw new AppError("validation_failed", `A zip holds at most ${ZIP_CAP} clips; choose fewer.`, { ids: `At most ${ZIP_CAP}.` });
  const { rows, marks } = await clipsWithMarks(ctx.db, caller.channelId, unique);
  if (rows.length !== unique.length) throw new AppError("not_found", "Some of those clips are not in this channel.");
  const byId = new Map(exportClips(rows, marks).map((clip) => [clip.id, clip]));
  const ordered = unique.map((id) => byId.get(id)!);
  const names = mediaFileNames(ordered);
  const nameOf = (index: number) => names.get(ordered[index]!.id)!;
  const missing: string[] = [];
  // The first file that is there is opened before any byte is sent, so a store that is down is still a
  // clean 503 and a selection whose files are all gone a clean 404.
  let next = 0;
  let first: Readable | null = null;
  while (!first && next < ordered.length) {
    first = await openIfPresent(ctx, ordered[next]!.objectKey);
    if (!first) missing.push(nameOf(next));
    next++;
  }
  if (!first) throw new AppError("not_found", `The files of those clips are no longer in footage storage: ${missing.join(", ")}.`);

  startDownload(res, "zip");
  const archive = new ZipArchive({ store: true, forceZip64: false });
  archive.on("warning", (error: Error) => console.error(`[rushes] zip warning: ${error.message}`));
  archive.on("error", (error: Error) => res.destroy(error));
  archive.pipe(res);
  const timelineWritten = new Promise((resolve) => archive.once("entry", resolve));
  archive.append(footageOtio(titleOf(ordered.map((c) => c.episodeTitle)), ordered, names), { name: TIMELINE_NAME });
  await timelineWritten;
  for (let index = next - 1; index < ordered.length; index++) {
    try {
      const present = await appendClip(ctx, archive, index === next - 1 ? first : ordered[index]!.objectKey, nameOf(index));
      if (!present) missing.push(nameOf(index));
    } catch (error) {
      const failed = error as Error;
      // Bytes are already on their way: the only honest signal left is to cut the download short.
      console.error(`[rushes] zip cut short: ${failed.message}`);
      archive.abort();
      res.destroy(failed);
      return;
    }
  }
  if (missing.length > 0) archive.append(missingNote(missing), { name: missingFileName(names), store: true });
  await archive.finalize();
}

/** MISSING.txt, unless a clip's own file already has that name. */
const missingFileName = (names: Map<string, string>) => ([...names.values()].some((n) => n.toLowerCase() === "missing.txt") ? "MISSING (Kerf).txt" : "MISSING.txt");

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
