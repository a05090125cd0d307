import { describe, expect, it } from "vitest";
import { type Criterion, type MetricValues, criterionSchema, evaluateCriterion, evaluatePlan, planVerdict, runMetricValues } from "./criteria";
import { NOT_MEASURED } from "./figures";

const q = (value: number, unit: string) => ({ value, unit });

const criterion = (fields: Record<string, unknown>): Criterion => criterionSchema.parse({ required: true, ...fields });

describe("a criterion against a measured value", () => {
  it("passes at the threshold when the same amount is written in another unit", () => {
    // 3rd CGPM (1901) via NIST SP 811: 1 kgf = 9.80665 N, so 9.80665 N ≥ 1 kgf holds exactly at the boundary.
    const atLeastOneKgf = criterion({ metric: "thrust", comparator: "gte", threshold: q(1, "kgf") });
    expect(evaluateCriterion(atLeastOneKgf, { thrust: q(9.80665, "N") })).toBe("pass");
    expect(evaluateCriterion(atLeastOneKgf, { thrust: q(9.8, "N") })).toBe("fail");
  });

  it("judges an upper limit across mass units", () => {
    // NIST SP 811 (2008), Appendix B.8: 1 oz = 28.349523125 g, so 8 oz = 226.796185 g.
    const atMostEightOunces = criterion({ metric: "mass", comparator: "lte", threshold: q(8, "oz") });
    expect(evaluateCriterion(atMostEightOunces, { mass: q(226.796185, "g") })).toBe("pass");
    expect(evaluateCriterion(atMostEightOunces, { mass: q(227, "g") })).toBe("fail");
  });

  it("judges equality within a tolerance", () => {
    // Own derivation: 11.1 V ± 0.2 V spans 10.9 V to 11.3 V; 11 000 mV = 11 V is inside (SI prefixes,
    // SI Brochure section 3, Table 7), 12.6 V is not.
    const nominalThreeCell = criterion({ metric: "voltage", comparator: "eq", threshold: q(11.1, "V"), tolerance: q(200, "mV") });
    expect(evaluateCriterion(nominalThreeCell, { voltage: q(11000, "mV") })).toBe("pass");
    expect(evaluateCriterion(nominalThreeCell, { voltage: q(12.6, "V") })).toBe("fail");
  });

  it("includes both ends of a between range", () => {
    // Own derivation: 10 000 mA = 10 A sits on the low bound; 15 A inside; 25 A above.
    const band = criterion({ metric: "current", comparator: "between", low: q(10, "A"), high: q(20, "A") });
    expect(evaluateCriterion(band, { current: q(10000, "mA") })).toBe("pass");
    expect(evaluateCriterion(band, { current: q(15, "A") })).toBe("pass");
    expect(evaluateCriterion(band, { current: q(25, "A") })).toBe("fail");
  });

  it("judges derived figures, including the plain ratio of thrust-to-weight", () => {
    // Own derivations: 777 gf / 111 W = 7 gf/W ≥ 5 gf/W; 777 gf over 777 g all-up = 1, which is ≥ 1.
    const values = runMetricValues(
      { voltage: q(11.1, "V"), current: q(10, "A"), thrust: q(777, "gf") },
      { airframe: q(700, "g"), partsOnBoard: [q(77, "g")] },
    );
    expect(evaluateCriterion(criterion({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W") }), values)).toBe("pass");
    expect(evaluateCriterion(criterion({ metric: "thrust_to_weight", comparator: "gte", threshold: q(1, "1") }), values)).toBe("pass");
    expect(evaluateCriterion(criterion({ metric: "electrical_power", comparator: "lte", threshold: q(100, "W") }), values)).toBe("fail");
  });

  it("when the value was never measured, then the criterion is not measured", () => {
    const c = criterion({ metric: "speed", comparator: "gte", threshold: q(5, "m/s") });
    expect(evaluateCriterion(c, {})).toBe("not_measured");
    expect(evaluateCriterion(c, { speed: NOT_MEASURED })).toBe("not_measured");
  });
});

describe("incompatible units", () => {
  it("when the threshold is a mass but the figure is thrust per watt, then it is an error, not a number", () => {
    // Built without the schema, as a plan saved before its metric changed would be.
    const wrong: Criterion = { metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "g"), required: true };
    const values: MetricValues = { thrust_per_watt: q(7, "gf/W") };
    expect(evaluateCriterion(wrong, values)).toEqual({
      error: "incompatible_units",
      message: "The threshold is in g but thrust per watt is in gf/W",
    });
  });

  it("names the bound at fault and a plain ratio in words", () => {
    const wrong: Criterion = { metric: "thrust_to_weight", comparator: "between", low: q(1, "1"), high: q(3, "N"), required: true };
    expect(evaluateCriterion(wrong, { thrust_to_weight: q(2, "1") })).toEqual({
      error: "incompatible_units",
      message: "The high bound is in N but thrust-to-weight is a plain ratio (unit 1)",
    });
  });

  it("is caught by the schema before the plan is saved", () => {
    const result = criterionSchema.safeParse({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "g"), required: true });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({
      path: ["threshold", "unit"],
      message: "The threshold is in g but thrust per watt is in gf/W",
    });
  });

  it("when a figure could not be computed, then its problem is passed on", () => {
    const c = criterion({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W") });
    const values = runMetricValues({ voltage: q(11.1, "V"), current: q(0, "A"), thrust: q(100, "gf") });
    expect(evaluateCriterion(c, values)).toMatchObject({ error: "zero_divisor" });
  });
});

describe("criterion schema", () => {
  it("rejects a range whose high bound is below its low bound, even across units", () => {
    // NIST SP 811 (2008), Appendix B.8: 1 lb = 453.59237 g, so a range from 1 lb up to 400 g is upside down.
    const result = criterionSchema.safeParse({ metric: "mass", comparator: "between", low: q(1, "lb"), high: q(400, "g"), required: false });
    expect(result.success).toBe(false);
  });

  it("rejects a negative tolerance and an unknown metric", () => {
    expect(criterionSchema.safeParse({ metric: "voltage", comparator: "eq", threshold: q(12, "V"), tolerance: q(-1, "V"), required: true }).success).toBe(false);
    expect(criterionSchema.safeParse({ metric: "rpm", comparator: "gte", threshold: q(1, "s"), required: true }).success).toBe(false);
  });
});

describe("the plan's verdict", () => {
  const outcome = (required: boolean, result: ReturnType<typeof evaluateCriterion>) => ({ required, outcome: result });

  it("passes only when every required criterion passes", () => {
    expect(planVerdict([outcome(true, "pass"), outcome(true, "pass"), outcome(false, "fail")])).toBe("pass");
  });

  it("fails when any required criterion fails, even with others unmeasured", () => {
    expect(planVerdict([outcome(true, "fail"), outcome(true, "not_measured")])).toBe("fail");
  });

  it("is incomplete while a required criterion is unmeasured or in error", () => {
    expect(planVerdict([outcome(true, "pass"), outcome(true, "not_measured")])).toBe("incomplete");
    expect(planVerdict([outcome(true, "pass"), outcome(true, { error: "incompatible_units", message: "…" })])).toBe("incomplete");
  });

  it("is incomplete when nothing in the plan is required", () => {
    expect(planVerdict([outcome(false, "pass")])).toBe("incomplete");
    expect(planVerdict([])).toBe("incomplete");
  });

  it("evaluates a whole plan against a run", () => {
    const plan = [
      criterion({ metric: "thrust", comparator: "gte", threshold: q(700, "gf") }),
      criterion({ metric: "run_time", comparator: "gte", threshold: q(5, "min"), required: false }),
    ];
    const { verdict, results } = evaluatePlan(plan, runMetricValues({ thrust: q(777, "gf") }));
    expect(verdict).toBe("pass");
    expect(results.map((r) => r.outcome)).toEqual(["pass", "not_measured"]);
  });
});
