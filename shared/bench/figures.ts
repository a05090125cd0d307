import { z } from "zod";
import {
  type Quantity,
  RATIO_UNIT,
  UnitError,
  quantityOfSchema,
  valueIn,
} from "./quantity";
import { type Figure, type FigureName, NOT_MEASURED, isQuantity } from "./metrics";

export {
  type Figure,
  type FigureName,
  type FigureProblem,
  type MeasurementSymbol,
  type NotMeasured,
  NOT_MEASURED,
  figureNames,
  isFigureProblem,
  isQuantity,
  measurementDimensions,
  measurementSymbols,
} from "./metrics";

/** Standard acceleration of gravity in m/s², exact (3rd CGPM, 1901; NIST SP 811 (2008), Appendix B.8). */
export const STANDARD_GRAVITY = 9.80665;

/** What one bench run measured; `mass` is the mass of the part under test. */
export const runMeasurementsSchema = z.object({
  mass: quantityOfSchema("mass", "mass").optional(),
  voltage: quantityOfSchema("voltage", "voltage").optional(),
  current: quantityOfSchema("current", "current").optional(),
  thrust: quantityOfSchema("force", "thrust").optional(),
  speed: quantityOfSchema("speed", "speed").optional(),
  run_time: quantityOfSchema("time", "run time").optional(),
});
export type RunMeasurements = z.infer<typeof runMeasurementsSchema>;

function computed(work: () => Figure): Figure {
  try {
    return work();
  } catch (error) {
    if (error instanceof UnitError) return { error: error.code, message: error.message };
    throw error;
  }
}

/** A quotient, or a problem when the divisor is zero (or so near it that the result overflows). */
function quotient(figure: string, divisorLabel: string, numerator: number, divisor: number, unit: string): Figure {
  const value = numerator / divisor;
  if (Number.isFinite(value)) return { value, unit };
  return { error: "zero_divisor", message: `${figure} has no value when ${divisorLabel} is zero` };
}

/** For direct current P = V × I (BIPM SI Brochure, 9th ed., section 2.3.4, Table 4: W = J/s, V = W/A). */
export function electricalPower(voltage: Quantity | undefined, current: Quantity | undefined): Figure {
  if (!voltage || !current) return NOT_MEASURED;
  return computed(() => ({ value: valueIn(voltage, "V") * valueIn(current, "A"), unit: "W" }));
}

export function powerPerGram(power: Figure, partMass: Quantity | undefined): Figure {
  if (!isQuantity(power)) return power;
  if (!partMass) return NOT_MEASURED;
  return computed(() =>
    quotient("power per gram", "the part's mass", valueIn(power, "W"), valueIn(partMass, "g"), "W/g"),
  );
}

export function thrustPerWatt(thrust: Quantity | undefined, power: Figure): Figure {
  if (!thrust) return NOT_MEASURED;
  if (!isQuantity(power)) return power;
  return computed(() => quotient("thrust per watt", "the power", valueIn(thrust, "gf"), valueIn(power, "W"), "gf/W"));
}

/** All-up mass: the airframe plus every part on board; an unweighed part leaves it not measured. */
export function allUpMass(airframe: Quantity | undefined, partsOnBoard: readonly (Quantity | undefined)[]): Figure {
  if (!airframe || partsOnBoard.some((part) => !part)) return NOT_MEASURED;
  return computed(() => {
    const grams = [airframe, ...partsOnBoard].reduce((sum, part) => sum + (part ? valueIn(part, "g") : 0), 0);
    return { value: grams, unit: "g" };
  });
}

/**
 * Thrust over weight, where weight = all-up mass × g_n. With thrust in gf and mass in g the
 * g_n cancels, so 2000 gf lifting 1000 g is 2 whatever the unit each was written in.
 */
export function thrustToWeight(thrust: Quantity | undefined, craftMass: Figure): Figure {
  if (!thrust) return NOT_MEASURED;
  if (!isQuantity(craftMass)) return craftMass;
  return computed(() => {
    const weightNewtons = valueIn(craftMass, "kg") * STANDARD_GRAVITY;
    return quotient("thrust-to-weight", "the all-up mass", valueIn(thrust, "N"), weightNewtons, RATIO_UNIT);
  });
}

export type CraftMasses = { airframe?: Quantity; partsOnBoard: readonly (Quantity | undefined)[] };

export function runFigures(measurements: RunMeasurements, craft?: CraftMasses): Record<FigureName, Figure> {
  const power = electricalPower(measurements.voltage, measurements.current);
  const craftMass = craft ? allUpMass(craft.airframe, craft.partsOnBoard) : NOT_MEASURED;
  return {
    electrical_power: power,
    power_per_gram: powerPerGram(power, measurements.mass),
    thrust_per_watt: thrustPerWatt(measurements.thrust, power),
    thrust_to_weight: thrustToWeight(measurements.thrust, craftMass),
  };
}
