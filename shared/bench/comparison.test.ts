import { describe, expect, it } from "vitest";
import { bestRun, describeSupply, figureIn, runsCsv, sortRuns, type Comparable } from "./comparison";
import { criterionSchema } from "./criteria";
import type { Figure } from "./figures";
import type { CriterionView, RunView } from "./schemas";
import { evaluateRun } from "./runs";

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

describe("CSV export of the runs", () => {
  const criteria: CriterionView[] = [
    { id: "c1", position: 1, ...criterionSchema.parse({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W"), required: true }) },
  ];
  const plan = { airframeMass: q(420, "g"), criteria: criteria.map((c) => ({ id: c.id, criterion: c })) };
  const view = (number: number, label: string, notes: string, measurements: RunView["measurements"], supply: RunView["supply"]): RunView => {
    const parts = [{ partId: "p1", name: 'Tarn 2216, "880 kV"', kind: "motor" as const, count: 1, mass: q(68, "g"), ratedVoltage: q(16.8, "V") }];
    return { id: `r${number}`, episodeId: "e", number, label, parts, supply, measurements, notes, evaluation: evaluateRun({ supply, measurements, parts }, plan), createdAt: "", updatedAt: "" };
  };

  it("writes CRLF records, quotes fields with commas, quotes or line breaks, and doubles inner quotes (RFC 4180, section 2)", () => {
    const csv = runsCsv([view(1, "Motor B, 3S", "first spin\nfine", { voltage: q(11.1, "V"), current: q(9800, "mA"), thrust: q(760, "gf") }, { kind: "lipo", cells: 3 })], criteria);
    const records = csv.split("\r\n");
    expect(records.at(-1)).toBe("");
    expect(records[0]).toBe(
      "run,configuration,parts,supply,Mass (g),Voltage (V),Current (A),Electrical power (W),Thrust (gf),Thrust per watt (gf/W),Power per gram (W/g),Thrust-to-weight,Run time (s),Speed (m/s),highest supply voltage (V),over-rated,criterion 1: Thrust per watt ≥ 5 gf/W (required),verdict,notes",
    );
    // Own derivations: 11.1 V × 9.8 A = 108.78 W; 760 / 108.78 = 6.98657841515 gf/W (12 significant figures);
    // 108.78 W / 68 g = 1.59970588235 W/g; 760 gf / (420 + 68) g = 1.55737704918; 3S full = 12.6 V (common practice).
    expect(csv).toContain(
      '1,"Motor B, 3S","1 × Tarn 2216, ""880 kV""","3S LiPo (11.1 V nominal, 12.6 V full)",68,11.1,9.8,108.78,760,6.98657841515,1.59970588235,1.55737704918,,,12.6,no,pass,pass,"first spin\nfine"\r\n',
    );
  });

  it("defuses text a spreadsheet would run as a formula (OWASP CSV Injection, common practice)", () => {
    const csv = runsCsv([view(2, "=HYPERLINK(\"x\")", "+1 more", {}, null)], criteria);
    expect(csv).toContain(`2,"'=HYPERLINK(""x"")"`);
    expect(csv).toContain(",'+1 more\r\n");
  });

  it("leaves unmeasured figures empty and says when the run is over-rated", () => {
    // Common practice: a 5S pack is 21 V full (5 × 4.2 V), above the motor's 16.8 V rating.
    const csv = runsCsv([view(3, "Overvolt", "", { voltage: q(20, "V") }, { kind: "lipo", cells: 5 })], criteria);
    const row = csv.split("\r\n")[1]!;
    expect(row).toContain(",68,20,,,,,,,,,21,yes,not measured,incomplete,");
  });

  it("describes a bench supply in volts", () => {
    expect(describeSupply({ kind: "bench", voltage: q(12000, "mV") })).toBe("bench supply 12 V");
    expect(describeSupply(null)).toBe("");
  });
});
