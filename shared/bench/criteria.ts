import { z } from "zod";
import { oneLine } from "../fields/text";
import { metricLabels } from "./format";
import { type CraftMasses, type RunMeasurements, runFigures } from "./figures";
import { type Figure, type FigureProblem, type MetricName, type NotMeasured, NOT_MEASURED, isFigureProblem, isQuantity, metricNames, metricUnit } from "./metrics";
import { type Quantity, areCompatible, describeUnit, isKnownUnit, quantitySchema, valueIn } from "./quantity";

export { type MetricName, metricNames, metricUnit } from "./metrics";

const criterionBase = {
  metric: z.enum(metricNames),
  required: z.boolean(),
  note: oneLine(500).optional(),
};

const compatibleWith = (a: string, b: string) => isKnownUnit(a) && isKnownUnit(b) && areCompatible(a, b);

export const criterionSchema = z
  // Strict: a request carrying a field Kerf doesn't know is refused rather than silently trimmed.
  .discriminatedUnion("comparator", [
    z.strictObject({ ...criterionBase, comparator: z.literal("gte"), threshold: quantitySchema }),
    z.strictObject({ ...criterionBase, comparator: z.literal("lte"), threshold: quantitySchema }),
    z.strictObject({
      ...criterionBase,
      comparator: z.literal("eq"),
      threshold: quantitySchema,
      tolerance: quantitySchema.refine((q) => q.value >= 0, { message: "tolerance cannot be negative" }),
    }),
    z.strictObject({ ...criterionBase, comparator: z.literal("between"), low: quantitySchema, high: quantitySchema }),
  ])
  .superRefine((criterion, ctx) => {
    const naturalUnit = metricUnit(criterion.metric);
    for (const [field, bound] of Object.entries(bounds(criterion))) {
      // An unknown unit already has its own issue from quantitySchema.
      if (isKnownUnit(bound.unit) && !compatibleWith(bound.unit, naturalUnit)) {
        const message = mismatch(field, bound.unit, criterion.metric, naturalUnit);
        ctx.addIssue({ code: "custom", path: [field, "unit"], message });
      }
    }
    if (criterion.comparator === "between" && compatibleWith(criterion.low.unit, criterion.high.unit)) {
      if (valueIn(criterion.low, criterion.high.unit) > criterion.high.value) {
        ctx.addIssue({ code: "custom", path: ["high"], message: "the high bound is below the low bound" });
      }
    }
  });
export type Criterion = z.infer<typeof criterionSchema>;

export type CriterionOutcome = "pass" | "fail" | NotMeasured | FigureProblem;

/** The measured values and derived figures a plan's criteria are judged against. */
export type MetricValues = Partial<Record<MetricName, Figure>>;

export function runMetricValues(measurements: RunMeasurements, craft?: CraftMasses): MetricValues {
  return { ...measurements, ...runFigures(measurements, craft) };
}

function bounds(criterion: Criterion): Record<string, Quantity> {
  switch (criterion.comparator) {
    case "gte":
    case "lte":
      return { threshold: criterion.threshold };
    case "eq":
      return { threshold: criterion.threshold, tolerance: criterion.tolerance };
    case "between":
      return { low: criterion.low, high: criterion.high };
  }
}

function mismatch(field: string, boundUnit: string, metric: MetricName, measuredUnit: string) {
  const figure = metricLabels[metric].toLowerCase();
  const bound = field === "low" || field === "high" ? `${field} bound` : field;
  return `The ${bound} is ${describeUnit(boundUnit)} but ${figure} is ${describeUnit(measuredUnit)}`;
}

// A value converted between units in binary floating point can land a hair off the exact
// amount, so 8 oz written as grams must still meet "at most 8 oz". A relative 1e-9 is far
// finer than any bench instrument reads (common practice for comparing floating-point numbers).
const closeEnough = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

export function evaluateCriterion(criterion: Criterion, values: MetricValues): CriterionOutcome {
  const measured = values[criterion.metric];
  if (measured === undefined || measured === NOT_MEASURED) return NOT_MEASURED;
  if (isFigureProblem(measured)) return measured;
  if (!isQuantity(measured)) return NOT_MEASURED;

  const inBoundUnits: Record<string, number> = {};
  for (const [field, bound] of Object.entries(bounds(criterion))) {
    if (!compatibleWith(bound.unit, measured.unit)) {
      return { error: "incompatible_units", message: mismatch(field, bound.unit, criterion.metric, measured.unit) };
    }
    inBoundUnits[field] = valueIn(measured, bound.unit);
  }
  return compare(criterion, inBoundUnits) ? "pass" : "fail";
}

function compare(criterion: Criterion, measuredIn: Record<string, number>): boolean {
  const atLeast = (field: string, bound: number) => {
    const v = measuredIn[field] ?? Number.NaN;
    return v > bound || closeEnough(v, bound);
  };
  const atMost = (field: string, bound: number) => {
    const v = measuredIn[field] ?? Number.NaN;
    return v < bound || closeEnough(v, bound);
  };
  switch (criterion.comparator) {
    case "gte":
      return atLeast("threshold", criterion.threshold.value);
    case "lte":
      return atMost("threshold", criterion.threshold.value);
    case "eq": {
      const { value } = criterion.threshold;
      const tolerance = valueIn(criterion.tolerance, criterion.threshold.unit);
      return atLeast("threshold", value - tolerance) && atMost("threshold", value + tolerance);
    }
    case "between":
      return atLeast("low", criterion.low.value) && atMost("high", criterion.high.value);
  }
}

export type PlanVerdict = "pass" | "fail" | "incomplete";

/**
 * Pass only when every required criterion passes; fail when any required one fails; otherwise
 * incomplete. A plan with no required criterion is incomplete: nothing in it decides the question.
 */
export function planVerdict(results: readonly { required: boolean; outcome: CriterionOutcome }[]): PlanVerdict {
  const required = results.filter((result) => result.required);
  if (required.some((result) => result.outcome === "fail")) return "fail";
  if (required.length > 0 && required.every((result) => result.outcome === "pass")) return "pass";
  return "incomplete";
}

export function evaluatePlan(criteria: readonly Criterion[], values: MetricValues) {
  const results = criteria.map((criterion) => ({
    criterion,
    required: criterion.required,
    outcome: evaluateCriterion(criterion, values),
  }));
  return { verdict: planVerdict(results), results };
}
