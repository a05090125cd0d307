import { z } from "zod";
import { type Quantity, UnitError, valueIn } from "./quantity";

// Lithium-polymer cell voltages are common practice (retailer and maker guides; no standard
// text): 3.7 V nominal, 4.2 V full, about 3.0 V minimum under protection. Some makers state
// 3.6 V or 3.8 V nominal, and high-voltage cells charge to 4.35 V (from memory); a part's
// own datasheet wins over these.
export const LIPO_NOMINAL_VOLTS_PER_CELL = 3.7;
export const LIPO_FULL_VOLTS_PER_CELL = 4.2;
export const LIPO_MINIMUM_VOLTS_PER_CELL = 3.0;

export const MAX_CELLS = 14;

export const cellCountSchema = z.number().int().min(1).max(MAX_CELLS, { message: `Kerf knows packs of 1 to ${MAX_CELLS} cells` });

export const LIPO_CAUTION =
  "Lithium-polymer packs can burn when damaged, over-charged or run flat. Charge with a LiPo " +
  "charger set to the pack's cell count, on a fire-safe surface, never unattended, and follow the " +
  "maker's ratings and your local rules.";

export type LipoPack = {
  cells: number;
  /** "3S": n cells in series. */
  label: string;
  nominal: Quantity;
  full: Quantity;
  minimum: Quantity;
  caution: string;
};

/** Rounds away the float noise of 3 × 3.7 = 11.100000000000001; millivolts are plenty. */
const volts = (value: number): Quantity => ({ value: Math.round(value * 1000) / 1000, unit: "V" });

export function lipoPack(cells: number): LipoPack {
  const parsed = cellCountSchema.safeParse(cells);
  if (!parsed.success) throw new RangeError(`A LiPo pack has 1 to ${MAX_CELLS} cells in series, not ${cells}`);
  return {
    cells,
    label: `${cells}S`,
    nominal: volts(cells * LIPO_NOMINAL_VOLTS_PER_CELL),
    full: volts(cells * LIPO_FULL_VOLTS_PER_CELL),
    minimum: volts(cells * LIPO_MINIMUM_VOLTS_PER_CELL),
    caution: LIPO_CAUTION,
  };
}

/** Reads a pack label such as "3S" or "6s"; undefined when it is not one. */
export function cellsFromLabel(label: string): number | undefined {
  const match = /^\s*(\d{1,2})\s*[sS]\s*$/.exec(label);
  const cells = match ? Number(match[1]) : Number.NaN;
  return cellCountSchema.safeParse(cells).success ? cells : undefined;
}

export type RatingCheck =
  | { status: "within_rating" }
  | { status: "over_rated"; overBy: Quantity; caution: string }
  | { status: "no_rating"; caution: string }
  | { status: "unit_problem"; message: string };

/** Flags a supply voltage above the part's rated voltage, with a caution the UI can show. */
export function checkVoltageRating(supply: Quantity, rated: Quantity | undefined): RatingCheck {
  if (!rated) {
    return {
      status: "no_rating",
      caution: "No rated voltage is recorded for this part: check the maker's rating before powering it.",
    };
  }
  try {
    const supplyVolts = valueIn(supply, "V");
    const ratedVolts = valueIn(rated, "V");
    if (supplyVolts <= ratedVolts) return { status: "within_rating" };
    return {
      status: "over_rated",
      overBy: volts(supplyVolts - ratedVolts),
      caution:
        `The supply of ${formatVolts(supplyVolts)} is above the part's rated ${formatVolts(ratedVolts)}. ` +
        "Running past a rating can overheat the part, damage the pack or start a fire. Keep to the " +
        "manufacturer's ratings, local codes and licensed practice; note the risk on the run if you go ahead.",
    };
  } catch (error) {
    if (error instanceof UnitError) return { status: "unit_problem", message: error.message };
    throw error;
  }
}

/** Judges a pack at full charge, since a fresh pack sits well above its nominal voltage. */
export function checkPackRating(cells: number, rated: Quantity | undefined): RatingCheck {
  return checkVoltageRating(lipoPack(cells).full, rated);
}

export type LowVoltageCheck =
  | { status: "above_minimum" }
  | { status: "below_minimum"; caution: string }
  | { status: "unit_problem"; message: string };

/** Flags a measured pack voltage under about 3.0 V per cell (common practice, see above). */
export function checkPackMinimum(cells: number, measured: Quantity): LowVoltageCheck {
  const pack = lipoPack(cells);
  let measuredVolts: number;
  try {
    measuredVolts = valueIn(measured, "V");
  } catch (error) {
    if (error instanceof UnitError) return { status: "unit_problem", message: error.message };
    throw error;
  }
  if (measuredVolts >= pack.minimum.value) return { status: "above_minimum" };
  return {
    status: "below_minimum",
    caution:
      `${formatVolts(measuredVolts)} is below about ${formatVolts(pack.minimum.value)} for a ${pack.label} pack ` +
      `(${LIPO_MINIMUM_VOLTS_PER_CELL} V a cell). A pack run this low can be damaged and unsafe to charge; ` +
      "follow the maker's guidance.",
  };
}

const formatVolts = (value: number) => `${Math.round(value * 100) / 100} V`;
