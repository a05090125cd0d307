import { useEffect, useState, type KeyboardEvent, type ReactNode } from "react";
import type { ClipDetail, MarkView } from "@shared/rushes/schemas";
import type { TimecodeFormat } from "@shared/timecode/rates";
import { frameCount, frameOfLabel, sourceLabel } from "@shared/timecode/playhead";
import { checkTimecode } from "@shared/timecode/timecode";
import { Button } from "../../../components/Button";
import { KeysSheet } from "./KeysSheet";
import { MarkStrip } from "./MarkStrip";
import { isTyping, keyOf, playerKeys, type PlayerAction } from "./player-keys";
import { usePlayhead } from "./use-playhead";

/** The mark being made: its in and out as typed or set from the picture. */
export interface MarkDraft {
  in: string;
  out: string;
  setIn: (label: string) => void;
  setOut: (label: string) => void;
  writeNote: () => void;
}

interface PlayerProps {
  clip: ClipDetail;
  format: TimecodeFormat;
  url: string;
  draft: MarkDraft;
  /** A mark to start at (the playhead on its in point). */
  openAt?: MarkView | null;
  onUnplayable: () => void;
  playerRef: (element: HTMLDivElement | null) => void;
}

/** The clip's picture with its source timecode, frame steps, in and out from the playhead, and its marks. */
export function ClipPlayer({ clip, format, url, openAt = null, draft, onUnplayable, playerRef }: PlayerProps) {
  const frames = Math.max(1, frameCount(clip.durationMs, format.rate));
  const { frame, playing, seek, step, togglePlay, attach } = usePlayhead(format.rate, frames - 1);
  const [keysOpen, setKeysOpen] = useState(false);
  const label = (frame: number) => sourceLabel(clip.startTimecode, frame, format);
  const firstFrame = frameOfLabel(null, label(0), format);
  const startFrame = openAt ? openAt.inFrame - firstFrame : null;
  useEffect(() => {
    if (startFrame !== null) seek(startFrame);
  }, [seek, startFrame]);
  const draftFrame = (text: string) => (checkTimecode(text, format).ok ? frameOfLabel(clip.startTimecode, text, format) : null);

  const actions: Record<PlayerAction, () => void> = {
    play: togglePlay,
    frameBack: () => step(-1),
    frameOn: () => step(1),
    secondBack: () => step(-Math.round(format.rate.numerator / format.rate.denominator)),
    secondOn: () => step(Math.round(format.rate.numerator / format.rate.denominator)),
    first: () => seek(0),
    last: () => seek(frames - 1),
    in: () => draft.setIn(label(frame)),
    out: () => draft.setOut(label(frame)),
    note: draft.writeNote,
    keys: () => setKeysOpen(true),
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (isTyping(e.target)) return;
    const onControl = e.target instanceof HTMLButtonElement || e.target instanceof HTMLInputElement;
    const key = playerKeys.find((k) => k.matches(e));
    // A focused button keeps Space; the scrubber keeps its own arrows, Home and End.
    if (!key || (onControl && key.action === "play") || (e.target instanceof HTMLInputElement && ["frameBack", "frameOn", "first", "last"].includes(key.action))) return;
    e.preventDefault();
    actions[key.action]();
  };

  return (
    <div ref={playerRef} tabIndex={0} role="group" aria-label="Player" aria-keyshortcuts={playerKeys.map((k) => k.aria).join(" ")} onKeyDown={onKeyDown} className="flex flex-col gap-2 rounded-md bg-graphite-900 p-2 text-ply-100 focus-visible:outline-3 focus-visible:outline-amber-cut">
      <video
        key={url}
        ref={attach}
        src={url}
        poster={clip.posterUrl ?? undefined}
        preload="auto"
        playsInline
        onError={onUnplayable}
        onClick={(e) => e.currentTarget.parentElement?.focus()}
        className="aspect-video w-full rounded-sm bg-black"
        aria-label={`Picture of ${clip.fileName}`}
      />
      <MarkStrip marks={clip.marks} firstFrame={firstFrame} frames={frames} playhead={frame} draft={{ inFrame: draftFrame(draft.in), outFrame: draftFrame(draft.out) }} onChoose={seek} />
      <label className="sr-only" htmlFor={`scrub-${clip.id}`}>
        Playhead frame
      </label>
      <input id={`scrub-${clip.id}`} type="range" min={0} max={frames - 1} step={1} value={frame} onChange={(e) => seek(Number(e.target.value))} className="w-full accent-amber-cut" />
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <output aria-live="off" aria-label="Playhead timecode" className="font-mono text-2xl font-bold tracking-wide">
          {label(frame)}
        </output>
        <span className="text-xs text-ply-200">
          frame {frame + 1} of {frames} · source timecode
        </span>
      </div>
      <div className="flex flex-wrap gap-2">
        <Control action="frameBack" onClick={actions.frameBack}>Frame back</Control>
        <Control action="play" onClick={actions.play}>{playing ? "Stop" : "Play"}</Control>
        <Control action="frameOn" onClick={actions.frameOn}>Frame on</Control>
        <Control action="in" onClick={actions.in}>In here</Control>
        <Control action="out" onClick={actions.out}>Out here</Control>
        <Control action="keys" onClick={actions.keys}>Keys</Control>
      </div>
      <p className="text-xs text-ply-200" aria-live="polite">
        In <span className="font-mono">{draft.in || "not set"}</span> · Out <span className="font-mono">{draft.out || "not set"}</span> · press <Kbd>N</Kbd> to write the note, then <Kbd>Enter</Kbd> to save.
      </p>
      <KeysSheet open={keysOpen} onClose={() => setKeysOpen(false)} />
    </div>
  );
}

function Kbd({ children }: { children: ReactNode }) {
  return <kbd className="rounded border border-graphite-500 px-1 font-sans text-ply-50">{children}</kbd>;
}

function Control({ action, onClick, children }: { action: PlayerAction; onClick: () => void; children: ReactNode }) {
  const key = keyOf(action);
  return (
    <Button tone="quiet" onClick={onClick} aria-keyshortcuts={key.aria} className="px-2.5 py-1.5">
      {children}
      <kbd aria-hidden className="rounded border border-ply-300 px-1 font-sans text-xs text-graphite-500">
        {key.keys}
      </kbd>
    </Button>
  );
}
