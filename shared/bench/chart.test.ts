import { describe, expect, it } from "vitest";
import { niceTicks, scale } from "./chart";

describe("nice axis ticks", () => {
  it("steps by 1, 2 or 5 times a power of ten and covers the largest value", () => {
    // Own worked examples of the 1-2-5 rule (Heckbert, Graphics Gems 1990, from memory).
    expect(niceTicks(9.3)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(niceTicks(456)).toEqual([0, 100, 200, 300, 400, 500]);
    expect(niceTicks(1.51)).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(niceTicks(0.07)).toEqual([0, 0.02, 0.04, 0.06, 0.08]);
    expect(niceTicks(100)).toEqual([0, 20, 40, 60, 80, 100]);
  });

  it("gives a usable axis when there is nothing to show", () => {
    expect(niceTicks(0)).toEqual([0, 1]);
    expect(niceTicks(Number.NaN)).toEqual([0, 1]);
  });
});

describe("scale", () => {
  it("maps zero and the top of the domain onto the ends", () => {
    const y = scale(10, 300, 20);
    expect(y(0)).toBe(300);
    expect(y(10)).toBe(20);
    expect(y(5)).toBe(160);
  });
});
