import type { Quantity, UnitErrorCode } from "./quantity";
import { type Dimension, RATIO_UNIT, unitsByDimension } from "./units";

/**
 * What the bench measures and derives, their units and words, and the shapes of a figure: kept apart
 * from ./figures, ./criteria and ./schemas (zod, mathjs), so the pages that only show them load neither.
 */

export const measurementSymbols = ["mass", "voltage", "current", "thrust", "speed", "run_time"] as const;
export type MeasurementSymbol = (typeof measurementSymbols)[number];

export const measurementDimensions: Record<MeasurementSymbol, Dimension> = {
  mass: "mass",
  voltage: "voltage",
  current: "current",
  thrust: "force",
  speed: "speed",
  run_time: "time",
};

export const figureNames = ["electrical_power", "power_per_gram", "thrust_per_watt", "thrust_to_weight"] as const;
export type FigureName = (typeof figureNames)[number];

export const NOT_MEASURED = "not_measured";
export type NotMeasured = typeof NOT_MEASURED;

export type FigureProblem = { error: UnitErrorCode | "zero_divisor"; message: string };

/** A derived figure: a quantity, "not measured" when an input is missing, or a problem to show. */
export type Figure = Quantity | NotMeasured | FigureProblem;

export function isQuantity(figure: Figure | undefined): figure is Quantity {
  return typeof figure === "object" && "value" in figure;
}

export function isFigureProblem(figure: Figure | undefined): figure is FigureProblem {
  return typeof figure === "object" && "error" in figure;
}

export const metricNames = [...measurementSymbols, ...figureNames] as const;
export type MetricName = MeasurementSymbol | FigureName;

const figureUnits: Record<FigureName, string> = {
  electrical_power: "W",
  power_per_gram: "W/g",
  thrust_per_watt: "gf/W",
  thrust_to_weight: RATIO_UNIT,
};

/** The unit a metric is naturally read in; a threshold must be convertible to it. */
export function metricUnit(metric: MetricName): string {
  if (metric in figureUnits) return figureUnits[metric as FigureName];
  return unitsByDimension[measurementDimensions[metric as MeasurementSymbol]][0];
}

export const measurementLabels: Record<(typeof measurementSymbols)[number], string> = {
  mass: "Mass",
  voltage: "Voltage",
  current: "Current",
  thrust: "Thrust",
  speed: "Speed",
  run_time: "Run time",
};
