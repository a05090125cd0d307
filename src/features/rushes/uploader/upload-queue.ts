import { partRange } from "@shared/rushes/limits";
import type { ClipDetail, ClipMetadata, PartUrlsAnswer, UploadView } from "@shared/rushes/schemas";
import { ApiError } from "../../../lib/api-client";
import { cancelUpload } from "../api/cancel-upload";
import { completeUpload } from "../api/complete-upload";
import { recordPart } from "../api/record-part";
import { signParts } from "../api/sign-parts";
import { startUpload } from "../api/start-upload";

/**
 * The browser's side of a presigned multipart upload. Kerf's server opens the upload and signs each
 * part; the parts go from here straight to storage (several at once), and each stored part's number
 * and ETag is reported back, so a reload can resume from what the server recorded.
 */
export type JobStatus = "reading" | "queued" | "uploading" | "paused" | "completing" | "done" | "failed" | "cancelled" | "needs-file";
type PartState = "waiting" | "sending" | "stored" | "failed";

interface Part {
  state: PartState;
  loaded: number;
  attempts: number;
  xhr?: XMLHttpRequest;
}

export interface UploadJob {
  id: string;
  fileName: string;
  size: number;
  status: JobStatus;
  file: File | null;
  uploadId: string | null;
  partSize: number;
  partCount: number;
  parts: Part[];
  metadata: ClipMetadata | null;
  /** The file's SHA-256, worked out beside the upload (null when it couldn't be). */
  sha256: Promise<string | null> | null;
  error: string | null;
  clip: ClipDetail | null;
}

export interface JobView {
  id: string;
  fileName: string;
  size: number;
  status: JobStatus;
  sent: number;
  partsStored: number;
  partCount: number;
  failedParts: number;
  error: string | null;
  clipId: string | null;
}

const MAX_PARALLEL_PARTS = 4;
const MAX_ATTEMPTS = 3;

export const fingerprintOf = (file: File) => `${file.name}:${file.size}:${file.lastModified}`;

export interface QueueHooks {
  probe(file: File): Promise<ClipMetadata | null>;
  hash(file: File): Promise<string | null>;
  /** After completion: a poster frame, if the browser can decode the file. */
  afterComplete(job: UploadJob): Promise<void>;
  onChange?(): void;
}

export class UploadQueue {
  private jobs: UploadJob[] = [];
  private listeners = new Set<() => void>();
  private snapshot: JobView[] = [];
  private emitTimer: ReturnType<typeof setTimeout> | null = null;
  private active = 0;

  constructor(
    private readonly channelId: string,
    private readonly episodeId: string,
    private readonly hooks: QueueHooks,
  ) {}

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = () => this.snapshot;

  private emit(now = false) {
    const publish = () => {
      this.emitTimer = null;
      this.snapshot = this.jobs.map(toView);
      for (const l of this.listeners) l();
    };
    if (now) {
      if (this.emitTimer) clearTimeout(this.emitTimer);
      publish();
    } else if (!this.emitTimer) this.emitTimer = setTimeout(publish, 120);
  }

  /** Unfinished uploads the server remembers: shown until their file is chosen again. */
  remember(open: UploadView[]) {
    for (const upload of open) {
      if (this.jobs.some((j) => j.uploadId === upload.id)) continue;
      this.jobs.push({
        id: upload.id,
        fileName: upload.fileName,
        size: upload.size,
        status: "needs-file",
        file: null,
        uploadId: upload.id,
        partSize: upload.partSize,
        partCount: upload.partCount,
        parts: Array.from({ length: upload.partCount }, (_, i) => ({ state: upload.parts.some((p) => p.partNumber === i + 1) ? "stored" : "waiting", loaded: 0, attempts: 0 })),
        metadata: null,
        sha256: null,
        error: null,
        clip: null,
      });
      (this.jobs.at(-1) as UploadJob & { fingerprint?: string }).fingerprint = upload.fingerprint;
    }
    this.emit(true);
  }

