import { type FactoryFunctionMap, type MathJsInstance, create, createUnitDependencies, unitDependencies } from "mathjs";
import { z } from "zod";
import { type Dimension, RATIO_UNIT, dimensionOf, isKnownUnit, simpleUnits, unitsByDimension } from "./units";

export { type Dimension, type SimpleUnit, RATIO_UNIT, describeUnit, dimensionOf, isKnownUnit, simpleUnits, unitsByDimension } from "./units";

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
