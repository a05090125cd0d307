import Uppy, { type UppyFile } from "@uppy/core";
import AwsS3, { type AwsS3Part, type AwsS3UploadParameters } from "@uppy/aws-s3";
import { planParts } from "@shared/rushes/limits";
import type { ChecksumAnswer, ClipDetail, ClipMetadata, UploadView } from "@shared/rushes/schemas";
import { ApiError } from "../../../lib/api-client";
import { reportWork } from "../../../lib/background-work";
import { cancelUpload } from "../api/cancel-upload";
import { completeUpload } from "../api/complete-upload";
import { findByChecksum } from "../api/find-by-checksum";
import { getUpload } from "../api/get-upload";
import { recordParts } from "../api/record-parts";
import { signParts } from "../api/sign-parts";
import { startUpload } from "../api/start-upload";
import { PartRecords } from "./part-records";
import { PartSigner } from "./part-signer";
import { forgetResumeNote, readResumeNote, writeResumeNote } from "./resume-notes";

/**
 * The browser's side of a presigned multipart upload, carried by Uppy's S3 multipart plugin. Every call
 * it makes goes to Kerf's own routes: Kerf opens the upload, signs each part for its exact length (a
 * few parts per request, part-signer.ts), and keeps its own record of each stored part (number, ETag,
 * size), sent a few at a time while the next parts are on their way (part-records.ts) and all sent
 * before pausing, listing or completing, or as the page closes; listing parts reads those records, so a paused, failed or
 * reloaded upload carries on from what Kerf recorded. One queue per channel lives for the whole visit,
 * so an upload goes on while the person moves to another page of Kerf.
 */
export type JobStatus = "checking" | "duplicate" | "reading" | "queued" | "uploading" | "paused" | "completing" | "done" | "failed" | "cancelled" | "needs-file";

type Meta = { jobId: string };
type Body = Record<string, never>;
type Duplicate = NonNullable<ChecksumAnswer["clip"]>;

interface UploadJob {
  id: string;
  episodeId: string;
  fileName: string;
  size: number;
  fingerprint: string;
  status: JobStatus;
  file: File | null;
  uppyId: string | null;
  uploadId: string | null;
  partSize: number;
  partCount: number;
  /** Parts Kerf has recorded: number → bytes. */
  stored: Map<number, number>;
  /** Parts on their way: number → bytes sent so far. */
  sending: Map<number, number>;
  /** Failed tries per part since the last start or Retry. */
  failures: Map<number, number>;
  /** Parts in storage whose record Kerf has not confirmed yet. */
  records: PartRecords;
  signer: PartSigner;
  metadata: ClipMetadata | null;
  sha256: string | null;
  duplicate: Duplicate | null;
  error: string | null;
  clip: ClipDetail | null;
}

export interface JobView {
  id: string;
  episodeId: string;
  fileName: string;
  size: number;
  status: JobStatus;
  sent: number;
  partsStored: number;
  partCount: number;
  error: string | null;
  clipId: string | null;
  duplicate: Duplicate | null;
}

export interface QueueHooks {
  probe(file: File): Promise<ClipMetadata | null>;
  hash(file: File): Promise<string | null>;
  /** After completion: a poster frame, if the browser can decode the file. */
  afterComplete(clip: ClipDetail, file: File): Promise<void>;
  onChange?(): void;
}

/** Parts sent at once (for all files together). */
const PARALLEL_PARTS = 4;
/** Waits before each new try of a part or a signature: backing off, then giving the person the choice. */
export const RETRY_DELAYS_MS = [0, 1_000, 3_000, 5_000, 10_000];
/** After this many failed tries of one part the upload stops (its stored parts kept) and asks the person. */
const TRIES_PER_PART = 4;
const PARTS_FAILED = "Some parts didn't reach storage. Retry sends just those.";

export const fingerprintOf = (file: File) => `${file.name}:${file.size}:${file.lastModified}`;

/** An error Uppy's retry rule reads: it retries a status of 0 or 5xx, not a refusal. */
function forRetry(error: unknown): Error {
  const wrapped = new Error(error instanceof Error ? error.message : "Kerf didn't answer.") as Error & { source: { status: number } };
  wrapped.source = { status: error instanceof ApiError ? error.status : 0 };
  return wrapped;
}

