import type { Criterion } from "./criteria";
import { comparatorWords, describeCriterion, formatQuantity, metricLabels } from "./format";
import { type Figure, isFigureProblem, isQuantity } from "./metrics";
import { UnitError, valueIn } from "./quantity";

function measuredIn(figure: Figure | undefined, unit: string): string | null {
  if (!isQuantity(figure)) return null;
  try {
    return formatQuantity({ value: valueIn(figure, unit), unit });
  } catch (error) {
    if (error instanceof UnitError) return null;
    throw error;
  }
}

/**
 * A criterion as the bench reads it: the measured value beside the bound, both in the criterion's
 * unit ("Thrust 3.92 N ≥ 3.5 N"). Without a reading in a compatible unit it says what was needed.
 */
export function readCriterion(criterion: Criterion, figure: Figure | undefined): string {
  const metric = metricLabels[criterion.metric];
  const unit = criterion.comparator === "between" ? criterion.low.unit : criterion.threshold.unit;
  const measured = measuredIn(figure, unit);
  if (measured === null) {
    const why = isFigureProblem(figure) ? figure.message : "not measured";
    return `${metric}: ${why} (needs ${describeCriterion(criterion).slice(metric.length + 1)})`;
  }
  switch (criterion.comparator) {
    case "gte":
    case "lte":
      return `${metric} ${measured} ${comparatorWords[criterion.comparator]} ${formatQuantity(criterion.threshold)}`;
    case "eq":
      return `${metric} ${measured} = ${formatQuantity(criterion.threshold)} ± ${formatQuantity(criterion.tolerance)}`;
    case "between":
      return `${metric} ${formatQuantity(criterion.low)} ≤ ${measured} ≤ ${formatQuantity(criterion.high)}`;
  }
}
