import { useEffect, useRef, useState, type FormEvent, type ReactNode } from "react";
import type { ClipDetail, FootageLinks, ShootDayView, ShotView } from "@shared/rushes/schemas";
import { clipRatingLabels, clipRatings, shotKindLabels, shotKinds } from "@shared/rushes/vocabulary";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { allOf, QueryState } from "../../../components/States";
import { ApiError } from "../../../lib/api-client";
import { useDeleteClip } from "../api/delete-clip";
import { useFootageLinks } from "../api/footage-links";
import { useClip } from "../api/get-clip";
import { fetchDownloadLink, usePreview } from "../api/get-preview";
import { useShootDays } from "../api/list-shoot-days";
import { useShots } from "../api/list-shots";
import { useUpdateClip } from "../api/update-clip";
import { formatDay, formatDuration, formatInstant, formatSize } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { clipFormatText } from "./labels";
import { ClipMediaStatus } from "./ClipMedia";
import { ClipPlayer } from "./ClipPlayer";
import { clipFormat, MarksEditor, useMarkForm } from "./MarksEditor";

/** One clip: its preview, its facts, and its log (links, rating, tags, notes, marks); opened at `markId` when it names one of its marks. */
export function ClipPanel({ channelId, clipId, markId = null, canDelete, onClose }: { channelId: string; clipId: string; markId?: string | null; canDelete: boolean; onClose: () => void }) {
  const clip = useClip(channelId, clipId);
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), [clipId]);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => e.key === "Escape" && !e.defaultPrevented && onClose();
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [onClose]);
  return (
    <aside role="dialog" aria-modal="false" aria-labelledby="clip-heading" className="fixed inset-0 z-40 w-full overflow-x-hidden overflow-y-auto bg-white p-4 shadow-xl sm:left-auto sm:z-20 sm:max-w-xl sm:border-l sm:border-ply-300 sm:p-5">
      <div className="mb-3 flex items-start justify-between gap-3">
        <h2 id="clip-heading" ref={heading} tabIndex={-1} className="min-w-0 text-lg font-bold break-all">
          {clip.data?.fileName ?? "Clip"}
        </h2>
        <Button tone="quiet" className="shrink-0" onClick={onClose}>
          Close
        </Button>
      </div>
      <QueryState query={clip} loading="Loading the clip…">
        {(detail) => <ClipBody key={detail.id} channelId={channelId} clip={detail} markId={markId} canDelete={canDelete} onDeleted={onClose} />}
      </QueryState>
    </aside>
  );
}

