import type { Readable } from "node:stream";
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  UploadPartCommand,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import type { Env } from "../env";
import { AppError } from "../http/app-error";

/**
 * Kerf's one seam to object storage. Everything goes through the S3 protocol with the SDK, configured
 * only by environment, so AWS, any S3-compatible store and the local stand-in run the same code.
 * The app server signs and records; file bytes go from the browser to the store directly, except the
 * small photos that stream through (putStream) and the zip that streams out (getStream).
 */
export interface Storage {
  readonly bucket: string;
  /** The origin browsers upload to and read from (for the page's content security policy). */
  readonly publicOrigin: string;
  up(): Promise<boolean>;
  createMultipart(key: string, contentType: string): Promise<string>;
  /** A PUT URL for one part of exactly `size` bytes: the length is signed, so the store refuses any other. */
  presignPart(key: string, uploadId: string, partNumber: number, size: number, expiresInSeconds: number): Promise<string>;
  completeMultipart(key: string, uploadId: string, parts: { partNumber: number; etag: string }[]): Promise<{ etag: string | null }>;
  /**
   * Leaves nothing of an upload behind: aborts the multipart upload (its parts go with it) and deletes
   * any object a completion made at its key. Either already gone is fine; a store that is down throws.
   */
  discardUpload(key: string, uploadId: string): Promise<void>;
  head(key: string): Promise<{ size: number; etag: string | null; contentType: string | null } | null>;
  presignGet(key: string, options: { expiresInSeconds: number; fileName?: string; contentType?: string }): Promise<string>;
  putStream(key: string, body: Readable, options: { contentType: string; size: number; signal?: AbortSignal }): Promise<void>;
  getStream(key: string): Promise<Readable>;
  remove(key: string): Promise<void>;
}

const networkCodes = new Set(["ECONNREFUSED", "ECONNRESET", "ENOTFOUND", "ETIMEDOUT", "EHOSTUNREACH", "EPIPE", "EAI_AGAIN"]);

/** A store that cannot be reached (or answers 5xx) is a clear 503; nothing else changes. */
export function isStorageDown(error: unknown): boolean {
  const e = error as { code?: string; name?: string; $metadata?: { httpStatusCode?: number }; cause?: unknown; errors?: unknown[] };
  if (!e) return false;
  if (e.code && networkCodes.has(e.code)) return true;
  if (e.name === "TimeoutError" || e.name === "AbortError") return true;
  const status = e.$metadata?.httpStatusCode;
  if (status !== undefined && status >= 500 && status !== 501) return true;
  if (Array.isArray(e.errors) && e.errors.some(isStorageDown)) return true;
  return e.cause !== undefined && e.cause !== error && isStorageDown(e.cause);
}

/** The store answered that the object is not there (404 NoSuchKey). */
export const isMissingObject = (error: unknown) => statusOf(error) === 404 || (error as { name?: string } | null)?.name === "NoSuchKey";

export const storageDown = () => new AppError("unavailable", "Footage storage is not reachable right now; nothing was changed. Try again in a moment.");

/** Runs a storage call; a store that is down becomes the 503 above. */
export async function viaStorage<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (isStorageDown(error)) throw storageDown();
    throw error;
  }
}

export interface StorageSettings {
  endpoint: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  forcePathStyle: boolean;
  /** How long a connection may take, and a request sit without a byte either way (default 5 s and 30 s). */
  timeouts?: { connectMs: number; idleMs: number };
}

export const storageSettingsFrom = (env: Env): StorageSettings => ({
  endpoint: env.S3_ENDPOINT,
  region: env.S3_REGION,
  bucket: env.S3_BUCKET,
  accessKeyId: env.S3_ACCESS_KEY_ID,
  secretAccessKey: env.S3_SECRET_ACCESS_KEY,
  forcePathStyle: env.S3_FORCE_PATH_STYLE,
});

