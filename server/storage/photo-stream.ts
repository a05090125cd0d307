import { Transform, type Readable } from "node:stream";
import type { Request, Response } from "express";
import multer, { MulterError, type StorageEngine } from "multer";
import { checkStillFile, MAX_STILL_BYTES, formatBytes } from "../../shared/rushes/limits";
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
}

function countingGuard(expected: number): Transform {
  let seen = 0;
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      seen += chunk.length;
      if (seen > expected) return done(new AppError("validation_failed", `The file is larger than the ${expected} bytes its size field said.`));
      done(null, chunk);
    },
    flush(done) {
      done(seen === expected ? null : new AppError("validation_failed", `The file has ${seen} bytes; its size field said ${expected}.`));
    },
  });
}

function streamingEngine(storage: Storage, keyFor: () => string): StorageEngine {
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
      const check = checkStillFile(file.originalname, declared);
      if (!check.ok) {
        const code = check.status === 413 ? "payload_too_large" : check.status === 415 ? "unsupported_media_type" : "validation_failed";
        return fail(new AppError(code, check.message));
      }
      const key = keyFor();
      const guard = countingGuard(declared);
      const body: Readable = file.stream.pipe(guard);
      // The guard's complaint is read back below (guard.errored); this keeps it from being "unhandled".
      // A stream that breaks its promise (too short, too long) must end the PUT at once, not leave it waiting.
      const abort = new AbortController();
      guard.on("error", () => abort.abort());
      file.stream.on("error", (error) => guard.destroy(error));
      storage
        .putStream(key, body, { contentType: check.contentType, size: declared, signal: abort.signal })
        .then(() => callback(null, { path: key, size: declared, mimetype: check.contentType }))
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

function fromMulter(error: unknown): unknown {
  if (error instanceof MulterError) {
    if (error.code === "LIMIT_FILE_SIZE") return new AppError("payload_too_large", `A photo can be at most ${formatBytes(MAX_STILL_BYTES)}.`);
    if (error.code === "LIMIT_UNEXPECTED_FILE") return new AppError("validation_failed", "Send one file, in the form's file field.", { file: "One file, named file." });
    return new AppError("validation_failed", `The upload form is not right: ${error.message}.`);
  }
  return error;
}

/** Receives the form's one file into storage under a key Kerf makes; answers 400/413/415/503 otherwise. */
export function receiveStill(req: Request, res: Response, storage: Storage, keyFor: () => string): Promise<{ file: ReceivedFile; fields: Record<string, string> }> {
  const upload = multer({
    storage: streamingEngine(storage, keyFor),
    limits: { fileSize: MAX_STILL_BYTES, files: 1, fields: 8, fieldSize: 2_000, parts: 10 },
  }).single("file");
  return new Promise((resolve, reject) => {
    upload(req, res, (error?: unknown) => {
      if (error) return reject(fromMulter(error));
      const file = req.file;
      if (!file) return reject(new AppError("validation_failed", "Choose a photo to upload.", { file: "Choose a photo." }));
      resolve({
        file: { key: file.path, fileName: file.originalname, contentType: file.mimetype, size: file.size },
        fields: { ...(req.body as Record<string, string>) },
      });
    });
  });
}