export class UploadQueue {
  private jobs: UploadJob[] = [];
  private listeners = new Set<() => void>();
  private snapshot: JobView[] = [];
  private emitTimer: ReturnType<typeof setTimeout> | null = null;
  private readonly uppy: Uppy<Meta, Body>;
  /** Each signed part URL → the job and part it is for (Uppy hands the URL back when it sends the bytes). */
  private signed = new Map<string, { job: UploadJob; partNumber: number }>();

  constructor(
    private readonly channelId: string,
    private hooks: QueueHooks,
  ) {
    this.uppy = new Uppy<Meta, Body>({ id: `kerf-${channelId}`, autoProceed: false, allowMultipleUploadBatches: true });
    this.uppy.use(AwsS3<Meta, Body>, {
      shouldUseMultipart: true,
      limit: PARALLEL_PARTS,
      retryDelays: RETRY_DELAYS_MS,
      // Kerf's plan and Uppy's cut must agree part for part: the signed length is checked.
      getChunkSize: (file) => planParts(file.size).partSize,
      createMultipartUpload: (file) => this.open(this.jobOf(file.meta.jobId)),
      listParts: (file, { uploadId }) => this.listParts(this.jobOf(file.meta.jobId), uploadId ?? this.jobOf(file.meta.jobId).uploadId!),
      signPart: (file, { uploadId, partNumber, body }) => this.signPart(this.jobOf(file.meta.jobId), uploadId, partNumber, body.size),
      uploadPartBytes: (options) => this.sendPart(options),
      completeMultipartUpload: (file, { uploadId }) => this.complete(this.jobOf(file.meta.jobId), uploadId),
      // Uppy aborts on any error; Kerf keeps the parts for Retry instead. A person's Cancel aborts (cancel()).
      abortMultipartUpload: () => undefined,
    });
    // Records still waiting when the page closes would be lost, and those parts sent again on resume.
    window.addEventListener("pagehide", () => {
      for (const job of this.jobs) if (job.uploadId) job.records.sendAsPageCloses();
    });
    this.uppy.on("upload-success", (file) => {
      if (file) void this.finished(this.jobOf(file.meta.jobId), file.id);
    });
    this.uppy.on("upload-error", (file, error) => {
      if (!file) return;
      const job = this.jobOf(file.meta.jobId);
      if (job.status === "cancelled" || job.status === "done") return;
      job.sending.clear();
      this.fail(job, error instanceof ApiError ? error.message : PARTS_FAILED);
    });
  }

  setHooks(hooks: QueueHooks) {
    this.hooks = hooks;
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => {
      this.listeners.delete(listener);
    };
  };

  getSnapshot = () => this.snapshot;

  private emit(now = false) {
    const publish = () => {
      this.emitTimer = null;
      this.snapshot = this.jobs.map(toView);
      for (const l of this.listeners) l();
      this.report();
    };
    if (now) {
      if (this.emitTimer) clearTimeout(this.emitTimer);
      publish();
    } else if (!this.emitTimer) this.emitTimer = setTimeout(publish, 100);
  }

  /** The small indicator every page shows while files of this channel are on their way. */
  private report() {
    const going = this.snapshot.filter((j) => !["done", "cancelled", "needs-file"].includes(j.status));
    const id = `uploads-${this.channelId}`;
    if (going.length === 0) return reportWork({ id, gone: true });
    const episodeId = going[0]!.episodeId;
    reportWork({
      id,
      label: going.length === 1 ? `Uploading ${going[0]!.fileName}` : `Uploading ${going.length} files`,
      done: going.reduce((s, j) => s + j.sent, 0),
      total: going.reduce((s, j) => s + j.size, 0),
      active: going.some((j) => ["checking", "reading", "queued", "uploading", "completing"].includes(j.status)),
      href: `/c/${this.channelId}/episodes/${episodeId}`,
    });
  }

  private newJob(fields: Pick<UploadJob, "id" | "episodeId" | "fileName" | "size" | "fingerprint" | "status"> & Partial<UploadJob>): UploadJob {
    const job: UploadJob = {
      file: null,
      uppyId: null,
      uploadId: null,
      partSize: 0,
      partCount: 0,
      stored: new Map(),
      sending: new Map(),
      failures: new Map(),
      records: new PartRecords(
        (parts, leaving) => recordParts(this.channelId, job.uploadId!, parts, leaving),
        (parts) => {
          for (const part of parts) job.stored.set(part.partNumber, part.size);
          this.emit();
        },
      ),
      signer: new PartSigner((uploadId, parts) => signParts(this.channelId, uploadId, parts)),
      metadata: null,
      sha256: null,
      duplicate: null,
      error: null,
      clip: null,
      ...fields,
    };
    return job;
  }

