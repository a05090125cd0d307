import { describe, expect, it } from "vitest";
import { criterionSchema, metricUnit } from "./criteria";
import { describeCriterion, formatFigure, formatNumber, outcomeLabel, preciseNumber, unitsForMetric } from "./format";
import { readCriterion } from "./read-criterion";
import { areCompatible } from "./quantity";

const q = (value: number, unit: string) => ({ value, unit });

describe("numbers for files", () => {
  it("writes numbers without float noise", () => {
    // Own derivation: 3 × 3.7 is 11.100000000000001 in binary floating point; the pack is 11.1 V.
    expect(preciseNumber(3 * 3.7)).toBe("11.1");
    expect(preciseNumber(0.1 + 0.2)).toBe("0.3");
    expect(preciseNumber(1 / 3)).toBe("0.333333333333");
  });
});

describe("numbers and figures for people", () => {
  it("shows about three significant figures without float noise", () => {
    expect(formatNumber(3 * 3.7)).toBe("11.1");
    expect(formatNumber(6.986578415)).toBe("6.99");
    expect(formatNumber(108.78)).toBe("108.8");
    expect(formatNumber(1180.4)).toBe("1180");
    expect(formatNumber(0.00980665)).toBe("0.00981");
    expect(formatNumber(0)).toBe("0");
  });

  it("writes ratios without a unit and says what is missing", () => {
    expect(formatFigure(q(1.5139, "1"))).toBe("1.51");
    expect(formatFigure(q(34.02, "g"))).toBe("34.02 g");
    expect(formatFigure("not_measured")).toBe("not measured");
    expect(formatFigure(undefined)).toBe("not measured");
    expect(formatFigure({ error: "zero_divisor", message: "thrust per watt has no value when the power is zero" })).toBe("thrust per watt has no value when the power is zero");
  });

  it("describes each comparator", () => {
    const c = (fields: Record<string, unknown>) => describeCriterion(criterionSchema.parse({ required: true, ...fields }));
    expect(c({ metric: "thrust_to_weight", comparator: "gte", threshold: q(1.2, "1") })).toBe("Thrust-to-weight ≥ 1.2");
    expect(c({ metric: "mass", comparator: "lte", threshold: q(8, "oz") })).toBe("Mass ≤ 8 oz");
    expect(c({ metric: "voltage", comparator: "eq", threshold: q(11.1, "V"), tolerance: q(200, "mV") })).toBe("Voltage = 11.1 V ± 200 mV");
    expect(c({ metric: "current", comparator: "between", low: q(10, "A"), high: q(20, "A") })).toBe("Current between 10 A and 20 A");
  });

  it("labels outcomes, errors with their message", () => {
    expect(outcomeLabel("not_measured")).toBe("not measured");
    expect(outcomeLabel({ error: "incompatible_units", message: "The threshold is in g but thrust per watt is in gf/W" })).toBe("error: The threshold is in g but thrust per watt is in gf/W");
  });
});

describe("unit suggestions for a criterion", () => {
  it("offers only units compatible with the metric's natural unit", () => {
    for (const metric of ["mass", "thrust", "power_per_gram", "thrust_per_watt", "electrical_power", "run_time", "speed", "voltage", "current", "thrust_to_weight"] as const) {
      const [natural, ...rest] = unitsForMetric(metric);
      for (const unit of rest) expect(areCompatible(unit, natural!), `${metric}: ${unit}`).toBe(true);
      expect(natural).toBe(metricUnit(metric));
    }
  });
});

describe("a criterion read against a run", () => {
  const c = (fields: Record<string, unknown>) => criterionSchema.parse({ required: true, ...fields });

  it("puts the measured value beside the bound, in the criterion's unit", () => {
    // 400 gf = 400 × 0.00980665 N = 3.92266 N: gram-force from g_n = 9.80665 m/s² (NIST SP 811 (2008), Appendix B.8).
    expect(readCriterion(c({ metric: "thrust", comparator: "gte", threshold: q(3.5, "N") }), q(400, "gf"))).toBe("Thrust 3.92 N ≥ 3.5 N");
    // 1 oz (avoirdupois) = 28.349523125 g (NIST SP 811 (2008), Appendix B.8), so 230 g = 8.113 oz.
    expect(readCriterion(c({ metric: "mass", comparator: "lte", threshold: q(8, "oz") }), q(230, "g"))).toBe("Mass 8.11 oz ≤ 8 oz");
    // 1 mV = 10⁻³ V (SI prefix milli, SI Brochure, 9th edition, Table 7).
    expect(readCriterion(c({ metric: "voltage", comparator: "eq", threshold: q(11.1, "V"), tolerance: q(200, "mV") }), q(11050, "mV"))).toBe("Voltage 11.05 V = 11.1 V ± 200 mV");
    expect(readCriterion(c({ metric: "current", comparator: "between", low: q(10, "A"), high: q(20, "A") }), q(12500, "mA"))).toBe("Current 10 A ≤ 12.5 A ≤ 20 A");
    expect(readCriterion(c({ metric: "thrust_to_weight", comparator: "gte", threshold: q(1.2, "1") }), q(1.5139, "1"))).toBe("Thrust-to-weight 1.51 ≥ 1.2");
  });

  it("says what was needed when nothing was measured or the figure could not be made", () => {
    const gte = c({ metric: "thrust", comparator: "gte", threshold: q(3.5, "N") });
    expect(readCriterion(gte, "not_measured")).toBe("Thrust: not measured (needs ≥ 3.5 N)");
    expect(readCriterion(gte, undefined)).toBe("Thrust: not measured (needs ≥ 3.5 N)");
    const tpw = c({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W") });
    expect(readCriterion(tpw, { error: "zero_divisor", message: "no power drawn" })).toBe("Thrust per watt: no power drawn (needs ≥ 5 gf/W)");
  });
});
