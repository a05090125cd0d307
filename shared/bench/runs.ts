import { type Criterion, evaluatePlan } from "./criteria";
import { type Figure, NOT_MEASURED, allUpMass, isQuantity, runFigures, thrustToWeight } from "./figures";
import { checkPackMinimum, checkVoltageRating, lipoPack } from "./packs";
import { type Quantity, UnitError, valueIn } from "./quantity";
import type { RatingFlag, RunEvaluation, RunInput, RunPartView, Supply } from "./schemas";

/** What a plan contributes to judging its runs. */
export interface PlanForRuns {
  airframeMass: Quantity | null;
  criteria: readonly { id: string; criterion: Criterion }[];
}

export interface RunForEvaluation {
  supply: Supply | null;
  measurements: RunInput["measurements"];
  parts: readonly (Pick<RunPartView, "partId" | "name" | "count" | "mass" | "ratedVoltage"> & { powered?: boolean })[];
}

/**
 * The configuration's mass: as weighed when the run records it, otherwise the shelf masses of its
 * parts times their counts. A part never weighed leaves it not measured rather than guessing.
 */
export function configurationMass(measured: Quantity | undefined, parts: RunForEvaluation["parts"]): { mass: Figure; source: RunEvaluation["massSource"] } {
  if (measured) return { mass: measured, source: "measured" };
  if (parts.length === 0 || parts.some((part) => !part.mass)) return { mass: NOT_MEASURED, source: "none" };
  const grams = parts.reduce((sum, part) => sum + valueIn(part.mass!, "g") * part.count, 0);
  return { mass: { value: grams, unit: "g" }, source: "shelf" };
}

/** The highest voltage the parts can see: a pack at full charge, the bench supply's setting, or what was measured. */
export function highestSupplyVoltage(supply: Supply | null, measured: Quantity | undefined): Quantity | null {
  const candidates: Quantity[] = [];
  if (supply?.kind === "lipo") candidates.push(lipoPack(supply.cells).full);
  if (supply?.kind === "bench") candidates.push(supply.voltage);
  if (measured) candidates.push(measured);
  let highest: Quantity | null = null;
  for (const candidate of candidates) {
    if (!highest || valueIn(candidate, "V") > valueIn(highest, "V")) highest = candidate;
  }
  return highest;
}

function ratingFlags(parts: RunForEvaluation["parts"], supplyVoltage: Quantity | null): RatingFlag[] {
  if (!supplyVoltage) return [];
  // A part that takes no power (a frame, a passive fan) has no voltage rating to check.
  return parts.filter((part) => part.powered !== false).map((part) => ({
    partId: part.partId,
    partName: part.name,
    check: checkVoltageRating(supplyVoltage, part.ratedVoltage ?? undefined),
  }));
}

function packDetails(supply: Supply | null, measured: Quantity | undefined): RunEvaluation["pack"] {
  if (supply?.kind !== "lipo") return null;
  const pack = lipoPack(supply.cells);
  return {
    label: pack.label,
    nominal: pack.nominal,
    full: pack.full,
    minimum: pack.minimum,
    caution: pack.caution,
    low: measured ? checkPackMinimum(supply.cells, measured) : null,
  };
}

/** Everything Kerf derives from one run: figures, each criterion's outcome, the verdict and the cautions. */
export function evaluateRun(run: RunForEvaluation, plan: PlanForRuns): RunEvaluation {
  const { mass, source } = configurationMass(run.measurements.mass, run.parts);
  const measurements = { ...run.measurements, mass: isQuantity(mass) ? mass : undefined };
  const craft = plan.airframeMass ? { airframe: plan.airframeMass, partsOnBoard: [isQuantity(mass) ? mass : undefined] } : undefined;
  const figures = runFigures(measurements, craft);
  const values = { ...measurements, ...figures, mass };
  const { verdict, results } = evaluatePlan(
    plan.criteria.map((c) => c.criterion),
    values,
  );
  const supplyVoltage = safely(() => highestSupplyVoltage(run.supply, run.measurements.voltage));
  return {
    values,
    massSource: source,
    allUpMass: craft ? allUpMass(craft.airframe, craft.partsOnBoard) : NOT_MEASURED,
    figures,
    results: results.map((result, index) => ({ criterionId: plan.criteria[index]!.id, required: result.required, outcome: result.outcome })),
    verdict,
    supplyVoltage,
    ratings: ratingFlags(run.parts, supplyVoltage),
    pack: packDetails(run.supply, run.measurements.voltage),
  };
}

/** Stored values passed the schemas, so a unit problem here would be a bug; it degrades to "unknown". */
function safely<T>(work: () => T): T | null {
  try {
    return work();
  } catch (error) {
    if (error instanceof UnitError) return null;
    throw error;
  }
}

export const isOverRated = (evaluation: Pick<RunEvaluation, "ratings">) => evaluation.ratings.some((flag) => flag.check.status === "over_rated");

/** A build iteration's thrust-to-weight: the chosen run's thrust over the mass the log weighed. */
export function iterationThrustToWeight(thrust: Quantity | null | undefined, allUp: Quantity | null): Figure {
  return thrustToWeight(thrust ?? undefined, allUp ?? NOT_MEASURED);
}
