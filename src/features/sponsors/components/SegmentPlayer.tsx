import { useCallback, useEffect, useImperativeHandle, useRef, useState, type Ref } from "react";
import type { ReviewSegment } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { formatClock } from "../../../lib/format";

/** What a page around the player can ask of it: where it is in the segment, and to go to a moment. */
export interface SegmentPlayerHandle {
  /** Seconds from the segment's in point. */
  position(): number;
  seek(offsetSeconds: number): void;
  pause(): void;
}

type PlayState = "loading" | "ready" | "playing" | "paused" | "ended" | "failed";

const stateWords: Record<PlayState, (at: string) => string> = {
  loading: () => "Loading the segment…",
  ready: () => "Ready at the segment's start",
  playing: () => "Playing",
  paused: (at) => `Paused at ${at}`,
  ended: () => "Stopped at the segment's end",
  failed: () => "This browser couldn't play the cut. Try another browser, or ask the channel for the file.",
};

/** Half a frame at 60 fps: a position this close to the out point is at it. */
const AT_END = 1 / 120;

/**
 * Plays one segment of a file and nothing else: it starts at the in point, any seek outside in..out
 * lands back inside, and playing stops at the out point and says so. The scrubber spans the segment
 * only; times are from its in point.
 */
export function SegmentPlayer({ url, segment, label, startAt = 0, ref }: { url: string; segment: ReviewSegment; label: string; startAt?: number; ref?: Ref<SegmentPlayerHandle> }) {
  const video = useRef<HTMLVideoElement>(null);
  const [state, setState] = useState<PlayState>("loading");
  const [offset, setOffset] = useState(0);
  const { startSeconds: start } = segment;
  // A whole file's length is as the clip was recorded; the file's own length wins once it is known.
  const [end, setEnd] = useState(segment.endSeconds);
  const length = Math.max(0, end - start);

  const clamp = useCallback((fileSeconds: number) => Math.min(Math.max(fileSeconds, start), end), [start, end]);

  /** While playing, each painted frame checks the out point: closer than the media's own time updates (4 a second). */
  useEffect(() => {
    if (state !== "playing") return;
    let id = 0;
    const tick = () => {
      const v = video.current;
      if (!v) return;
      if (v.currentTime >= end - AT_END) {
        v.pause();
        v.currentTime = end;
        setOffset(length);
        setState("ended");
        return;
      }
      setOffset(v.currentTime - start);
      id = requestAnimationFrame(tick);
    };
    id = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(id);
  }, [state, end, length, start]);

  const seek = useCallback(
    (offsetSeconds: number) => {
      const v = video.current;
      if (!v) return;
      const to = clamp(start + offsetSeconds);
      v.currentTime = to;
      setOffset(to - start);
      if (v.paused) setState(to >= end - AT_END ? "ended" : to <= start ? "ready" : "paused");
    },
    [clamp, end, start],
  );

  useImperativeHandle(ref, () => ({ position: () => offset, seek, pause: () => video.current?.pause() }), [offset, seek]);

  const onLoaded = () => {
    const v = video.current;
    if (!v) return;
    const fileEnd = segment.wholeFile && Number.isFinite(v.duration) && v.duration > 0 ? v.duration : end;
    setEnd(fileEnd);
    const from = Math.min(Math.max(startAt, 0), fileEnd - start);
    v.currentTime = start + from;
    setOffset(from);
    setState(from > 0 ? "paused" : "ready");
  };

  /** A seek by the browser's own means (keys on the element, a media key) is kept inside the segment. */
  const onSeeking = () => {
    const v = video.current;
    if (!v) return;
    const inside = clamp(v.currentTime);
    if (Math.abs(inside - v.currentTime) > AT_END) v.currentTime = inside;
  };

  const play = async () => {
    const v = video.current;
    if (!v) return;
    if (v.currentTime >= end - AT_END || v.currentTime < start) v.currentTime = start;
    try {
      await v.play();
    } catch {
      return; // the element's own error event says why, if it couldn't
    }
    setState("playing");
  };

  const pause = () => video.current?.pause();

  const onPause = () => {
    const v = video.current;
    if (!v) return;
    setOffset(clamp(v.currentTime) - start);
    setState((now) => (now === "ended" ? now : v.currentTime >= end - AT_END ? "ended" : "paused"));
  };

  const at = formatClock(offset);
  const playing = state === "playing";
  return (
    <div role="group" aria-label={label} data-state={state} data-offset={offset.toFixed(2)} className="flex flex-col gap-2">
      <video
        ref={video}
        src={url}
        preload="auto"
        playsInline
        className="aspect-video w-full rounded-md bg-graphite-900"
        onLoadedMetadata={onLoaded}
        onSeeking={onSeeking}
        onPause={onPause}
        onEnded={onPause}
        onError={() => setState("failed")}
        onClick={() => (playing ? pause() : void play())}
      >
        Your browser can't play this video here.
      </video>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="button" tone="quiet" onClick={() => (playing ? pause() : void play())} disabled={state === "loading" || state === "failed"}>
          {playing ? "Pause" : state === "ended" ? "Play again" : "Play"}
        </Button>
        <label className="flex min-w-0 flex-1 items-center gap-2 text-sm">
          <span className="sr-only">Moment in the segment</span>
          <input
            type="range"
            min={0}
            max={length}
            step={0.04}
            value={Math.min(offset, length)}
            onChange={(e) => seek(Number(e.target.value))}
            aria-valuetext={`${at} of ${formatClock(length)}`}
            disabled={state === "loading" || state === "failed"}
            className="min-w-0 flex-1 accent-rust-600"
          />
        </label>
        <span className="font-mono text-sm tabular-nums">
          {at} / {formatClock(length)}
        </span>
      </div>
      <p role="status" className="text-sm text-graphite-700">
        {stateWords[state](at)}
      </p>
    </div>
  );
}
