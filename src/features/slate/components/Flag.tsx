import type { BoardFlag } from "@shared/slate/flags";

const tones: Record<BoardFlag["tone"], string> = {
  alarm: "bg-alarm-600 text-white",
  warn: "bg-amber-cut/80 text-graphite-900",
  info: "bg-ply-200 text-graphite-700",
};

/** One flag as a small chip; its detail is in the title and, for screen readers, in the text. */
export function Flag({ flag }: { flag: BoardFlag }) {
  return (
    <span title={flag.detail} className={`inline-flex items-center rounded px-1.5 py-0.5 text-[0.7rem] font-semibold leading-tight ${tones[flag.tone]}`}>
      {flag.label}
      {flag.detail && <span className="sr-only">: {flag.detail}</span>}
    </span>
  );
}