function ClipBody({ channelId, clip, markId, canDelete, onDeleted }: { channelId: string; clip: ClipDetail; markId: string | null; canDelete: boolean; onDeleted: () => void }) {
  const openMark = clip.marks.find((m) => m.id === markId) ?? null;
  const remove = useDeleteClip(channelId);
  const timeZone = useTimeZone();
  const player = useRef<HTMLDivElement | null>(null);
  // After a mark is saved the keys go back to the player, ready for the next in point.
  const marking = useMarkForm(channelId, clip, () => player.current?.focus());
  const format = clipFormat(clip);
  const download = async () => {
    const { url } = await fetchDownloadLink(channelId, clip.id);
    window.location.assign(url);
  };
  return (
    <div className="flex flex-col gap-5">
      <ClipPreview channelId={channelId} clip={clip}>
        {(url, onUnplayable) =>
          format ? (
            <ClipPlayer clip={clip} format={format} url={url} openAt={openMark} draft={marking.draft} onUnplayable={onUnplayable} playerRef={(element) => void (player.current = element)} />
          ) : (
            <video key={url} src={url} poster={clip.posterUrl ?? undefined} controls preload="metadata" onError={onUnplayable} className="aspect-video w-full rounded-md bg-graphite-900" aria-label={`Preview of ${clip.fileName}`} />
          )
        }
      </ClipPreview>
      <ClipMediaStatus channelId={channelId} clip={clip} />
      <MarksEditor channelId={channelId} clip={clip} marking={marking} current={openMark?.id ?? null} />
      <div>
        <Button tone="quiet" onClick={() => void download()}>
          Download original
        </Button>
      </div>
      <dl className="grid grid-cols-[8rem_1fr] gap-x-3 gap-y-1 text-sm" aria-label="Clip facts">
        <dt className="text-graphite-500">Duration</dt>
        <dd>{formatDuration(clip.durationMs)}</dd>
        <dt className="text-graphite-500">Timecode</dt>
        <dd>
          <span className="font-mono">{clip.startTimecode ?? "none"}</span> · {clipFormatText(clip)}
        </dd>
        <dt className="text-graphite-500">Picture</dt>
        <dd>{clip.width && clip.height ? `${clip.width}×${clip.height}` : "unknown"} · {clip.codec ?? "codec unknown"}</dd>
        <dt className="text-graphite-500">Recorded</dt>
        <dd>{formatInstant(clip.recordedAt, timeZone)}</dd>
        <dt className="text-graphite-500">Size</dt>
        <dd>{formatSize(clip.size)}</dd>
        <dt className="text-graphite-500">Checksum</dt>
        <dd className="font-mono text-xs break-all">{clip.sha256 ? `SHA-256 ${clip.sha256}` : clip.storageEtag ? `storage ETag ${clip.storageEtag}` : "none"}</dd>
      </dl>
      <ClipLog channelId={channelId} clip={clip} />
      {canDelete && (
        <div className="border-t border-ply-200 pt-4">
          <Button
            tone="danger"
            busy={remove.isPending}
            onClick={() => {
              if (window.confirm(`Delete ${clip.fileName} from storage and from Kerf? This can't be undone.`)) remove.mutate(clip.id, { onSuccess: onDeleted });
            }}
          >
            Delete clip
          </Button>
          {remove.error && <p className="mt-2 text-sm text-alarm-600">{remove.error.message}</p>}
        </div>
      )}
    </div>
  );
}

/**
 * The clip's picture from a short-lived link, or why there is none. The proxy plays once the server
 * has made it; a panel already playing the original keeps it (a new source would lose the playhead)
 * unless this browser couldn't play the original at all.
 */
function ClipPreview({ channelId, clip, children }: { channelId: string; clip: ClipDetail; children: (url: string, onUnplayable: () => void) => ReactNode }) {
  const [openedWithProxy] = useState(clip.media.hasProxy);
  const [unplayableUrl, setUnplayableUrl] = useState<string | null>(null);
  const proxy = clip.media.hasProxy && (openedWithProxy || unplayableUrl !== null);
  const preview = usePreview(channelId, clip.id, proxy ? clip.media.attempts : null);
  if (preview.data && preview.data.url !== unplayableUrl) {
    const { url } = preview.data;
    return children(url, () => setUnplayableUrl(url));
  }
  const pending = clip.media.state === "waiting" || clip.media.state === "making";
  const message = unplayableUrl
    ? pending
      ? "This browser can't play this file here (a camera codec it doesn't decode). The server is making a copy it can play; it shows here when ready."
      : "This browser can't play this file here (a camera codec it doesn't decode, or no file in storage behind a demo clip). Download the original to view it; marks can still be typed below."
    : preview.isError
      ? "Storage is not reachable; no preview right now."
      : "Loading preview…";
  return <div className="flex aspect-video items-center justify-center rounded-md bg-graphite-900 p-6 text-center text-sm text-ply-200">{message}</div>;
}

const select = "rounded-md border border-ply-300 bg-white px-2 py-1.5 text-sm";

/** The log waits for the episode's days, shots, runs and iterations, so its menus open on the clip's own choices. */
function ClipLog({ channelId, clip }: { channelId: string; clip: ClipDetail }) {
  const plan = allOf(useShootDays(channelId, clip.episodeId), useShots(channelId, clip.episodeId), useFootageLinks(channelId, clip.episodeId));
  return (
    <QueryState query={plan} loading="Loading the log…">
      {([days, shots, links]) => <LogForm channelId={channelId} clip={clip} days={days} shots={shots} links={links} />}
    </QueryState>
  );
}