  add(files: File[]) {
    for (const file of files) {
      const waiting = this.jobs.find((j) => j.status === "needs-file" && (j as UploadJob & { fingerprint?: string }).fingerprint === fingerprintOf(file));
      if (waiting) {
        waiting.file = file;
        waiting.status = "queued";
        waiting.sha256 = this.hooks.hash(file);
        continue;
      }
      const job: UploadJob = {
        id: crypto.randomUUID(),
        fileName: file.name,
        size: file.size,
        status: "reading",
        file,
        uploadId: null,
        partSize: 0,
        partCount: 0,
        parts: [],
        metadata: null,
        sha256: this.hooks.hash(file),
        error: null,
        clip: null,
      };
      this.jobs.push(job);
      void this.open(job);
    }
    this.emit(true);
    this.pump();
  }

  private async open(job: UploadJob) {
    job.metadata = await this.hooks.probe(job.file!).catch(() => null);
    if (job.status === "cancelled") return;
    try {
      const upload = await startUpload(this.channelId, {
        episodeId: this.episodeId,
        fileName: job.fileName,
        size: job.size,
        fingerprint: fingerprintOf(job.file!),
        ...(job.metadata ? { metadata: job.metadata } : {}),
      });
      job.uploadId = upload.id;
      job.partSize = upload.partSize;
      job.partCount = upload.partCount;
      job.parts = Array.from({ length: upload.partCount }, () => ({ state: "waiting", loaded: 0, attempts: 0 }));
      if (job.status === "reading") job.status = "queued";
    } catch (error) {
      this.fail(job, error instanceof ApiError ? error.message : "Kerf couldn't start this upload.");
      return;
    }
    this.emit(true);
    this.pump();
  }

  private fail(job: UploadJob, message: string) {
    job.status = "failed";
    job.error = message;
    this.emit(true);
  }

  pause(id: string) {
    const job = this.find(id);
    if (!job || !["queued", "uploading"].includes(job.status)) return;
    job.status = "paused";
    for (const part of job.parts) {
      if (part.state === "sending") {
        part.xhr?.abort();
        part.state = "waiting";
        part.loaded = 0;
      }
    }
    this.emit(true);
  }

  resume(id: string) {
    const job = this.find(id);
    if (!job || job.status !== "paused") return;
    job.status = "queued";
    this.emit(true);
    this.pump();
  }

  /** Sends the failed parts again (each gets fresh attempts). */
  retry(id: string) {
    const job = this.find(id);
    if (!job || job.status !== "failed") return;
    job.error = null;
    if (!job.uploadId) {
      job.status = "reading";
      void this.open(job);
      return;
    }
    for (const part of job.parts) if (part.state === "failed") Object.assign(part, { state: "waiting", attempts: 0, loaded: 0 });
    job.status = "queued";
    this.emit(true);
    this.pump();
  }

  async cancel(id: string) {
    const job = this.find(id);
    if (!job || job.status === "done" || job.status === "cancelled") return;
    const previous = job.status;
    job.status = "cancelled";
    for (const part of job.parts) part.xhr?.abort();
    this.emit(true);
    if (job.uploadId && previous !== "completing") {
      await cancelUpload(this.channelId, job.uploadId).catch(() => undefined);
    }
  }

  dismiss(id: string) {
    this.jobs = this.jobs.filter((j) => j.id !== id || !["done", "cancelled", "needs-file"].includes(j.status));
    this.emit(true);
  }

  pauseAll() {
    for (const job of this.jobs) this.pause(job.id);
  }

  resumeAll() {
    for (const job of this.jobs) if (job.status === "paused") this.resume(job.id);
  }

  private find(id: string) {
    return this.jobs.find((j) => j.id === id);
  }

  /** Starts parts until MAX_PARALLEL_PARTS are in flight, oldest file first. */
  private pump() {
    for (const job of this.jobs) {
      if (!["queued", "uploading"].includes(job.status) || !job.uploadId || !job.file) continue;
      const waiting = job.parts.map((p, i) => ({ p, n: i + 1 })).filter(({ p }) => p.state === "waiting");
      if (waiting.length === 0) {
        if (job.parts.every((p) => p.state === "stored")) void this.complete(job);
        else if (job.parts.some((p) => p.state === "failed") && !job.parts.some((p) => p.state === "sending")) this.fail(job, "Some parts didn't reach storage. Retry sends just those.");
        continue;
      }
      const room = MAX_PARALLEL_PARTS - this.active;
      if (room <= 0) return;
      job.status = "uploading";
      const batch = waiting.slice(0, room);
      for (const { p } of batch) p.state = "sending";
      this.active += batch.length;
      void this.sendBatch(job, batch.map((b) => b.n));
    }
    this.emit();
  }

