import type { Criterion, CriterionOutcome, PlanVerdict } from "./criteria";
import { type Figure, type MetricName, isFigureProblem, isQuantity, measurementLabels } from "./metrics";
import type { Quantity } from "./quantity";
import { RATIO_UNIT, unitsByDimension } from "./units";

// Words and numbers for the interface, without zod or mathjs: the test plan sheet shows them on its first
// paint. A criterion read against a run's figure converts units (mathjs): ./read-criterion.

/** Words for the interface and the CSV; the stored keys stay stable. */
export const metricLabels: Record<MetricName, string> = {
  ...measurementLabels,
  electrical_power: "Electrical power",
  power_per_gram: "Power per gram",
  thrust_per_watt: "Thrust per watt",
  thrust_to_weight: "Thrust-to-weight",
};

export const verdictLabels: Record<PlanVerdict, string> = { pass: "Meets the plan", fail: "Misses the plan", incomplete: "Not decided yet" };

/** A number without float noise (11.100000000000001 → 11.1); twelve significant figures are far beyond any bench reading. */
export function preciseNumber(value: number): string {
  return String(Number(value.toPrecision(12)));
}

/**
 * A readable number: about three significant figures, enough for a bench scale or meter, and
 * never the float noise of 11.100000000000001.
 */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  if (abs === 0) return "0";
  const decimals = abs >= 1000 ? 0 : abs >= 100 ? 1 : abs >= 1 ? 2 : null;
  const rounded = decimals === null ? Number(value.toPrecision(3)) : Number(value.toFixed(decimals));
  return String(rounded);
}

export function formatQuantity(quantity: Quantity): string {
  const number = formatNumber(quantity.value);
  return quantity.unit === RATIO_UNIT ? number : `${number} ${quantity.unit}`;
}

export function formatFigure(figure: Figure | undefined): string {
  if (figure === undefined || figure === "not_measured") return "not measured";
  if (isFigureProblem(figure)) return figure.message;
  if (isQuantity(figure)) return formatQuantity(figure);
  return "not measured";
}

export const comparatorWords = { gte: "≥", lte: "≤" } as const;

export function describeCriterion(criterion: Criterion): string {
  const metric = metricLabels[criterion.metric];
  switch (criterion.comparator) {
    case "gte":
    case "lte":
      return `${metric} ${comparatorWords[criterion.comparator]} ${formatQuantity(criterion.threshold)}`;
    case "eq":
      return `${metric} = ${formatQuantity(criterion.threshold)} ± ${formatQuantity(criterion.tolerance)}`;
    case "between":
      return `${metric} between ${formatQuantity(criterion.low)} and ${formatQuantity(criterion.high)}`;
  }
}

export function outcomeLabel(outcome: CriterionOutcome): string {
  if (outcome === "pass") return "pass";
  if (outcome === "fail") return "fail";
  if (outcome === "not_measured") return "not measured";
  return `error: ${outcome.message}`;
}

/** Units a criterion on this metric can be written in, natural one first: suggestions for the form. */
export function unitsForMetric(metric: MetricName): readonly string[] {
  return metricUnitChoices[metric];
}

const metricUnitChoices: Record<MetricName, readonly string[]> = {
  mass: unitsByDimension.mass,
  voltage: unitsByDimension.voltage,
  current: unitsByDimension.current,
  thrust: unitsByDimension.force,
  speed: unitsByDimension.speed,
  run_time: unitsByDimension.time,
  electrical_power: ["W"],
  power_per_gram: ["W/g", "W/kg", "W/oz"],
  thrust_per_watt: ["gf/W", "kgf/W", "N/W"],
  thrust_to_weight: [RATIO_UNIT],
};
