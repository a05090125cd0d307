import { useCallback, useEffect, useRef, useState } from "react";
import type { FrameRate } from "@shared/timecode/rates";
import { frameAtSeconds, secondsForFrame } from "@shared/timecode/playhead";

export interface Playhead {
  /** The frame on screen, counted from the clip's first frame; follows the picture, not the request. */
  frame: number;
  playing: boolean;
  seek: (frame: number) => void;
  step: (frames: number) => void;
  togglePlay: () => void;
  /** The ref for the <video>; the playhead follows whichever element it is given. */
  attach: (element: HTMLVideoElement | null) => void;
}

/**
 * A <video>'s position in whole frames. Seeks go to the middle of a frame and the shown frame is read
 * back when the seek lands ("seeked"), so the timecode beside the picture is the picture's. Steps add
 * to the frame last asked for, so keys pressed faster than seeks land still count each frame.
 */
export function usePlayhead(rate: FrameRate, lastFrame: number): Playhead {
  const [element, setElement] = useState<HTMLVideoElement | null>(null);
  const video = useRef<HTMLVideoElement | null>(null);
  const attach = useCallback((next: HTMLVideoElement | null) => {
    video.current = next;
    setElement(next);
  }, []);
  const [frame, setFrame] = useState(0);
  const [playing, setPlaying] = useState(false);
  const wanted = useRef(0);

  const seek = useCallback(
    (to: number) => {
      const target = Math.min(Math.max(0, Math.round(to)), Math.max(0, lastFrame));
      wanted.current = target;
      const current = video.current;
      if (!current) return setFrame(target);
      if (!current.paused) current.pause();
      current.currentTime = secondsForFrame(target, rate);
    },
    [rate, lastFrame],
  );
  const step = useCallback((frames: number) => seek(wanted.current + frames), [seek]);

  const togglePlay = useCallback(() => {
    const current = video.current;
    if (!current) return;
    if (current.paused) void current.play().catch(() => setPlaying(false));
    else current.pause();
  }, []);

  useEffect(() => {
    if (!element) return;
    const shown = () => frameAtSeconds(element.currentTime, rate);
    let callback = 0;
    // While playing, each painted frame reports its own presentation time; a browser without frame
    // callbacks follows the coarser time updates instead.
    const framesReported = typeof element.requestVideoFrameCallback === "function";
    const follow = (_now: number, meta: VideoFrameCallbackMetadata) => {
      setFrame(frameAtSeconds(meta.mediaTime, rate));
      callback = element.requestVideoFrameCallback(follow);
    };
    const onSeeked = () => {
      if (element.paused) setFrame(shown());
    };
    const onTimeUpdate = () => {
      if (!framesReported && !element.paused) setFrame(Math.min(shown(), lastFrame));
    };
    const onPlay = () => {
      setPlaying(true);
      if (framesReported) callback = element.requestVideoFrameCallback(follow);
    };
    const onPause = () => {
      setPlaying(false);
      if (framesReported) element.cancelVideoFrameCallback(callback);
      // Park on a whole frame, so the label and the picture agree while stopped.
      wanted.current = Math.min(shown(), lastFrame);
      element.currentTime = secondsForFrame(wanted.current, rate);
    };
    // Seeking once loaded hides the poster (a frame from elsewhere in the clip) behind the playhead's
    // own frame, and a new element (a fresh preview link) opens where the playhead was.
    const onLoaded = () => {
      element.currentTime = secondsForFrame(wanted.current, rate);
    };
    element.addEventListener("loadedmetadata", onLoaded);
    element.addEventListener("seeked", onSeeked);
    element.addEventListener("timeupdate", onTimeUpdate);
    element.addEventListener("play", onPlay);
    element.addEventListener("pause", onPause);
    return () => {
      element.removeEventListener("loadedmetadata", onLoaded);
      element.removeEventListener("seeked", onSeeked);
      element.removeEventListener("timeupdate", onTimeUpdate);
      element.removeEventListener("play", onPlay);
      element.removeEventListener("pause", onPause);
      if (framesReported) element.cancelVideoFrameCallback(callback);
    };
  }, [element, rate, lastFrame]);

  return { frame, playing, seek, step, togglePlay, attach };
}