  private jobOf(id: string): UploadJob {
    const job = this.jobs.find((j) => j.id === id);
    if (!job) throw new Error("upload not in the queue");
    return job;
  }

  private find(id: string) {
    return this.jobs.find((j) => j.id === id);
  }

  /** Unfinished uploads the server remembers: shown until their file is chosen again. */
  remember(open: UploadView[]) {
    for (const upload of open) {
      if (this.jobs.some((j) => j.uploadId === upload.id)) continue;
      this.jobs.push(
        this.newJob({
          id: upload.id,
          episodeId: upload.episodeId,
          fileName: upload.fileName,
          size: upload.size,
          fingerprint: upload.fingerprint,
          status: "needs-file",
          uploadId: upload.id,
          partSize: upload.partSize,
          partCount: upload.partCount,
          stored: new Map(upload.parts.map((p) => [p.partNumber, p.size])),
        }),
      );
    }
    this.emit(true);
  }

  add(files: File[], episodeId: string) {
    for (const file of files) {
      const fingerprint = fingerprintOf(file);
      const waiting = this.jobs.find((j) => j.status === "needs-file" && j.fingerprint === fingerprint);
      if (waiting) {
        waiting.file = file;
        waiting.status = "checking";
        void this.prepare(waiting, { resuming: true });
        continue;
      }
      const job = this.newJob({ id: crypto.randomUUID(), episodeId, fileName: file.name, size: file.size, fingerprint, file, status: "checking" });
      this.jobs.push(job);
      void this.prepare(job, { resuming: readResumeNote(this.channelId, fingerprint) !== null });
    }
    this.emit(true);
  }

  /** The checksum first: a file already in the channel waits for the person to say. */
  private async prepare(job: UploadJob, { resuming }: { resuming: boolean }) {
    job.sha256 = await this.hooks.hash(job.file!).catch(() => null);
    if (job.status !== "checking") return;
    if (job.sha256 && !resuming) {
      const duplicate = await findByChecksum(this.channelId, job.sha256).catch(() => null);
      if (job.status !== "checking") return;
      if (duplicate) {
        job.status = "duplicate";
        job.duplicate = duplicate;
        this.emit(true);
        return;
      }
    }
    await this.begin(job);
  }

  /** The person wants the file sent although the channel has it. */
  uploadAnyway(id: string) {
    const job = this.find(id);
    if (!job || job.status !== "duplicate") return;
    void this.begin(job);
  }

  private async begin(job: UploadJob) {
    job.status = "reading";
    this.emit(true);
    job.metadata = await this.hooks.probe(job.file!).catch(() => null);
    if (job.status !== "reading") return;
    await this.findResumable(job);
    try {
      job.uppyId = this.uppy.addFile({ name: job.fileName, type: job.file!.type || undefined, data: job.file!, meta: { jobId: job.id } });
    } catch {
      return this.fail(job, "Kerf couldn't take this file into the upload list.");
    }
    if (job.uploadId) this.carryOn(job.uppyId, job.uploadId);
    job.status = "queued";
    this.emit(true);
    this.uppy.upload().catch(() => undefined);
  }

  /** Tells Uppy the file's upload exists already: it then lists the recorded parts and sends the rest. */
  private carryOn(uppyId: string, uploadId: string) {
    this.uppy.setFileState(uppyId, { s3Multipart: { uploadId, key: uploadId } } as unknown as Partial<UppyFile<Meta, Body>>);
  }

  /** An upload of this very file Kerf still holds open (noted in this browser, or listed by the server). */
  private async findResumable(job: UploadJob) {
    const noted = readResumeNote(this.channelId, job.fingerprint)?.uploadId ?? job.uploadId;
    job.uploadId = null;
    if (!noted) return;
    const upload = await getUpload(this.channelId, noted).catch(() => null);
    if (!upload || upload.status !== "uploading" || upload.size !== job.size) {
      forgetResumeNote(this.channelId, job.fingerprint);
      return;
    }
    job.uploadId = upload.id;
    job.partSize = upload.partSize;
    job.partCount = upload.partCount;
    job.stored = new Map(upload.parts.map((p) => [p.partNumber, p.size]));
  }

