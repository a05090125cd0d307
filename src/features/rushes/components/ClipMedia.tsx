import type { MediaMismatch } from "@shared/rushes/media-check";
import type { ClipView } from "@shared/rushes/schemas";
import { frameRateName, type FrameRate } from "@shared/timecode/rates";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { formatDuration } from "../../../lib/format";
import { useRetryMedia } from "../api/retry-media";

export const MAKING_TEXT = "Making poster and proxy…";

const rateText = (rate: FrameRate) => `${frameRateName(rate) ?? (rate.numerator / rate.denominator).toFixed(3)} fps`;

const valueText: { [F in MediaMismatch["field"]]: (value: Extract<MediaMismatch, { field: F }>["file"]) => string } = {
  frameRate: rateText,
  durationMs: (ms) => formatDuration(ms),
  resolution: (size) => `${size.width}×${size.height}`,
  codec: (name) => name,
};

/** "The file says 25 fps; the browser said 29.97 fps; Kerf uses the file's." */
export function mismatchSentence(mismatch: MediaMismatch): string {
  const word = valueText[mismatch.field] as (value: unknown) => string;
  return `The file says ${word(mismatch.file)}; the browser said ${word(mismatch.browser)}; Kerf uses the file's.`;
}

/** The server's work on the clip, in the clip's panel: on its way, failed (why, and a retry), or where file and browser disagree. */
export function ClipMediaStatus({ channelId, clip }: { channelId: string; clip: ClipView }) {
  const retry = useRetryMedia(channelId, clip.id);
  const { state, failure, mismatches } = clip.media;
  if (state === "waiting" || state === "making") return <Notice>{MAKING_TEXT} The original plays meanwhile, if this browser can.</Notice>;
  if (state === "failed") {
    return (
      <div role="alert" className="flex flex-col gap-2 rounded-md border border-alarm-600/40 bg-alarm-600/5 px-4 py-3 text-sm text-alarm-600">
        <p>
          <span className="font-semibold">No poster or proxy: </span>
          {failure ?? "the server couldn't make them."}
        </p>
        <div>
          <Button tone="quiet" busy={retry.isPending} onClick={() => retry.mutate()}>
            Retry poster and proxy
          </Button>
        </div>
        {retry.error && <p>{retry.error.message}</p>}
      </div>
    );
  }
  if (mismatches.length === 0) return null;
  return (
    <div className="rounded-md border border-amber-cut bg-ply-50 px-4 py-3 text-sm text-graphite-900" aria-label="File and browser disagree">
      <p className="font-semibold">The file and the browser disagree</p>
      <ul className="mt-1 list-disc pl-5">
        {mismatches.map((m) => (
          <li key={m.field}>{mismatchSentence(m)}</li>
        ))}
      </ul>
    </div>
  );
}

/** One line under the clip's name in the footage list. */
export function ClipMediaNote({ clip }: { clip: ClipView }) {
  const { state, failure } = clip.media;
  if (state === "waiting" || state === "making") return <p className="text-xs text-graphite-500">{MAKING_TEXT}</p>;
  if (state === "failed") return <p className="text-xs text-alarm-600">No poster or proxy: {failure ?? "the server couldn't make them."}</p>;
  return null;
}
