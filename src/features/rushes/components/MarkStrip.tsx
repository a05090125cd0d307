import type { MarkView } from "@shared/rushes/schemas";

interface StripProps {
  marks: MarkView[];
  /** The absolute frame number of the clip's first frame, which marks' frames count from. */
  firstFrame: number;
  frames: number;
  playhead: number;
  draft: { inFrame: number | null; outFrame: number | null };
  onChoose: (frame: number) => void;
}

const percent = (frame: number, frames: number) => `${(Math.min(Math.max(frame, 0), frames) / Math.max(frames, 1)) * 100}%`;

/** The clip's marks along its length under the picture; choosing one takes the playhead to its in point. */
export function MarkStrip({ marks, firstFrame, frames, playhead, draft, onChoose }: StripProps) {
  const draftEnd = draft.outFrame ?? (draft.inFrame !== null ? playhead : null);
  return (
    <div className="relative h-8 w-full rounded-sm bg-graphite-700" role="group" aria-label="Marks along the clip">
      {draft.inFrame !== null && draftEnd !== null && draftEnd > draft.inFrame && (
        <div aria-hidden className="absolute inset-y-0 bg-amber-cut/40" style={{ left: percent(draft.inFrame, frames), width: `calc(${percent(draftEnd, frames)} - ${percent(draft.inFrame, frames)})` }} />
      )}
      {marks.map((m) => {
        const from = m.inFrame - firstFrame;
        const to = m.outFrame - firstFrame;
        return (
          <button
            key={m.id}
            type="button"
            title={m.note || `${m.in} → ${m.out}`}
            aria-label={`Go to mark ${m.in} → ${m.out}${m.note ? `, ${m.note}` : ""}`}
            onClick={() => onChoose(from)}
            className="absolute inset-y-1 min-w-2 rounded-sm bg-ply-200 hover:bg-white focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-white"
            style={{ left: percent(from, frames), width: `calc(${percent(to, frames)} - ${percent(from, frames)})` }}
          />
        );
      })}
      <div aria-hidden className="pointer-events-none absolute inset-y-0 w-0.5 bg-amber-cut" style={{ left: percent(playhead, frames) }} />
    </div>
  );
}