  private async open(job: UploadJob) {
    try {
      const upload = await startUpload(this.channelId, {
        episodeId: job.episodeId,
        fileName: job.fileName,
        size: job.size,
        fingerprint: job.fingerprint,
        ...(job.metadata ? { metadata: job.metadata } : {}),
      });
      job.uploadId = upload.id;
      job.partSize = upload.partSize;
      job.partCount = upload.partCount;
      job.stored = new Map();
      writeResumeNote(this.channelId, job.fingerprint, { uploadId: upload.id, key: upload.id });
      if (job.status === "queued") job.status = "uploading";
      this.emit(true);
      return { uploadId: upload.id, key: upload.id };
    } catch (error) {
      // A refusal (type, size) is final: no retries, the words go to the person.
      throw error instanceof ApiError ? error : forRetry(error);
    }
  }

  private async listParts(job: UploadJob, uploadId: string): Promise<AwsS3Part[]> {
    // Parts whose record still fails are not listed, so they are sent again.
    await job.records.flush().catch(() => undefined);
    const upload = await getUpload(this.channelId, uploadId);
    job.stored = new Map(upload.parts.map((p) => [p.partNumber, p.size]));
    if (job.status === "queued") job.status = "uploading";
    this.emit(true);
    return upload.parts.map((p) => ({ PartNumber: p.partNumber, ETag: p.etag, Size: p.size }));
  }

  private async signPart(job: UploadJob, uploadId: string, partNumber: number, size: number): Promise<AwsS3UploadParameters> {
    try {
      const plan = { uploadId, partSize: job.partSize, size: job.size, partCount: job.partCount };
      const url = await job.signer.urlFor(plan, partNumber, size, (n) => job.stored.has(n) || job.records.has(n));
      this.signed.set(url, { job, partNumber });
      return { method: "PUT", url };
    } catch (error) {
      throw forRetry(error);
    }
  }

  /** Tells Kerf every part stored so far that it has not heard of; a failure leaves them for the next try. */
  private async settleRecords(job: UploadJob) {
    await job.records.flush().catch(() => job.records.flush());
  }

  /** Sends one part's bytes (Uppy's own sender), then hands its record to the batch before Uppy counts it. */
  private async sendPart(options: Parameters<typeof AwsS3.uploadPartBytes>[0]) {
    const mine = this.signed.get(options.signature.url);
    this.signed.delete(options.signature.url);
    if (!mine) return AwsS3.uploadPartBytes(options);
    const { job, partNumber } = mine;
    let etag: string | null = null;
    try {
      const answer = await AwsS3.uploadPartBytes({
        ...options,
        onProgress: (event: ProgressEvent) => {
          if (job.status === "uploading" && event.lengthComputable) job.sending.set(partNumber, event.loaded);
          this.emit();
        },
        onComplete: (tag: string) => {
          etag = tag;
        },
      });
      job.sending.delete(partNumber);
      job.records.add({ partNumber, etag: etag ?? answer.ETag ?? "", size: (options.body as Blob).size });
      (options.onComplete as (tag: string) => void)(etag ?? answer.ETag ?? "");
      return answer;
    } catch (error) {
      job.sending.delete(partNumber);
      if ((error as Error).name !== "AbortError") this.partFailed(job, partNumber);
      throw error;
    } finally {
      this.emit();
    }
  }

  /** Uppy tries again with growing waits; after a few tries Kerf stops the file and offers Retry. */
  private partFailed(job: UploadJob, partNumber: number) {
    const tries = (job.failures.get(partNumber) ?? 0) + 1;
    job.failures.set(partNumber, tries);
    if (tries < TRIES_PER_PART || job.status !== "uploading" || !job.uppyId) return;
    if (this.uppy.getFile(job.uppyId)?.isPaused !== true) this.uppy.pauseResume(job.uppyId);
    job.sending.clear();
    this.fail(job, PARTS_FAILED);
  }

  private async complete(job: UploadJob, uploadId: string) {
    job.status = "completing";
    this.emit(true);
    try {
      await this.settleRecords(job);
    } catch (error) {
      throw forRetry(error);
    }
    job.clip = await completeUpload(this.channelId, uploadId, { ...(job.metadata ? { metadata: job.metadata } : {}), ...(job.sha256 ? { sha256: job.sha256 } : {}) });
    return {};
  }

