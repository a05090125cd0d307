import { type FactoryFunctionMap, type MathJsInstance, create, createUnitDependencies, unitDependencies } from "mathjs";
import { z } from "zod";

let math: MathJsInstance | undefined;

/**
 * A private mathjs instance, so the units defined here never leak into anyone else's mathjs. Made on
 * the first conversion, not on import: building its typed functions is a long task on a slow phone,
 * and most pages that import these schemas never convert. The cast: mathjs types its dependency maps
 * as a Record, which noUncheckedIndexedAccess reads as possibly undefined; both exist at run time.
 */
function benchMath(): MathJsInstance {
  if (math) return math;
  math = create({ unitDependencies, createUnitDependencies } as FactoryFunctionMap);
  // Gram-force is not built into mathjs (kilogram-force is). 1 gf = g_n × 1 g with
  // g_n = 9.80665 m/s² exact (3rd CGPM, 1901; NIST SP 811 (2008), Appendix B.8).
  math.createUnit("gf", { definition: "0.00980665 N" });
  return math;
}

/** The units a bench measurement may be written in, grouped by what they measure. */
export const unitsByDimension = {
  mass: ["g", "kg", "oz", "lb"],
  voltage: ["V", "mV"],
  current: ["A", "mA"],
  power: ["W"],
  force: ["gf", "kgf", "N"],
  time: ["s", "min"],
  speed: ["m/s"],
} as const;

export type Dimension = keyof typeof unitsByDimension;
export type SimpleUnit = (typeof unitsByDimension)[Dimension][number];

export const simpleUnits: readonly string[] = Object.values(unitsByDimension).flat();

/** The unit of a plain ratio such as thrust-to-weight (the SI Brochure's "unit one"). */
export const RATIO_UNIT = "1";

export type UnitErrorCode = "unknown_unit" | "incompatible_units";

/** Thrown by conversions; catch it with `instanceof UnitError` and show `message`. */
export class UnitError extends Error {
  readonly code: UnitErrorCode;

  constructor(code: UnitErrorCode, message: string) {
    super(message);
    this.name = "UnitError";
    this.code = code;
  }
}

/** A unit problem as plain data, for results the UI shows rather than throws. */
export type UnitProblem = { error: UnitErrorCode; message: string };

export function toUnitProblem(error: UnitError): UnitProblem {
  return { error: error.code, message: error.message };
}

/**
 * A unit Kerf accepts: one of the simple units, a quotient of two of them ("gf/W", "W/g"),
 * or "1" for a plain ratio. Anything else mathjs knows (ft, hp, kV…) is refused on purpose,
 * so every figure stays in units the bench actually uses.
 */
export function isKnownUnit(unit: string): boolean {
  if (unit === RATIO_UNIT || simpleUnits.includes(unit)) return true;
  const parts = unit.split("/");
  return parts.length === 2 && parts.every((part) => part !== "m/s" && simpleUnits.includes(part));
}

export const unitSchema = z.string().refine(isKnownUnit, {
  message: `Use one of ${simpleUnits.join(", ")}, a quotient of two of them (such as gf/W), or 1 for a ratio`,
});

export const quantitySchema = z.strictObject({
  value: z.number().finite(),
  unit: unitSchema,
});
export type Quantity = z.infer<typeof quantitySchema>;

/** A quantity schema that also insists on the dimension, e.g. thrust must be a force. */
export function quantityOfSchema(dimension: Dimension, label: string) {
  return quantitySchema.refine((q) => dimensionOf(q.unit) === dimension, {
    message: `${label} must be in ${unitsByDimension[dimension].join(", ")}`,
  });
}

export function dimensionOf(unit: string): Dimension | undefined {
  for (const [dimension, units] of Object.entries(unitsByDimension)) {
    if ((units as readonly string[]).includes(unit)) return dimension as Dimension;
  }
  return undefined;
}

export function describeUnit(unit: string): string {
  return unit === RATIO_UNIT ? "a plain ratio (unit 1)" : `in ${unit}`;
}

function assertKnownUnit(unit: string): void {
  if (!isKnownUnit(unit)) {
    throw new UnitError("unknown_unit", `"${unit}" is not a unit Kerf measures in (use ${simpleUnits.join(", ")})`);
  }
}

export function areCompatible(a: string, b: string): boolean {
  assertKnownUnit(a);
  assertKnownUnit(b);
  if (a === RATIO_UNIT || b === RATIO_UNIT) return a === b;
  return benchMath().unit(1, a).equalBase(benchMath().unit(1, b));
}

/** Converts a quantity to another unit; throws UnitError for unknown or incompatible units. */
export function convertQuantity(quantity: Quantity, toUnit: string): Quantity {
  if (!areCompatible(quantity.unit, toUnit)) {
    throw new UnitError("incompatible_units", `cannot convert ${quantity.unit} to ${toUnit}`);
  }
  // Skipping mathjs on an identity keeps 2000 gf from coming back as 1999.9999999999998 gf.
  if (quantity.unit === toUnit) return { ...quantity };
  return { value: benchMath().unit(quantity.value, quantity.unit).toNumber(toUnit), unit: toUnit };
}

export function valueIn(quantity: Quantity, unit: string): number {
  return convertQuantity(quantity, unit).value;
}