export function makeS3Client(settings: StorageSettings): S3Client {
  return new S3Client({
    endpoint: settings.endpoint || undefined,
    region: settings.region,
    forcePathStyle: settings.forcePathStyle,
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    // With the SDK's defaults a streamed PutObject is sent aws-chunked (which some stores refuse and
    // others store framing and all) and presigned URLs carry the checksum of an empty body: checksums
    // only when required.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    maxAttempts: 2,
    // A store that takes the connection and never answers would otherwise hold the caller (and the
    // row lock a cancel or the sweep holds across its call) for ever: it counts as down instead.
    requestHandler: { connectionTimeout: settings.timeouts?.connectMs ?? 5_000, socketTimeout: settings.timeouts?.idleMs ?? 30_000 },
  });
}

const statusOf = (error: unknown) => (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;

function quoteFree(etag: string | undefined): string | null {
  return etag ? etag.replaceAll('"', "") : null;
}

/** `attachment; filename="…"` with an RFC 6266 / RFC 5987 form for names outside ASCII. */
export function attachmentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

export function createS3Storage(settings: StorageSettings): Storage & { client: S3Client } {
  const client = makeS3Client(settings);
  const Bucket = settings.bucket;
  // Without an endpoint the SDK talks to AWS itself, path-style or virtual-hosted.
  const publicOrigin = settings.endpoint
    ? new URL(settings.endpoint).origin
    : settings.forcePathStyle
      ? `https://s3.${settings.region}.amazonaws.com`
      : `https://${Bucket}.s3.${settings.region}.amazonaws.com`;
  return {
    client,
    bucket: Bucket,
    publicOrigin,
    async up() {
      try {
        await client.send(new HeadBucketCommand({ Bucket }), { abortSignal: AbortSignal.timeout(3_000) });
        return true;
      } catch {
        return false;
      }
    },
    async createMultipart(key, contentType) {
      const out = await client.send(new CreateMultipartUploadCommand({ Bucket, Key: key, ContentType: contentType }));
      if (!out.UploadId) throw new Error("storage gave no upload id");
      return out.UploadId;
    },
    presignPart(key, uploadId, partNumber, size, expiresIn) {
      // ContentLength joins the signed headers (X-Amz-SignedHeaders=content-length;host).
      const command = new UploadPartCommand({ Bucket, Key: key, UploadId: uploadId, PartNumber: partNumber, ContentLength: size });
      return getSignedUrl(client, command, { expiresIn });
    },
    async completeMultipart(key, uploadId, parts) {
      const out = await client.send(
        new CompleteMultipartUploadCommand({
          Bucket,
          Key: key,
          UploadId: uploadId,
          MultipartUpload: { Parts: parts.map((p) => ({ PartNumber: p.partNumber, ETag: `"${p.etag}"` })) },
        }),
      );
      return { etag: quoteFree(out.ETag) };
    },
    async discardUpload(key, uploadId) {
      try {
        await client.send(new AbortMultipartUploadCommand({ Bucket, Key: key, UploadId: uploadId }));
      } catch (error) {
        // NoSuchUpload: aborted before, or completed (then the object below is what is left).
        if (statusOf(error) !== 404) throw error;
      }
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
    async head(key) {
      try {
        const out = await client.send(new HeadObjectCommand({ Bucket, Key: key }));
        return { size: Number(out.ContentLength ?? 0), etag: quoteFree(out.ETag), contentType: out.ContentType ?? null };
      } catch (error) {
        if (statusOf(error) === 404) return null;
        throw error;
      }
    },
    presignGet(key, options) {
      const command = new GetObjectCommand({
        Bucket,
        Key: key,
        ResponseContentDisposition: options.fileName ? attachmentDisposition(options.fileName) : undefined,
        ResponseContentType: options.contentType,
      });
      return getSignedUrl(client, command, { expiresIn: options.expiresInSeconds });
    },
    async putStream(key, body, options) {
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: options.contentType, ContentLength: options.size }), {
        abortSignal: options.signal,
      });
    },
    async getStream(key) {
      const out = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      return out.Body as Readable;
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}
