import { describe, expect, it } from "vitest";
import { bestRun, describeSupply, figureIn, sortRuns, type Comparable } from "./comparison";
import type { Figure } from "./figures";

const q = (value: number, unit: string) => ({ value, unit });

const run = (number: number, verdict: "pass" | "fail" | "incomplete", values: Record<string, Figure>): Comparable => ({
  id: `run-${number}`,
  number,
  label: `Run ${number}`,
  evaluation: { verdict, values },
});

describe("figures in a column's unit", () => {
  it("converts to the column's unit and gives null for what cannot be shown", () => {
    // NIST SP 811 (2008), Appendix B.8: 1 oz = 28.349523125 g.
    expect(figureIn(q(1, "oz"), "g")).toBeCloseTo(28.349523125, 9);
    expect(figureIn("not_measured", "g")).toBeNull();
    expect(figureIn({ error: "zero_divisor", message: "…" }, "gf/W")).toBeNull();
    expect(figureIn(q(1, "N"), "g")).toBeNull();
    expect(figureIn(undefined, "g")).toBeNull();
  });
});

describe("sorting runs", () => {
  // SI Brochure, Table 7: 500 mA = 0.5 A, so the order by current is run 2 (0.5 A), run 3 (2 A), run 1 (3 A).
  const runs = [run(1, "fail", { current: q(3, "A") }), run(2, "pass", { current: q(500, "mA") }), run(3, "incomplete", { current: q(2, "A") }), run(4, "pass", {})];

  it("orders by the figure in one unit, whatever unit each run was entered in", () => {
    expect(sortRuns(runs, "current", "ascending").map((r) => r.number)).toEqual([2, 3, 1, 4]);
  });

  it("keeps runs without the figure last in both directions", () => {
    expect(sortRuns(runs, "current", "descending").map((r) => r.number)).toEqual([1, 3, 2, 4]);
  });

  it("sorts by verdict, number and label", () => {
    expect(sortRuns(runs, "verdict", "descending").map((r) => r.number)).toEqual([2, 4, 3, 1]);
    expect(sortRuns(runs, "number", "descending").map((r) => r.number)).toEqual([4, 3, 2, 1]);
    expect(sortRuns(runs, "label", "ascending").map((r) => r.number)).toEqual([1, 2, 3, 4]);
  });

  it("leaves the input untouched", () => {
    const before = runs.map((r) => r.number);
    sortRuns(runs, "current", "descending");
    expect(runs.map((r) => r.number)).toEqual(before);
  });
});

describe("the best candidate", () => {
  it("is the passing run with the most thrust per watt, even against a failing run with more", () => {
    const runs = [
      run(1, "fail", { thrust_per_watt: q(9, "gf/W"), mass: q(100, "g") }),
      run(2, "pass", { thrust_per_watt: q(6.5, "gf/W"), mass: q(90, "g") }),
      run(3, "pass", { thrust_per_watt: q(7, "gf/W"), mass: q(120, "g") }),
    ];
    expect(bestRun(runs)?.number).toBe(3);
  });

  it("breaks a tie with the lighter configuration", () => {
    // Own derivation: 0.005 kgf/W = 5 gf/W (1 kgf = 1000 gf); 3 oz = 85.0485… g is lighter than 100 g (NIST SP 811, B.8).
    const runs = [run(1, "pass", { thrust_per_watt: q(5, "gf/W"), mass: q(100, "g") }), run(2, "pass", { thrust_per_watt: q(0.005, "kgf/W"), mass: q(3, "oz") })];
    expect(bestRun(runs)?.number).toBe(2);
  });

  it("is nobody when no run meets the plan", () => {
    expect(bestRun([run(1, "fail", { thrust_per_watt: q(9, "gf/W") }), run(2, "incomplete", {})])).toBeNull();
  });
});

describe("describing a supply", () => {
  it("describes a bench supply in volts", () => {
    expect(describeSupply({ kind: "bench", voltage: q(12000, "mV") })).toBe("bench supply 12 V");
    expect(describeSupply(null)).toBe("");
  });
});
