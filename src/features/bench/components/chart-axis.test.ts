import { describe, expect, it } from "vitest";
import { axisFrom } from "./chart-axis";

// d3-scale's linear scale (d3/d3-scale, README: "continuous.nice" and "continuous.ticks") picks steps
// of 1, 2 or 5 times a power of ten; these check how the chart uses it.
describe("a chart axis", () => {
  it("starts at zero and ends on a round value at or above the largest figure", () => {
    const axis = axisFrom(37.2, [70, 612]);
    expect(axis.domain()).toEqual([0, 40]);
    expect(axis.ticks(5)).toEqual([0, 10, 20, 30, 40]);
    expect(axis(0)).toBe(70);
    expect(axis(40)).toBe(612);
  });

  it("runs up the screen when the range is given top last", () => {
    const axis = axisFrom(456, [322, 24]);
    expect(axis.domain()).toEqual([0, 500]);
    expect(axis(0)).toBe(322);
    expect(axis(500)).toBe(24);
  });

  it("still gives an axis from 0 to 1 when there is nothing to show", () => {
    expect(axisFrom(0, [0, 100]).domain()).toEqual([0, 1]);
    expect(axisFrom(Number.NaN, [0, 100]).domain()).toEqual([0, 1]);
  });

  it("ticks every value it is given at 1, 2 or 5 times a power of ten, covering the largest", () => {
    for (const largest of [0.07, 0.9, 1.51, 9.3, 12, 99.9, 100, 456, 2750, 61_000]) {
      const ticks = axisFrom(largest, [0, 1]).ticks(5);
      const step = ticks[1]! - ticks[0]!;
      const mantissa = Number((step / 10 ** Math.floor(Math.log10(step))).toPrecision(6));
      expect([1, 2, 5]).toContain(mantissa);
      expect(ticks.at(-1)!).toBeGreaterThanOrEqual(largest);
    }
  });
});
