/**
 * What Kerf accepts as footage and photos, and how a file is cut into upload parts. The server
 * enforces these (413 / 415); the browser checks them first so a person hears about it at once.
 */
export const MiB = 1024 * 1024;
export const GiB = 1024 * MiB;

/** Parts of at least 8 MiB (S3's own floor is 5 MiB except the last part), at most 10,000 of them. */
export const MIN_PART_SIZE = 8 * MiB;
export const MAX_PARTS = 10_000;
/** S3's largest object is 5 TiB; a camera card rarely holds a single file over a few hundred GiB. */
export const MAX_CLIP_BYTES = 500 * GiB;
export const MAX_STILL_BYTES = 20 * MiB;

/** Camera and sound files by extension: browsers report no type (or a wrong one) for several of them. */
export const clipTypes: Record<string, string> = {
  mp4: "video/mp4",
  m4v: "video/mp4",
  mov: "video/quicktime",
  mxf: "application/mxf",
  mkv: "video/x-matroska",
  webm: "video/webm",
  avi: "video/x-msvideo",
  mts: "video/mp2t",
  m2ts: "video/mp2t",
  wav: "audio/wav",
  braw: "application/octet-stream",
};
export const stillTypes: Record<string, string> = { jpg: "image/jpeg", jpeg: "image/jpeg", png: "image/png", webp: "image/webp" };

export type FileCheck = { ok: true; contentType: string } | { ok: false; status: 413 | 415 | 400; message: string };

export function extensionOf(fileName: string): string {
  const dot = fileName.lastIndexOf(".");
  return dot < 0 ? "" : fileName.slice(dot + 1).toLowerCase();
}

const list = (types: Record<string, string>) => Object.keys(types).map((e) => `.${e}`).join(", ");

export function formatBytes(bytes: number): string {
  if (bytes >= GiB) return `${(bytes / GiB).toFixed(bytes >= 10 * GiB ? 0 : 1)} GiB`;
  if (bytes >= MiB) return `${(bytes / MiB).toFixed(bytes >= 10 * MiB ? 0 : 1)} MiB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} KiB`;
  return `${bytes} B`;
}

function check(fileName: string, size: number, types: Record<string, string>, maxBytes: number, what: string): FileCheck {
  if (!Number.isSafeInteger(size) || size < 0) return { ok: false, status: 400, message: "The file size must be a whole number of bytes." };
  const extension = extensionOf(fileName);
  const contentType = types[extension];
  if (!contentType) {
    const shown = extension ? `.${extension} files` : `"${fileName}" (no extension)`;
    return { ok: false, status: 415, message: `Kerf doesn't take ${shown} as ${what}. It takes ${list(types)}.` };
  }
  if (size === 0) return { ok: false, status: 400, message: `"${fileName}" is empty.` };
  if (size > maxBytes) {
    return { ok: false, status: 413, message: `"${fileName}" is ${formatBytes(size)}; ${what} can be at most ${formatBytes(maxBytes)}.` };
  }
  return { ok: true, contentType };
}

export const checkClipFile = (fileName: string, size: number) => check(fileName, size, clipTypes, MAX_CLIP_BYTES, "footage");
export const checkStillFile = (fileName: string, size: number) => check(fileName, size, stillTypes, MAX_STILL_BYTES, "a photo");

/** Part size and count for a file: 8 MiB parts, larger (in whole MiB) when 10,000 would not hold it. */
export function planParts(size: number): { partSize: number; partCount: number } {
  const neededForCount = Math.ceil(size / MAX_PARTS / MiB) * MiB;
  const partSize = Math.max(MIN_PART_SIZE, neededForCount);
  return { partSize, partCount: Math.max(1, Math.ceil(size / partSize)) };
}

/** The byte range [start, end) of a part (numbered from 1, as S3 numbers them). */
export function partRange(partNumber: number, partSize: number, size: number): { start: number; end: number } {
  const start = (partNumber - 1) * partSize;
  return { start, end: Math.min(size, start + partSize) };
}

/**
 * Parts the browser asks Kerf to sign per request: one round trip buys the URLs of the next few parts,
 * so the parts in flight wait on storage, not on Kerf.
 */
export const SIGN_AHEAD = 8;

/**
 * Stored parts the browser reports to Kerf in one request: when RECORD_BATCH are waiting, or
 * RECORD_EVERY_MS after the first of them, and all before completing or pausing. One request per
 * part took CPU from storage on the same machine; a reload loses at most these few records, and
 * those parts are sent again.
 */
export const RECORD_BATCH = 8;
export const RECORD_EVERY_MS = 2_000;
/** The most records one request takes (a batch that waited through failures may hold more than RECORD_BATCH). */
export const RECORDS_PER_REQUEST = 100;

/** How long a presigned URL works: short, since each is for one part or one look. */
export const PART_URL_SECONDS = 15 * 60;
export const PREVIEW_URL_SECONDS = 10 * 60;
/** An upload with no part recorded for this long is aborted by the scheduled sweep. */
export const ABANDONED_AFTER_HOURS = 24;
