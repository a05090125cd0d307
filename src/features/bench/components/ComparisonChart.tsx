import { useId, useState } from "react";
import { columnUnit, figureIn, type ComparisonKey } from "@shared/bench/comparison";
import type { PlanVerdict } from "@shared/bench/criteria";
import { formatNumber, metricLabels, verdictLabels } from "@shared/bench/format";
import { RATIO_UNIT } from "@shared/bench/quantity";
import type { CriterionView, RunView } from "@shared/bench/schemas";
import { SelectField } from "../../../components/form-fields";
import { axisFrom } from "./chart-axis";

const yChoices: ComparisonKey[] = ["thrust_per_watt", "thrust", "thrust_to_weight", "power_per_gram", "electrical_power"];
const xChoices: ComparisonKey[] = ["mass", "electrical_power"];

const axisLabel = (key: ComparisonKey) => {
  const unit = columnUnit(key);
  return unit === RATIO_UNIT ? `${metricLabels[key]} (ratio)` : `${metricLabels[key]} (${unit})`;
};

const colours: Record<PlanVerdict, string> = { pass: "var(--color-moss-600)", fail: "var(--color-alarm-600)", incomplete: "var(--color-graphite-500)" };

const width = 640;
const height = 380;
const margin = { top: 24, right: 28, bottom: 58, left: 70 };

/**
 * Each run as a point, by default thrust per watt against the configuration's mass: up and to the
 * left is better. The best candidate (meets the plan, most thrust per watt) is ringed and named.
 */
export function ComparisonChart({ runs, best, criteria }: { runs: RunView[]; best: RunView | null; criteria: CriterionView[] }) {
  const [yKey, setYKey] = useState<ComparisonKey>("thrust_per_watt");
  const [xKey, setXKey] = useState<ComparisonKey>("mass");
  const titleId = useId();
  const descId = useId();

  const points = runs.flatMap((run) => {
    const x = figureIn(run.evaluation.values[xKey], columnUnit(xKey));
    const y = figureIn(run.evaluation.values[yKey], columnUnit(yKey));
    return x === null || y === null ? [] : [{ run, x, y }];
  });
  const missing = runs.filter((run) => !points.some((point) => point.run.id === run.id));
  const xLines = planLines(criteria, xKey);
  const yLines = planLines(criteria, yKey);
  const sx = axisFrom(Math.max(0, ...points.map((p) => p.x), ...xLines.map((l) => l.value)), [margin.left, width - margin.right]);
  const sy = axisFrom(Math.max(0, ...points.map((p) => p.y), ...yLines.map((l) => l.value)), [height - margin.bottom, margin.top]);
  const xTicks = sx.ticks(5);
  const yTicks = sy.ticks(5);
  const xUnit = columnUnit(xKey) === RATIO_UNIT ? "" : ` ${columnUnit(xKey)}`;
  const yUnit = columnUnit(yKey) === RATIO_UNIT ? "" : ` ${columnUnit(yKey)}`;

  const summary = best
    ? `Best candidate: run ${best.number}, ${best.label}. It meets the plan with the most thrust per watt.`
    : "No run meets the plan yet, so there is no best candidate.";
  const description = [
    summary,
    ...points.map((p) => `Run ${p.run.number} (${p.run.label}): ${formatNumber(p.x)}${xUnit}, ${formatNumber(p.y)}${yUnit}, ${verdictLabels[p.run.evaluation.verdict].toLowerCase()}.`),
  ].join(" ");

  return (
    <figure>
      <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
        <figcaption>
          <h3 className="font-semibold">Pick at a glance</h3>
          <p className={`text-sm ${best ? "font-semibold text-moss-600" : "text-graphite-500"}`}>{summary}</p>
        </figcaption>
        <div className="flex flex-wrap gap-2">
          <SelectField label="Up the side" value={yKey} onChange={(event) => setYKey(event.target.value as ComparisonKey)} options={yChoices.map((key) => ({ value: key, label: metricLabels[key] }))} />
          <SelectField label="Along the bottom" value={xKey} onChange={(event) => setXKey(event.target.value as ComparisonKey)} options={xChoices.map((key) => ({ value: key, label: metricLabels[key] }))} />
        </div>
      </div>
      <svg viewBox={`0 0 ${width} ${height}`} role="img" aria-labelledby={`${titleId} ${descId}`} className="w-full max-w-2xl">
        <title id={titleId}>{`${metricLabels[yKey]} against ${metricLabels[xKey].toLowerCase()}, one point per run`}</title>
        <desc id={descId}>{description}</desc>
        <rect x={margin.left} y={margin.top} width={width - margin.left - margin.right} height={height - margin.top - margin.bottom} fill="var(--color-ply-50)" />
        {yTicks.map((tick) => (
          <g key={`y${tick}`}>
            <line x1={margin.left} x2={width - margin.right} y1={sy(tick)} y2={sy(tick)} stroke="var(--color-ply-200)" />
            <text x={margin.left - 8} y={sy(tick) + 4} textAnchor="end" fontSize="12" fill="var(--color-graphite-700)">
              {formatNumber(tick)}
            </text>
          </g>
        ))}
        {xTicks.map((tick) => (
          <g key={`x${tick}`}>
            <line x1={sx(tick)} x2={sx(tick)} y1={margin.top} y2={height - margin.bottom} stroke="var(--color-ply-200)" />
            <text x={sx(tick)} y={height - margin.bottom + 18} textAnchor="middle" fontSize="12" fill="var(--color-graphite-700)">
              {formatNumber(tick)}
            </text>
          </g>
        ))}
        <line x1={margin.left} x2={width - margin.right} y1={height - margin.bottom} y2={height - margin.bottom} stroke="var(--color-graphite-900)" strokeWidth="1.5" />
        <line x1={margin.left} x2={margin.left} y1={margin.top} y2={height - margin.bottom} stroke="var(--color-graphite-900)" strokeWidth="1.5" />
        <text x={(margin.left + width - margin.right) / 2} y={height - 14} textAnchor="middle" fontSize="13" fontWeight="600" fill="var(--color-graphite-900)">
          {axisLabel(xKey)}
        </text>
        <text transform={`translate(18 ${(margin.top + height - margin.bottom) / 2}) rotate(-90)`} textAnchor="middle" fontSize="13" fontWeight="600" fill="var(--color-graphite-900)">
          {axisLabel(yKey)}
        </text>
        {yLines.map((line) => (
          <g key={`py${line.label}`}>
            <line x1={margin.left} x2={width - margin.right} y1={sy(line.value)} y2={sy(line.value)} stroke="var(--color-rust-600)" strokeWidth="1.5" strokeDasharray="6 4" />
            <text x={margin.left + 6} y={sy(line.value) - 5} fontSize="11" fill="var(--color-rust-700)">
              {line.label}
            </text>
          </g>
        ))}
        {xLines.map((line) => (
          <g key={`px${line.label}`}>
            <line x1={sx(line.value)} x2={sx(line.value)} y1={margin.top} y2={height - margin.bottom} stroke="var(--color-rust-600)" strokeWidth="1.5" strokeDasharray="6 4" />
            <text x={sx(line.value) + 4} y={margin.top + 12} fontSize="11" fill="var(--color-rust-700)">
              {line.label}
            </text>
          </g>
        ))}
        {points.map(({ run, x, y }) => {
          const cx = sx(x);
          const cy = sy(y);
          const isBest = run.id === best?.id;
          const colour = colours[run.evaluation.verdict];
          return (
            <g key={run.id}>
              {isBest && <circle cx={cx} cy={cy} r="14" fill="none" stroke="var(--color-amber-cut)" strokeWidth="4" />}
              <Marker verdict={run.evaluation.verdict} cx={cx} cy={cy} colour={colour} />
              <text x={cx + (isBest ? 18 : 11)} y={cy - 8} fontSize="12" fontWeight={isBest ? 700 : 500} fill="var(--color-graphite-900)">
                {isBest ? `Best: run ${run.number}` : `Run ${run.number}`}
              </text>
            </g>
          );
        })}
      </svg>
      <ul className="mt-2 flex flex-wrap gap-4 text-xs text-graphite-700" aria-label="Legend">
        {(["pass", "fail", "incomplete"] as const).map((verdict) => (
          <li key={verdict} className="flex items-center gap-1">
            <svg viewBox="0 0 16 16" className="size-4" aria-hidden>
              <Marker verdict={verdict} cx={8} cy={8} colour={colours[verdict]} />
            </svg>
            {verdictLabels[verdict]}
          </li>
        ))}
        <li className="flex items-center gap-1">
          <svg viewBox="0 0 16 16" className="size-4" aria-hidden>
            <circle cx="8" cy="8" r="6" fill="none" stroke="var(--color-amber-cut)" strokeWidth="3" />
          </svg>
          Best candidate
        </li>
      </ul>
      {missing.length > 0 && (
        <p className="mt-2 text-xs text-graphite-500">
          Not on the chart (a figure is missing): {missing.map((run) => `run ${run.number}`).join(", ")}.
        </p>
      )}
    </figure>
  );
}