function LogForm({ channelId, clip, days, shots, links }: { channelId: string; clip: ClipDetail; days: ShootDayView[]; shots: ShotView[]; links: FootageLinks }) {
  const update = useUpdateClip(channelId, clip.id);
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);
  const submit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const text = (k: string) => String(data.get(k) ?? "");
    setNotice(null);
    try {
      await update.mutateAsync({
        shootDayId: text("shootDayId") || null,
        shotId: text("shotId") || null,
        benchRunId: text("benchRunId") || null,
        buildIterationId: text("buildIterationId") || null,
        rating: (text("rating") || null) as ClipDetail["rating"],
        kind: (text("kind") || null) as ClipDetail["kind"],
        tags: text("tags")
          .split(",")
          .map((t) => t.trim())
          .filter(Boolean),
        notes: text("notes"),
        camera: text("camera"),
      });
      setNotice({ kind: "success", text: "Log saved." });
    } catch (error) {
      const fields = error instanceof ApiError ? Object.values(error.fields) : [];
      setNotice({ kind: "error", text: fields.length ? fields.join(" ") : (error as Error).message });
    }
  };
  return (
    <form key={`${clip.id}-${clip.shotId}-${clip.benchRunId}-${clip.buildIterationId}-${clip.rating}-${clip.tags.join()}`} onSubmit={submit} className="grid min-w-0 grid-cols-1 gap-3 rounded-md border border-ply-300 p-3 sm:grid-cols-2" aria-label="Log this clip">
      <h3 className="font-semibold sm:col-span-2">Log</h3>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Shot
        <select name="shotId" defaultValue={clip.shotId ?? ""} className={select}>
          <option value="">No shot</option>
          {shots.map((s) => (
            <option key={s.id} value={s.id}>
              {s.description}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Shoot day
        <select name="shootDayId" defaultValue={clip.shootDayId ?? ""} className={select}>
          <option value="">No day</option>
          {days.map((d) => (
            <option key={d.id} value={d.id}>
              {formatDay(d.day)} {d.place}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Rating
        <select name="rating" defaultValue={clip.rating ?? ""} className={select}>
          <option value="">Not rated</option>
          {clipRatings.map((r) => (
            <option key={r} value={r}>
              {clipRatingLabels[r]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Kind
        <select name="kind" defaultValue={clip.kind ?? ""} className={select}>
          <option value="">Not set</option>
          {shotKinds.map((k) => (
            <option key={k} value={k}>
              {shotKindLabels[k]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Tags (comma between)
        <input name="tags" defaultValue={clip.tags.join(", ")} className={select} />
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Camera
        <input name="camera" defaultValue={clip.camera} className={select} />
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium sm:col-span-2">
        Notes
        <textarea name="notes" defaultValue={clip.notes} rows={3} className={select} />
      </label>
      <ShownSelect label="Bench run shown" name="benchRunId" none="No run" noun="Run" value={clip.benchRunId} things={links.runs} />
      <ShownSelect label="Build iteration shown" name="buildIterationId" none="No iteration" noun="Iteration" value={clip.buildIterationId} things={links.iterations} />
      <div className="flex items-center gap-3 sm:col-span-2">
        <Button type="submit" busy={update.isPending}>
          Save log
        </Button>
        {notice && <Notice kind={notice.kind}>{notice.text}</Notice>}
      </div>
    </form>
  );
}

/** Which run or iteration of the episode the clip shows, saved with the log. */
function ShownSelect({ label, name, none, noun, value, things }: { label: string; name: string; none: string; noun: string; value: string | null; things: { id: string; number: number; title: string }[] }) {
  return (
    <label className="flex min-w-0 flex-col gap-1 text-sm font-medium">
      {label}
      <select name={name} defaultValue={value ?? ""} className={select}>
        <option value="">{none}</option>
        {things.map((thing) => (
          <option key={thing.id} value={thing.id}>
            {noun} {thing.number} · {thing.title}
          </option>
        ))}
      </select>
    </label>
  );
}
