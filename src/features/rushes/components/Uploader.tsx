import { useEffect, useId, useMemo, useRef, useState, useSyncExternalStore } from "react";
import { checkClipFile } from "@shared/rushes/limits";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { formatSize } from "../../../lib/format";
import { useFootageArrived } from "../api/complete-upload";
import { useOpenUploads } from "../api/open-uploads";
import { sendPoster } from "../api/send-poster";
import { posterFrom } from "../uploader/poster";
import { sha256Of } from "../uploader/hash";
import { probeFile } from "../uploader/probe";
import { uploadQueueFor, type JobView, type UploadQueue } from "../uploader/upload-queue";

const statusWords: Record<JobView["status"], string> = {
  checking: "Looking for this file in the channel…",
  duplicate: "Already in the channel",
  reading: "Reading metadata…",
  queued: "Waiting",
  uploading: "Uploading",
  paused: "Paused",
  completing: "Checking with storage…",
  done: "Stored",
  failed: "Stopped",
  cancelled: "Cancelled",
  "needs-file": "Unfinished: choose this file again to carry on",
};

/**
 * Camera files for one episode: straight to storage in parts, with progress per file and for the batch.
 * The queue belongs to the channel, not to this page: uploads go on while the person works elsewhere in
 * Kerf (the app's top bar shows how far they are), and this list shows them again on return.
 */