/** The plan's thresholds on an axis's figure, drawn as dashed lines so the pass side is visible. */
function planLines(criteria: CriterionView[], key: ComparisonKey): { value: number; label: string }[] {
  const unit = columnUnit(key);
  return criteria.flatMap((criterion) => {
    if (criterion.metric !== key) return [];
    const bounds =
      criterion.comparator === "between"
        ? [{ q: criterion.low, sign: "≥" }, { q: criterion.high, sign: "≤" }]
        : criterion.comparator === "eq"
          ? [{ q: criterion.threshold, sign: "=" }]
          : [{ q: criterion.threshold, sign: criterion.comparator === "gte" ? "≥" : "≤" }];
    return bounds.flatMap(({ q, sign }) => {
      const value = figureIn(q, unit);
      return value === null || value < 0 ? [] : [{ value, label: `plan ${sign} ${formatNumber(value)}${unit === RATIO_UNIT ? "" : ` ${unit}`}${criterion.required ? "" : " (informative)"}` }];
    });
  });
}

/** Shape as well as colour tells the verdict: a filled disc meets the plan, a cross misses it, a ring waits. */
function Marker({ verdict, cx, cy, colour }: { verdict: PlanVerdict; cx: number; cy: number; colour: string }) {
  if (verdict === "pass") return <circle cx={cx} cy={cy} r="6.5" fill={colour} />;
  if (verdict === "fail")
    return (
      <path d={`M${cx - 5.5} ${cy - 5.5}L${cx + 5.5} ${cy + 5.5}M${cx + 5.5} ${cy - 5.5}L${cx - 5.5} ${cy + 5.5}`} stroke={colour} strokeWidth="3" strokeLinecap="round" />
    );
  return <circle cx={cx} cy={cy} r="5.5" fill="white" stroke={colour} strokeWidth="2.5" />;
}
