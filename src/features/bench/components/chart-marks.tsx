import type { PlanVerdict } from "@shared/bench/criteria";
import { chartColours } from "../../../components/chart/chart-style";

/** One run on the comparison chart, its figures already in the axes' units. */
export interface PlotPoint {
  id: string;
  number: number;
  label: string;
  verdict: PlanVerdict;
  best: boolean;
  x: number;
  y: number;
}

/** A plan threshold on one axis, with the words drawn beside it. */
export interface PlanLine {
  value: number;
  label: string;
}

export const verdictColours: Record<PlanVerdict, string> = { pass: chartColours.good, fail: chartColours.bad, incomplete: chartColours.open };

/** Shape as well as colour tells the verdict: a filled disc meets the plan, a cross misses it, a ring waits. */
export function Marker({ verdict, cx, cy, colour }: { verdict: PlanVerdict; cx: number; cy: number; colour: string }) {
  if (verdict === "pass") return <circle cx={cx} cy={cy} r="6.5" fill={colour} />;
  if (verdict === "fail")
    return (
      <path d={`M${cx - 5.5} ${cy - 5.5}L${cx + 5.5} ${cy + 5.5}M${cx + 5.5} ${cy - 5.5}L${cx - 5.5} ${cy + 5.5}`} stroke={colour} strokeWidth="3" strokeLinecap="round" />
    );
  return <circle cx={cx} cy={cy} r="5.5" fill="white" stroke={colour} strokeWidth="2.5" />;
}