  private async sendBatch(job: UploadJob, partNumbers: number[]) {
    let urls: PartUrlsAnswer["urls"];
    // Each part's size goes with its number: its URL then takes exactly that many bytes.
    const parts = partNumbers.map((partNumber) => {
      const { start, end } = partRange(partNumber, job.partSize, job.size);
      return { partNumber, size: end - start };
    });
    try {
      urls = await signParts(this.channelId, job.uploadId!, parts);
    } catch (error) {
      this.active -= partNumbers.length;
      for (const n of partNumbers) this.partFailed(job, n);
      if (error instanceof ApiError && error.status === 409) this.fail(job, error.message);
      this.pump();
      return;
    }
    await Promise.all(
      urls.map(async ({ partNumber, url }) => {
        try {
          await this.sendPart(job, partNumber, url);
        } finally {
          this.active--;
        }
      }),
    );
    this.pump();
  }

  private sendPart(job: UploadJob, partNumber: number, url: string): Promise<void> {
    const part = job.parts[partNumber - 1]!;
    if (part.state !== "sending" || !job.file) return Promise.resolve();
    const { start, end } = partRange(partNumber, job.partSize, job.size);
    return new Promise<void>((resolve) => {
      const xhr = new XMLHttpRequest();
      part.xhr = xhr;
      xhr.open("PUT", url);
      xhr.upload.onprogress = (event) => {
        part.loaded = event.loaded;
        this.emit();
      };
      xhr.onload = async () => {
        part.xhr = undefined;
        const etag = xhr.getResponseHeader("ETag");
        if (xhr.status < 200 || xhr.status >= 300 || !etag) {
          this.partFailed(job, partNumber);
          return resolve();
        }
        try {
          await recordPart(this.channelId, job.uploadId!, partNumber, { etag, size: end - start });
          if (part.state === "sending") Object.assign(part, { state: "stored", loaded: end - start });
        } catch {
          this.partFailed(job, partNumber);
        }
        this.emit();
        resolve();
      };
      xhr.onerror = () => {
        part.xhr = undefined;
        this.partFailed(job, partNumber);
        resolve();
      };
      xhr.onabort = () => {
        part.xhr = undefined;
        resolve();
      };
      xhr.send(job.file!.slice(start, end));
    });
  }

  private partFailed(job: UploadJob, partNumber: number) {
    const part = job.parts[partNumber - 1]!;
    if (part.state !== "sending") return;
    part.attempts++;
    part.loaded = 0;
    // A dropped connection often comes back: try a part three times before asking the person.
    part.state = part.attempts < MAX_ATTEMPTS ? "waiting" : "failed";
    this.emit();
  }

  private async complete(job: UploadJob) {
    if (job.status === "completing" || job.status === "done") return;
    job.status = "completing";
    this.emit(true);
    try {
      const sha256 = (await job.sha256?.catch(() => null)) ?? null;
      const clip = await completeUpload(this.channelId, job.uploadId!, { ...(job.metadata ? { metadata: job.metadata } : {}), ...(sha256 ? { sha256 } : {}) });
      job.clip = clip;
      job.status = "done";
      this.emit(true);
      this.hooks.onChange?.();
      await this.hooks.afterComplete(job).catch(() => undefined);
      this.hooks.onChange?.();
    } catch (error) {
      this.fail(job, error instanceof ApiError ? error.message : "Kerf couldn't finish this upload.");
    }
  }
}

function toView(job: UploadJob): JobView {
  const sent = job.parts.reduce((sum, p, i) => sum + (p.state === "stored" ? partRange(i + 1, job.partSize, job.size).end - partRange(i + 1, job.partSize, job.size).start : p.loaded), 0);
  return {
    id: job.id,
    fileName: job.fileName,
    size: job.size,
    status: job.status,
    sent: job.status === "done" ? job.size : sent,
    partsStored: job.parts.filter((p) => p.state === "stored").length,
    partCount: job.partCount,
    failedParts: job.parts.filter((p) => p.state === "failed").length,
    error: job.error,
    clipId: job.clip?.id ?? null,
  };
}
