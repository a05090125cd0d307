import { safeText, toCsv } from "../csv/csv";
import type { PlanVerdict } from "./criteria";
import { columnHeading, comparisonColumns, describeSupply, figureIn } from "./comparison";
import { describeCriterion, outcomeLabel, preciseNumber } from "./format";
import { valueIn } from "./quantity";
import { isOverRated } from "./runs";
import type { CriterionView, RunView } from "./schemas";

const verdictWords: Record<PlanVerdict, string> = { pass: "pass", fail: "fail", incomplete: "incomplete" };

/** Every run of an episode as CSV (RFC 4180), one row per run, figures in the column's unit. */
export function runsCsv(runs: readonly RunView[], criteria: readonly CriterionView[]): string {
  const header = [
    "run",
    "configuration",
    "parts",
    "supply",
    ...comparisonColumns.map((column) => columnHeading(column.key)),
    "highest supply voltage (V)",
    "over-rated",
    ...criteria.map((c, index) => `criterion ${index + 1}: ${describeCriterion(c)}${c.required ? " (required)" : " (informative)"}`),
    "verdict",
    "notes",
  ];
  const rows = runs.map((run) => {
    const outcomes = new Map(run.evaluation.results.map((result) => [result.criterionId, result.outcome]));
    const supplyVolts = run.evaluation.supplyVoltage ? preciseNumber(valueIn(run.evaluation.supplyVoltage, "V")) : "";
    return [
      String(run.number),
      safeText(run.label),
      safeText(run.parts.map((part) => `${part.count} × ${part.name}`).join("; ")),
      describeSupply(run.supply),
      ...comparisonColumns.map((column) => {
        const value = figureIn(run.evaluation.values[column.key], column.unit);
        return value === null ? "" : preciseNumber(value);
      }),
      supplyVolts,
      isOverRated(run.evaluation) ? "yes" : "no",
      ...criteria.map((c) => {
        const outcome = outcomes.get(c.id);
        return outcome ? outcomeLabel(outcome) : "";
      }),
      verdictWords[run.evaluation.verdict],
      safeText(run.notes),
    ];
  });
  return toCsv([header, ...rows]);
}