export function Uploader({ channelId, episodeId }: { channelId: string; episodeId: string }) {
  const footageArrived = useFootageArrived(channelId);
  const queue = useMemo(
    () =>
      uploadQueueFor(channelId, {
        probe: probeFile,
        hash: sha256Of,
        afterComplete: async (clip, file) => {
          const poster = await posterFrom(file);
          if (poster) await sendPoster(channelId, clip.id, poster);
        },
        onChange: footageArrived,
      }),
    [channelId, footageArrived],
  );
  const allJobs = useSyncExternalStore(queue.subscribe, queue.getSnapshot);
  const jobs = useMemo(() => allJobs.filter((j) => j.episodeId === episodeId), [allJobs, episodeId]);
  const open = useOpenUploads(channelId, episodeId);
  useEffect(() => {
    if (open.data) queue.remember(open.data);
  }, [open.data, queue]);

  const [refused, setRefused] = useState<string[]>([]);
  const input = useRef<HTMLInputElement>(null);
  const inputId = useId();
  const [dragging, setDragging] = useState(false);

  const take = (list: FileList | null) => {
    if (!list) return;
    const files = [...list];
    const problems = files.map((f) => checkClipFile(f.name, f.size)).flatMap((c) => (c.ok ? [] : [c.message]));
    setRefused(problems);
    queue.add(
      files.filter((f) => checkClipFile(f.name, f.size).ok),
      episodeId,
    );
    if (input.current) input.current.value = "";
  };

  const live = jobs.filter((j) => j.status !== "cancelled");
  const total = live.reduce((s, j) => s + j.size, 0);
  const sent = live.reduce((s, j) => s + j.sent, 0);

  return (
    <section aria-labelledby={`${inputId}-heading`} className="rounded-lg border border-ply-300 bg-white p-4">
      <h3 id={`${inputId}-heading`} className="mb-2 font-semibold">
        Upload footage
      </h3>
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => {
          e.preventDefault();
          setDragging(false);
          take(e.dataTransfer.files);
        }}
        className={`relative flex flex-wrap items-center gap-3 rounded-md border-2 border-dashed p-4 ${dragging ? "border-amber-cut bg-ply-100" : "border-ply-300"}`}
      >
        <label className="cursor-pointer rounded-md bg-rust-600 px-4 py-2 text-sm font-semibold text-white focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-graphite-900 hover:bg-rust-700">
          Choose camera files
          <input id={inputId} ref={input} type="file" multiple className="sr-only" aria-label="Camera files" onChange={(e) => take(e.target.files)} />
        </label>
        <span className="text-sm text-graphite-500">or drop them here. Files go straight to storage in 8 MiB parts; Kerf keeps track of each part.</span>
      </div>
      {refused.length > 0 && (
        <div className="mt-3">
          <Notice kind="error">
            {refused.map((m) => (
              <p key={m}>{m}</p>
            ))}
          </Notice>
        </div>
      )}
      {jobs.length > 0 && (
        <>
          <div className="mt-4 flex flex-wrap items-center gap-3">
            <Progress label="All files" value={sent} max={total} />
            <span className="text-sm text-graphite-700" aria-live="polite">
              {formatSize(sent)} of {formatSize(total)}
            </span>
            <Button tone="quiet" onClick={() => queue.pauseAll(episodeId)}>
              Pause all
            </Button>
            <Button tone="quiet" onClick={() => queue.resumeAll(episodeId)}>
              Resume all
            </Button>
          </div>
          <ul className="mt-3 divide-y divide-ply-200" aria-label="Uploads">
            {jobs.map((job) => (
              <JobRow key={job.id} job={job} queue={queue} />
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

function Progress({ label, value, max }: { label: string; value: number; max: number }) {
  const percent = max > 0 ? Math.floor((value / max) * 100) : 0;
  return (
    <div className="flex min-w-48 flex-1 items-center gap-2">
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} className="h-2.5 flex-1 overflow-hidden rounded-full bg-ply-200">
        <div className="h-full bg-moss-600 transition-[width]" style={{ width: `${percent}%` }} />
      </div>
      <span className="w-10 text-right text-xs tabular-nums text-graphite-700">{percent}%</span>
    </div>
  );
}

function JobRow({ job, queue }: { job: JobView; queue: UploadQueue }) {
  const canPause = job.status === "uploading" || job.status === "queued";
  return (
    <li className="flex flex-wrap items-center gap-3 py-2" aria-label={`Upload of ${job.fileName}`}>
      <div className="min-w-56 flex-1">
        <p className="font-medium">{job.fileName}</p>
        <p className="text-xs text-graphite-500">
          {statusWords[job.status]} · {formatSize(job.size)}
          {job.partCount > 0 && ` · ${job.partsStored} of ${job.partCount} parts stored`}
        </p>
        {job.error && <p className="text-sm text-alarm-600">{job.error}</p>}
        {job.status === "duplicate" && job.duplicate && (
          <p className="text-sm text-graphite-700">
            This file is already in the channel as {job.duplicate.fileName} (episode “{job.duplicate.episodeTitle}”).
          </p>
        )}
      </div>
      <Progress label={`${job.fileName} progress`} value={job.sent} max={job.size} />
      <div className="flex gap-2">
        {canPause && (
          <Button tone="quiet" onClick={() => queue.pause(job.id)}>
            Pause
          </Button>
        )}
        {job.status === "paused" && (
          <Button tone="quiet" onClick={() => queue.resume(job.id)}>
            Resume
          </Button>
        )}
        {job.status === "duplicate" && (
          <Button tone="quiet" onClick={() => queue.uploadAnyway(job.id)}>
            Upload anyway
          </Button>
        )}
        {job.status === "failed" && (
          <Button tone="quiet" onClick={() => queue.retry(job.id)}>
            Retry
          </Button>
        )}
        {!["done", "cancelled", "completing", "needs-file"].includes(job.status) && (
          <Button tone="danger" onClick={() => void queue.cancel(job.id)}>
            Cancel
          </Button>
        )}
        {job.status === "needs-file" && (
          <Button tone="danger" onClick={() => void queue.cancel(job.id)}>
            Discard
          </Button>
        )}
        {["done", "cancelled"].includes(job.status) && (
          <Button tone="quiet" onClick={() => queue.dismiss(job.id)}>
            Clear
          </Button>
        )}
      </div>
    </li>
  );
}
