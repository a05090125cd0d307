import { lazy, useState } from "react";
import { columnUnit, figureIn, type ComparisonKey } from "@shared/bench/comparison";
import { formatNumber, metricLabels, verdictLabels } from "@shared/bench/format";
import { RATIO_UNIT } from "@shared/bench/quantity";
import type { CriterionView, RunView } from "@shared/bench/schemas";
import { ChartFrame } from "../../../components/chart/ChartFrame";
import { chartColours } from "../../../components/chart/chart-style";
import { SelectField } from "../../../components/form-fields";
import { Marker, type PlanLine, type PlotPoint, verdictColours } from "./chart-marks";

// The chart library comes with the bench's chart, not with the rest of the app.
const ComparisonPlot = lazy(() => import("./ComparisonPlot").then((m) => ({ default: m.ComparisonPlot })));

const yChoices: ComparisonKey[] = ["thrust_per_watt", "thrust", "thrust_to_weight", "power_per_gram", "electrical_power"];
const xChoices: ComparisonKey[] = ["mass", "electrical_power"];

const axisLabel = (key: ComparisonKey) => {
  const unit = columnUnit(key);
  return unit === RATIO_UNIT ? `${metricLabels[key]} (ratio)` : `${metricLabels[key]} (${unit})`;
};

const height = 380;

/**
 * Each run as a point, by default thrust per watt against the configuration's mass: up and to the
 * left is better. The best candidate (meets the plan, most thrust per watt) is ringed and named.
 */
export function ComparisonChart({ runs, best, criteria }: { runs: RunView[]; best: RunView | null; criteria: CriterionView[] }) {
  const [yKey, setYKey] = useState<ComparisonKey>("thrust_per_watt");
  const [xKey, setXKey] = useState<ComparisonKey>("mass");

  const points: PlotPoint[] = runs.flatMap((run) => {
    const x = figureIn(run.evaluation.values[xKey], columnUnit(xKey));
    const y = figureIn(run.evaluation.values[yKey], columnUnit(yKey));
    return x === null || y === null ? [] : [{ id: run.id, number: run.number, label: run.label, verdict: run.evaluation.verdict, best: run.id === best?.id, x, y }];
  });
  const missing = runs.filter((run) => !points.some((point) => point.id === run.id));
  const xUnit = columnUnit(xKey) === RATIO_UNIT ? "" : ` ${columnUnit(xKey)}`;
  const yUnit = columnUnit(yKey) === RATIO_UNIT ? "" : ` ${columnUnit(yKey)}`;

  const summary = best
    ? `Best candidate: run ${best.number}, ${best.label}. It meets the plan with the most thrust per watt.`
    : "No run meets the plan yet, so there is no best candidate.";
  const description = [
    summary,
    ...points.map((p) => `Run ${p.number} (${p.label}): ${formatNumber(p.x)}${xUnit}, ${formatNumber(p.y)}${yUnit}, ${verdictLabels[p.verdict].toLowerCase()}.`),
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
      <ChartFrame name={`${metricLabels[yKey]} against ${metricLabels[xKey].toLowerCase()}, one point per run`} description={description} height={height}>
        <ComparisonPlot points={points} xLabel={axisLabel(xKey)} yLabel={axisLabel(yKey)} xLines={planLines(criteria, xKey)} yLines={planLines(criteria, yKey)} />
      </ChartFrame>
      <ul className="mt-2 flex flex-wrap gap-4 text-xs text-graphite-700" aria-label="Legend">
        {(["pass", "fail", "incomplete"] as const).map((verdict) => (
          <li key={verdict} className="flex items-center gap-1">
            <svg viewBox="0 0 16 16" className="size-4" aria-hidden>
              <Marker verdict={verdict} cx={8} cy={8} colour={verdictColours[verdict]} />
            </svg>
            {verdictLabels[verdict]}
          </li>
        ))}
        <li className="flex items-center gap-1">
          <svg viewBox="0 0 16 16" className="size-4" aria-hidden>
            <circle cx="8" cy="8" r="6" fill="none" stroke={chartColours.highlight} strokeWidth="3" />
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
function planLines(criteria: CriterionView[], key: ComparisonKey): PlanLine[] {
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
