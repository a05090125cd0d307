import { Transform, type Readable } from "node:stream";
import type { Request, Response } from "express";
import multer, { MulterError, type StorageEngine } from "multer";
import { checkStillFile, MAX_STILL_BYTES, formatBytes, type FileCheck } from "../../shared/rushes/limits";
import { AppError } from "../http/app-error";
import { type Storage, storageDown, isStorageDown } from "./storage";

/**
 * Small files (photos, poster frames) through the server, for any feature (shoot-day stills, posters,
 * build-log photos): multer hands over the file as a stream and this engine pipes it straight into storage, so a photo is never held in memory or on disk whole.
 * The form must send a `size` field (the file's bytes) before the file itself: S3 wants the length
 * of an object up front, and the stream is checked against it as it passes.
 */
export interface ReceivedFile {
  key: string;
  fileName: string;
  contentType: string;
  size: number;
  /** The file's first bytes (up to `PhotoRules.keepHead`), where image formats keep their size. */
  head: Buffer;
}

/** What a feature takes: the stills' rules unless it says otherwise (thumbnails take other types and sizes). */
export interface PhotoRules {
  check: (fileName: string, size: number) => FileCheck;
  maxBytes: number;
  /** Bytes of the file's start to keep for the feature to read; none by default. */
  keepHead?: number;
}

const stillRules: PhotoRules = { check: checkStillFile, maxBytes: MAX_STILL_BYTES };

function countingGuard(expected: number, head: { keep: number; chunks: Buffer[]; length: number }): Transform {
  let seen = 0;
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      seen += chunk.length;
      if (head.length < head.keep) {
        const part = chunk.subarray(0, head.keep - head.length);
        head.chunks.push(Buffer.from(part));
        head.length += part.length;
      }
      if (seen > expected) return done(new AppError("validation_failed", `The file is larger than the ${expected} bytes its size field said.`));
      done(null, chunk);
    },
    flush(done) {
      done(seen === expected ? null : new AppError("validation_failed", `The file has ${seen} bytes; its size field said ${expected}.`));
    },
  });
}

type HeldFile = Express.Multer.File & { head?: Buffer };

function streamingEngine(storage: Storage, keyFor: () => string, rules: PhotoRules): StorageEngine {
  return {
    _handleFile(req, file, callback) {
      const declared = Number((req.body as Record<string, unknown> | undefined)?.size);
      const fail = (error: unknown) => {
        file.stream.resume();
        callback(error as Error);
      };
      if (!Number.isSafeInteger(declared) || declared <= 0) {
        return fail(new AppError("validation_failed", "Send the file's size (in bytes) as the form's size field, before the file.", { size: "Give the file's size." }));
      }
      const check = rules.check(file.originalname, declared);
      if (!check.ok) {
        const code = check.status === 413 ? "payload_too_large" : check.status === 415 ? "unsupported_media_type" : "validation_failed";
        return fail(new AppError(code, check.message));
      }
      const key = keyFor();
      const head = { keep: rules.keepHead ?? 0, chunks: [] as Buffer[], length: 0 };
      const guard = countingGuard(declared, head);
      const body: Readable = file.stream.pipe(guard);
      // The guard's complaint is read back below (guard.errored); this keeps it from being "unhandled".
      // A stream that breaks its promise (too short, too long) must end the PUT at once, not leave it waiting.
      const abort = new AbortController();
      guard.on("error", () => abort.abort());
      file.stream.on("error", (error) => guard.destroy(error));
      storage
        .putStream(key, body, { contentType: check.contentType, size: declared, signal: abort.signal })
        .then(() => callback(null, { path: key, size: declared, mimetype: check.contentType, head: Buffer.concat(head.chunks) } as Partial<HeldFile>))
        .catch((error: unknown) => {
          // The guard's own complaint beats the store's echo of it.
          const reason = guard.errored ?? error;
          fail(isStorageDown(reason) ? storageDown() : reason);
        });
    },
    _removeFile(_req, file, callback) {
      storage.remove(file.path).then(() => callback(null), () => callback(null));
    },
  };
}

function fromMulter(error: unknown, maxBytes: number): unknown {
  if (error instanceof MulterError) {
    if (error.code === "LIMIT_FILE_SIZE") return new AppError("payload_too_large", `A photo can be at most ${formatBytes(maxBytes)}.`);
    if (error.code === "LIMIT_UNEXPECTED_FILE") return new AppError("validation_failed", "Send one file, in the form's file field.", { file: "One file, named file." });
    return new AppError("validation_failed", `The upload form is not right: ${error.message}.`);
  }
  return error;
}

/** Receives the form's one file into storage under a key Kerf makes; answers 400/413/415/503 otherwise. */
export function receiveStill(req: Request, res: Response, storage: Storage, keyFor: () => string, rules: PhotoRules = stillRules): Promise<{ file: ReceivedFile; fields: Record<string, string> }> {
  const upload = multer({
    storage: streamingEngine(storage, keyFor, rules),
    limits: { fileSize: rules.maxBytes, files: 1, fields: 8, fieldSize: 2_000, parts: 10 },
  }).single("file");
  return new Promise((resolve, reject) => {
    upload(req, res, (error?: unknown) => {
      if (error) return reject(fromMulter(error, rules.maxBytes));
      const file = req.file as HeldFile | undefined;
      if (!file) return reject(new AppError("validation_failed", "Choose a photo to upload.", { file: "Choose a photo." }));
      resolve({
        file: { key: file.path, fileName: file.originalname, contentType: file.mimetype, size: file.size, head: file.head ?? Buffer.alloc(0) },
        fields: { ...(req.body as Record<string, string>) },
      });
    });
  });
}
