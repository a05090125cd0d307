import { describe, expect, it } from "vitest";
import { type Criterion, criterionSchema } from "./criteria";
import { NOT_MEASURED, isQuantity, type Figure } from "./figures";
import { configurationMass, evaluateRun, highestSupplyVoltage, isOverRated, iterationThrustToWeight, type PlanForRuns, type RunForEvaluation } from "./runs";

const q = (value: number, unit: string) => ({ value, unit });

function expectQuantity(figure: Figure | undefined, value: number, unit: string, digits = 9) {
  if (!isQuantity(figure)) throw new Error(`expected a quantity, got ${JSON.stringify(figure)}`);
  expect(figure.unit).toBe(unit);
  expect(figure.value).toBeCloseTo(value, digits);
}

const criterion = (fields: Record<string, unknown>): Criterion => criterionSchema.parse({ required: true, ...fields });

const part = (name: string, mass: { value: number; unit: string } | null, ratedVoltage: { value: number; unit: string } | null = null, count = 1) => ({
  partId: `id-${name}`,
  name,
  count,
  mass,
  ratedVoltage,
});

const plan: PlanForRuns = {
  airframeMass: q(420, "g"),
  criteria: [
    { id: "ttw", criterion: criterion({ metric: "thrust_to_weight", comparator: "gte", threshold: q(1.2, "1") }) },
    { id: "tpw", criterion: criterion({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W") }) },
    { id: "time", criterion: criterion({ metric: "run_time", comparator: "gte", threshold: q(3, "min"), required: false }) },
  ],
};

describe("the configuration's mass", () => {
  it("takes the weighed mass when the run records one", () => {
    expect(configurationMass(q(2, "oz"), [part("motor", q(68, "g"))])).toEqual({ mass: q(2, "oz"), source: "measured" });
  });

  it("otherwise adds up the shelf masses times their counts, across units", () => {
    // NIST SP 811 (2008), Appendix B.8: 1 oz = 28.349523125 g. Own derivation:
    // 4 × 1 oz + 2 × 14 g = 113.3980925 g + 28 g = 141.3980925 g.
    const { mass, source } = configurationMass(undefined, [part("motor", q(1, "oz"), null, 4), part("prop", q(14, "g"), null, 2)]);
    expect(source).toBe("shelf");
    expectQuantity(mass, 141.3980925, "g");
  });

  it("when a part was never weighed, or there are no parts, then it is not measured", () => {
    expect(configurationMass(undefined, [part("motor", q(68, "g")), part("prop", null)]).mass).toBe(NOT_MEASURED);
    expect(configurationMass(undefined, []).source).toBe("none");
  });
});

describe("the highest supply voltage", () => {
  it("judges a pack at full charge, and a measured voltage above it wins", () => {
    // Common practice: 4.2 V a cell full, so a 4S pack is 16.8 V full.
    expect(highestSupplyVoltage({ kind: "lipo", cells: 4 }, q(14.8, "V"))).toEqual(q(16.8, "V"));
    expect(highestSupplyVoltage({ kind: "bench", voltage: q(12, "V") }, q(12500, "mV"))).toEqual(q(12500, "mV"));
    expect(highestSupplyVoltage(null, undefined)).toBeNull();
  });
});

describe("evaluating a run against the plan", () => {
  it("derives every figure from mixed units and passes the plan", () => {
    // Own derivation: 11.1 V × 9800 mA = 11.1 V × 9.8 A = 108.78 W (P = V × I, SI Brochure; milli = 10⁻³).
    // 760 gf / 108.78 W = 6.98657… gf/W. All-up: 420 g airframe + 68 g motor + 14 g prop = 502 g;
    // 760 gf over 502 g = 1.51394… (g_n cancels). Run time 4 min ≥ 3 min.
    const run: RunForEvaluation = {
      supply: { kind: "lipo", cells: 3 },
      measurements: { voltage: q(11.1, "V"), current: q(9800, "mA"), thrust: q(760, "gf"), run_time: q(240, "s") },
      parts: [part("motor", q(68, "g"), q(16.8, "V")), part("prop", q(14, "g"))],
    };
    const evaluation = evaluateRun(run, plan);
    expectQuantity(evaluation.figures.electrical_power, 108.78, "W");
    expectQuantity(evaluation.figures.thrust_per_watt, 760 / 108.78, "gf/W");
    expectQuantity(evaluation.figures.power_per_gram, 108.78 / 82, "W/g");
    expectQuantity(evaluation.allUpMass, 502, "g");
    expectQuantity(evaluation.figures.thrust_to_weight, 760 / 502, "1");
    expect(evaluation.massSource).toBe("shelf");
    expect(evaluation.results.map((r) => [r.criterionId, r.outcome])).toEqual([
      ["ttw", "pass"],
      ["tpw", "pass"],
      ["time", "pass"],
    ]);
    expect(evaluation.verdict).toBe("pass");
    expect(evaluation.pack).toMatchObject({ label: "3S", nominal: q(11.1, "V"), full: q(12.6, "V"), low: { status: "above_minimum" } });
    expect(isOverRated(evaluation)).toBe(false);
  });

  it("fails when a required criterion fails, with ounces and amps in the mix", () => {
    // Own derivation: 12 V × 4.1 A = 49.2 W; 290 gf / 49.2 W = 5.894… gf/W (passes 5 gf/W).
    // Mass weighed as 16 oz = 453.59237 g (NIST SP 811, B.8); all-up 873.59237 g; 290 / 873.59237 = 0.33196… < 1.2.
    const evaluation = evaluateRun(
      { supply: { kind: "bench", voltage: q(12, "V") }, measurements: { mass: q(16, "oz"), voltage: q(12, "V"), current: q(4.1, "A"), thrust: q(290, "gf") }, parts: [] },
      plan,
    );
    expectQuantity(evaluation.figures.thrust_to_weight, 290 / 873.59237, "1");
    expect(evaluation.results.map((r) => r.outcome)).toEqual(["fail", "pass", "not_measured"]);
    expect(evaluation.verdict).toBe("fail");
  });

  it("when the plan has no airframe mass, then thrust-to-weight is not measured and the verdict waits", () => {
    const evaluation = evaluateRun(
      { supply: null, measurements: { mass: q(80, "g"), voltage: q(11.1, "V"), current: q(10, "A"), thrust: q(800, "gf") }, parts: [] },
      { ...plan, airframeMass: null },
    );
    expect(evaluation.figures.thrust_to_weight).toBe(NOT_MEASURED);
    expect(evaluation.allUpMass).toBe(NOT_MEASURED);
    expect(evaluation.verdict).toBe("incomplete");
  });

  it("flags a part whose rated voltage the supply exceeds, with a caution", () => {
    // Common practice: a 4S pack is 16.8 V full (4 × 4.2 V); the motor is rated 12.6 V. Own derivation: 4.2 V over.
    const evaluation = evaluateRun(
      { supply: { kind: "lipo", cells: 4 }, measurements: { voltage: q(16.4, "V"), current: q(3.1, "A") }, parts: [part("Fjell 2814", q(110, "g"), q(12.6, "V")), part("prop", q(16, "g"))] },
      plan,
    );
    expect(isOverRated(evaluation)).toBe(true);
    const [motor, prop] = evaluation.ratings;
    expect(motor).toMatchObject({ partName: "Fjell 2814", check: { status: "over_rated", overBy: q(4.2, "V") } });
    expect(motor?.check.status === "over_rated" && motor.check.caution).toContain("above the part's rated 12.6 V");
    expect(prop?.check.status).toBe("no_rating");
  });

  it("asks no rating of a part that takes no power", () => {
    const frame = { ...part("Frame", q(120, "g")), powered: false };
    const evaluation = evaluateRun({ supply: { kind: "lipo", cells: 4 }, measurements: { voltage: q(16.4, "V") }, parts: [part("Fjell 2814", q(110, "g"), q(24, "V")), frame] }, plan);
    expect(evaluation.ratings.map((flag) => flag.partName)).toEqual(["Fjell 2814"]);
  });

  it("warns when a pack was run below about 3.0 V a cell", () => {
    // Common practice: about 3.0 V a cell minimum, so 9.0 V for 3S; 8.7 V is below it.
    const evaluation = evaluateRun({ supply: { kind: "lipo", cells: 3 }, measurements: { voltage: q(8.7, "V") }, parts: [] }, plan);
    expect(evaluation.pack?.low?.status).toBe("below_minimum");
  });

  it("when nothing was measured, then every criterion is not measured and nothing is flagged", () => {
    const evaluation = evaluateRun({ supply: null, measurements: {}, parts: [] }, plan);
    expect(evaluation.results.every((r) => r.outcome === "not_measured")).toBe(true);
    expect(evaluation.verdict).toBe("incomplete");
    expect(evaluation.ratings).toEqual([]);
    expect(evaluation.supplyVoltage).toBeNull();
  });
});

describe("thrust-to-weight per build iteration", () => {
  it("divides the chosen run's thrust by the iteration's all-up mass", () => {
    // Own derivation: 760 gf over 640 g = 1.1875; over 1.3 lb (1.3 × 453.59237 g = 589.670081 g, NIST SP 811) = 1.28885…
    expectQuantity(iterationThrustToWeight(q(760, "gf"), q(640, "g")), 1.1875, "1");
    expectQuantity(iterationThrustToWeight(q(760, "gf"), q(1.3, "lb")), 760 / 589.670081, "1");
  });

  it("when the mass or the run's thrust is missing, then it is not measured", () => {
    expect(iterationThrustToWeight(q(760, "gf"), null)).toBe(NOT_MEASURED);
    expect(iterationThrustToWeight(null, q(640, "g"))).toBe(NOT_MEASURED);
  });
});
