import type { Criterion, MetricName, PlanVerdict } from "./criteria";
import { type Figure, isQuantity } from "./figures";
import { metricLabels, preciseNumber } from "./format";
import { lipoPack } from "./packs";
import { RATIO_UNIT, UnitError, valueIn } from "./quantity";
import type { RunEvaluation, Supply } from "./schemas";

/** The figures the comparison table and the CSV show, each in one unit so runs line up. */
export const comparisonColumns = [
  { key: "mass", unit: "g" },
  { key: "voltage", unit: "V" },
  { key: "current", unit: "A" },
  { key: "electrical_power", unit: "W" },
  { key: "thrust", unit: "gf" },
  { key: "thrust_per_watt", unit: "gf/W" },
  { key: "power_per_gram", unit: "W/g" },
  { key: "thrust_to_weight", unit: RATIO_UNIT },
  { key: "run_time", unit: "s" },
  { key: "speed", unit: "m/s" },
] as const satisfies readonly { key: MetricName; unit: string }[];

export type ComparisonKey = (typeof comparisonColumns)[number]["key"];
export type SortKey = "number" | "label" | "verdict" | ComparisonKey;
export type SortDirection = "ascending" | "descending";

export const columnUnit = (key: ComparisonKey) => comparisonColumns.find((column) => column.key === key)!.unit;

export const columnHeading = (key: ComparisonKey) => {
  const unit = columnUnit(key);
  return unit === RATIO_UNIT ? metricLabels[key] : `${metricLabels[key]} (${unit})`;
};

/**
 * The unit a comparison shows a figure in before anyone picks another: the unit of the plan's
 * criterion on it, so the figure reads against its threshold, else the bench's usual one.
 */
export function plannedUnit(criteria: readonly Criterion[], key: ComparisonKey): string {
  const planned = criteria.find((criterion) => criterion.metric === key);
  if (!planned) return columnUnit(key);
  return planned.comparator === "between" ? planned.low.unit : planned.threshold.unit;
}

/** A figure as a plain number in `unit`; null when it was not measured, could not be computed, or is in another kind of unit. */
export function figureIn(figure: Figure | undefined, unit: string): number | null {
  if (!isQuantity(figure)) return null;
  try {
    return valueIn(figure, unit);
  } catch (error) {
    if (error instanceof UnitError) return null;
    throw error;
  }
}

export interface Comparable {
  id: string;
  number: number;
  label: string;
  evaluation: Pick<RunEvaluation, "values" | "verdict">;
}

const verdictRank: Record<PlanVerdict, number> = { fail: 0, incomplete: 1, pass: 2 };

/** Sorted copy; runs without a value in the sorted column always go last, whichever the direction. */
export function sortRuns<T extends Comparable>(runs: readonly T[], key: SortKey, direction: SortDirection): T[] {
  const sign = direction === "ascending" ? 1 : -1;
  const valueOf = (run: T): number | string | null => {
    if (key === "number") return run.number;
    if (key === "label") return run.label.toLocaleLowerCase();
    if (key === "verdict") return verdictRank[run.evaluation.verdict];
    return figureIn(run.evaluation.values[key], columnUnit(key));
  };
  return [...runs].sort((a, b) => {
    const x = valueOf(a);
    const y = valueOf(b);
    if (x === null && y === null) return a.number - b.number;
    if (x === null) return 1;
    if (y === null) return -1;
    if (x < y) return -sign;
    if (x > y) return sign;
    return a.number - b.number;
  });
}

/**
 * The candidate to pick: of the runs that meet the plan, the one with the most thrust per watt,
 * the lighter one on a tie. None when no run meets the plan yet.
 */
export function bestRun<T extends Comparable>(runs: readonly T[]): T | null {
  let best: { run: T; tpw: number; grams: number } | null = null;
  for (const run of runs) {
    if (run.evaluation.verdict !== "pass") continue;
    const tpw = figureIn(run.evaluation.values.thrust_per_watt, "gf/W") ?? Number.NEGATIVE_INFINITY;
    const grams = figureIn(run.evaluation.values.mass, "g") ?? Number.POSITIVE_INFINITY;
    if (!best || tpw > best.tpw || (tpw === best.tpw && grams < best.grams)) best = { run, tpw, grams };
  }
  return best?.run ?? null;
}

export function describeSupply(supply: Supply | null): string {
  if (!supply) return "";
  if (supply.kind === "bench") return `bench supply ${preciseNumber(valueIn(supply.voltage, "V"))} V`;
  const pack = lipoPack(supply.cells);
  return `${pack.label} LiPo (${pack.nominal.value} V nominal, ${pack.full.value} V full)`;
}
