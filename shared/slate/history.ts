import { stages, type Stage } from "./stages";

/** One recorded stage move. `from` is null for the entry that opens the episode. */
export interface StageMove {
  from: Stage | null;
  to: Stage;
  /** ISO 8601 instant. */
  at: string;
}

export interface StageTime {
  stage: Stage;
  /** Milliseconds spent in the stage over every visit, up to `now` for the current one. */
  ms: number;
  visits: number;
}

/**
 * Time in each stage, from the history alone: each move opens a stay in its `to` stage that the next
 * move closes. A stage visited twice (moved back, then on again) adds both stays.
 */
export function timeInStages(history: StageMove[], now: Date): StageTime[] {
  const sorted = [...history].sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
  const totals = new Map<Stage, { ms: number; visits: number }>(stages.map((s) => [s, { ms: 0, visits: 0 }]));
  sorted.forEach((move, i) => {
    const next = sorted[i + 1];
    const end = next ? Date.parse(next.at) : now.getTime();
    const total = totals.get(move.to)!;
    total.ms += Math.max(0, end - Date.parse(move.at));
    total.visits += 1;
  });
  return stages.map((stage) => ({ stage, ...totals.get(stage)! }));
}

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

/** "3 d 4 h", "5 h", "under an hour": time in a stage for people, not for arithmetic. */
export function formatStay(ms: number): string {
  if (ms < HOUR) return "under an hour";
  const days = Math.floor(ms / DAY);
  const hours = Math.floor((ms % DAY) / HOUR);
  if (days === 0) return `${hours} h`;
  return hours === 0 ? `${days} d` : `${days} d ${hours} h`;
}
