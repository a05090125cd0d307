import { type ReactNode, useState } from "react";
import { type ComparisonKey, comparisonColumns, figureIn, plannedUnit, sortRuns, type SortDirection, type SortKey } from "@shared/bench/comparison";
import { formatNumber, metricLabels, unitsForMetric } from "@shared/bench/format";
import { RATIO_UNIT } from "@shared/bench/quantity";
import { isOverRated } from "@shared/bench/runs";
import type { CriterionView, RunView } from "@shared/bench/schemas";
import { VerdictBadge } from "./marks";

/**
 * Candidates side by side: one column per run, one row per figure, each figure in one unit so the
 * runs line up: the unit of the plan's criterion on it, else the bench's usual one, and any unit of its
 * kind the person picks. Any row sorts the columns; runs without that figure stay at the end.
 */
export function ComparisonTable({ runs, bestId, criteria = [] }: { runs: RunView[]; bestId: string | null; criteria?: CriterionView[] }) {
  const [sort, setSort] = useState<{ key: SortKey; direction: SortDirection }>({ key: "number", direction: "ascending" });
  const [picked, setPicked] = useState<Partial<Record<ComparisonKey, string>>>({});
  const unitsOf = (key: ComparisonKey) => {
    const planned = plannedUnit(criteria, key);
    const choices = [...unitsForMetric(key)];
    if (!choices.includes(planned)) choices.unshift(planned);
    return { choices, unit: picked[key] ?? planned };
  };
  // Figures nobody measured would only be a row of dashes.
  const rows = comparisonColumns.filter((column) => runs.some((run) => figureIn(run.evaluation.values[column.key], column.unit) !== null));
  const sorted = sortRuns(runs, sort.key, sort.direction);

  const rowHeader = (key: SortKey, label: string, unitSwitch?: ReactNode) => {
    const active = sort.key === key;
    // Figures start with the largest first; the run number starts at 1.
    const first: SortDirection = key === "number" ? "ascending" : "descending";
    const next: SortDirection = active ? (sort.direction === "ascending" ? "descending" : "ascending") : first;
    return (
      <th scope="row" aria-sort={active ? sort.direction : "none"} className="sticky left-0 z-10 bg-white px-2 py-1.5 text-left font-semibold whitespace-nowrap">
        <button type="button" className="inline-flex items-center gap-1 text-left hover:text-rust-600" onClick={() => setSort({ key, direction: next })} title={`Sort the runs by ${label.toLowerCase()}`}>
          {label}
          <span aria-hidden className="text-xs text-graphite-500">
            {active ? (sort.direction === "ascending" ? "▲" : "▼") : "↕"}
          </span>
        </button>
        {unitSwitch}
      </th>
    );
  };

  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Bench runs side by side; a figure's row heading sorts the runs by it</caption>
        <thead>
          <tr className="border-b-2 border-graphite-900 align-bottom">
            {rowHeader("number", "Run")}
            {sorted.map((run) => (
              <th key={run.id} scope="col" className={`min-w-28 px-2 py-1.5 text-right font-semibold ${run.id === bestId ? "bg-moss-600/10" : ""}`}>
                <span className="block">Run {run.number}</span>
                <span className="block text-xs font-normal text-graphite-700">{run.label}</span>
                {run.id === bestId && <span className="mt-1 inline-block rounded bg-moss-600 px-1.5 py-0.5 text-xs font-semibold text-white">best</span>}
                {isOverRated(run.evaluation) && <span className="mt-1 ml-1 inline-block rounded bg-amber-cut px-1.5 py-0.5 text-xs font-semibold text-graphite-900">over-rated</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          <tr className="border-b border-ply-200">
            {rowHeader("verdict", "Verdict")}
            {sorted.map((run) => (
              <td key={run.id} className={`px-2 py-1.5 text-right ${run.id === bestId ? "bg-moss-600/10" : ""}`}>
                <VerdictBadge verdict={run.evaluation.verdict} />
              </td>
            ))}
          </tr>
          {rows.map((row) => {
            const { choices, unit } = unitsOf(row.key);
            const label = metricLabels[row.key];
            const unitSwitch =
              unit === RATIO_UNIT ? null : (
                <select
                  aria-label={`Unit for ${label.toLowerCase()}`}
                  value={unit}
                  onChange={(event) => setPicked((now) => ({ ...now, [row.key]: event.target.value }))}
                  className="mt-1 block rounded border border-ply-300 bg-white px-1 py-0.5 text-xs font-normal sm:mt-0 sm:ml-2 sm:inline-block"
                >
                  {choices.map((choice) => (
                    <option key={choice} value={choice}>
                      {choice}
                    </option>
                  ))}
                </select>
              );
            return (
            <tr key={row.key} className="border-b border-ply-200">
              {rowHeader(row.key, label, unitSwitch)}
              {sorted.map((run) => {
                const value = figureIn(run.evaluation.values[row.key], unit);
                return (
                  <td key={run.id} className={`px-2 py-1.5 text-right tabular-nums ${run.id === bestId ? "bg-moss-600/10" : ""}`}>
                    {value === null ? <span className="text-graphite-500">–</span> : formatNumber(value)}
                  </td>
                );
              })}
            </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
