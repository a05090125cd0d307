/**
 * The units the bench measures in, and what each measures: plain lists and checks, kept apart from
 * ./quantity (mathjs and zod), so the pages that only show quantities load neither.
 */

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

export function dimensionOf(unit: string): Dimension | undefined {
  for (const [dimension, units] of Object.entries(unitsByDimension)) {
    if ((units as readonly string[]).includes(unit)) return dimension as Dimension;
  }
  return undefined;
}

export function describeUnit(unit: string): string {
  return unit === RATIO_UNIT ? "a plain ratio (unit 1)" : `in ${unit}`;
}
