import { scaleLinear } from "d3-scale";

/**
 * A chart axis from zero (masses, powers and ratios on the bench never go below it) to a round value
 * at or above the largest figure, ticked at 1, 2 or 5 times a power of ten: d3-scale's linear scale,
 * made "nice" for about five ticks. With nothing to show it still runs from 0 to 1.
 */
export function axisFrom(largest: number, range: [number, number]) {
  return scaleLinear()
    .domain([0, largest > 0 && Number.isFinite(largest) ? largest : 1])
    .range(range)
    .nice(5);
}