  private async finished(job: UploadJob, uppyId: string) {
    job.status = "done";
    job.sending.clear();
    forgetResumeNote(this.channelId, job.fingerprint);
    // Out of Uppy's list, so the same file can be chosen again later.
    this.uppy.removeFile(uppyId);
    job.uppyId = null;
    this.emit(true);
    this.hooks.onChange?.();
    if (job.clip && job.file) await this.hooks.afterComplete(job.clip, job.file).catch(() => undefined);
    this.hooks.onChange?.();
  }

  private fail(job: UploadJob, message: string) {
    job.signer.forget();
    job.status = "failed";
    job.error = message;
    this.emit(true);
  }

  /** Stops the parts on their way; every part already stored stays stored and counted. */
  pause(id: string) {
    const job = this.find(id);
    if (!job || !["queued", "uploading"].includes(job.status) || !job.uppyId) return;
    if (this.uppy.pauseResume(job.uppyId) !== true) return;
    job.status = "paused";
    job.signer.forget();
    job.sending.clear();
    void job.records.flush().catch(() => undefined);
    this.emit(true);
  }

  resume(id: string) {
    const job = this.find(id);
    if (!job || job.status !== "paused" || !job.uppyId) return;
    job.status = "uploading";
    this.uppy.pauseResume(job.uppyId);
    this.emit(true);
  }

  /** Carries on from the parts Kerf recorded; the failed ones are sent again with fresh tries. */
  retry(id: string) {
    const job = this.find(id);
    if (!job || job.status !== "failed") return;
    job.error = null;
    job.failures.clear();
    if (!job.uppyId) {
      void this.begin(job);
      return;
    }
    if (this.uppy.getFile(job.uppyId)?.isPaused) {
      // Stopped by Kerf after failed tries: carry on from the recorded parts.
      job.status = "uploading";
      this.uppy.pauseResume(job.uppyId);
      this.emit(true);
      return;
    }
    // Uppy forgets the upload's id on an error; Kerf still has it open.
    if (job.uploadId) this.carryOn(job.uppyId, job.uploadId);
    job.status = "uploading";
    this.emit(true);
    this.uppy.retryUpload(job.uppyId).catch(() => undefined);
  }

  async cancel(id: string) {
    const job = this.find(id);
    if (!job || job.status === "done" || job.status === "cancelled" || job.status === "completing") return;
    job.status = "cancelled";
    job.sending.clear();
    job.records.drop();
    if (job.uppyId) this.uppy.removeFile(job.uppyId);
    job.uppyId = null;
    forgetResumeNote(this.channelId, job.fingerprint);
    this.emit(true);
    if (job.uploadId) await cancelUpload(this.channelId, job.uploadId).catch(() => undefined);
  }

  dismiss(id: string) {
    this.jobs = this.jobs.filter((j) => j.id !== id || !["done", "cancelled", "needs-file"].includes(j.status));
    this.emit(true);
  }

  pauseAll(episodeId: string) {
    for (const job of this.jobs) if (job.episodeId === episodeId) this.pause(job.id);
  }

  resumeAll(episodeId: string) {
    for (const job of this.jobs) if (job.episodeId === episodeId && job.status === "paused") this.resume(job.id);
  }
}

/**
 * Bytes shown as sent: every part in storage (recorded by Kerf or with its record on the way), plus what
 * is on its way counted up to one part. A pause drops only the parts on their way, so the bar never goes
 * back by more than one part.
 */
function toView(job: UploadJob): JobView {
  const stored = [...job.stored.entries()].reduce((s, [n, bytes]) => (job.records.has(n) ? s : s + bytes), job.records.bytes());
  const sending = Math.min([...job.sending.values()].reduce((s, n) => s + n, 0), job.partSize);
  return {
    id: job.id,
    episodeId: job.episodeId,
    fileName: job.fileName,
    size: job.size,
    status: job.status,
    sent: job.status === "done" ? job.size : Math.min(job.size, stored + sending),
    partsStored: job.stored.size,
    partCount: job.partCount,
    error: job.error,
    clipId: job.clip?.id ?? null,
    duplicate: job.duplicate,
  };
}

const queues = new Map<string, UploadQueue>();

/** The channel's one queue for this visit: made on first use, kept while the person moves around Kerf. */
export function uploadQueueFor(channelId: string, hooks: QueueHooks): UploadQueue {
  let queue = queues.get(channelId);
  if (!queue) {
    queue = new UploadQueue(channelId, hooks);
    queues.set(channelId, queue);
  } else queue.setHooks(hooks);
  return queue;
}
