import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  NOT_MEASURED,
  type Figure,
  allUpMass,
  electricalPower,
  isQuantity,
  powerPerGram,
  runFigures,
  thrustPerWatt,
  thrustToWeight,
} from "./figures";

const q = (value: number, unit: string) => ({ value, unit });

function expectQuantity(figure: Figure, value: number, unit: string, digits = 9) {
  if (!isQuantity(figure)) throw new Error(`expected a quantity, got ${JSON.stringify(figure)}`);
  expect(figure.unit).toBe(unit);
  expect(figure.value).toBeCloseTo(value, digits);
}

describe("electrical power", () => {
  it("is volts times amps", () => {
    // BIPM SI Brochure (9th ed., 2019), section 2.3.4, Table 4: W = J/s and V = W/A, so P = V × I.
    // 11.1 V (a 3S pack's nominal voltage, common practice) × 10 A = 111 W.
    expectQuantity(electricalPower(q(11.1, "V"), q(10, "A")), 111, "W");
    // Same law after SI prefixes (SI Brochure, section 3, Table 7): 12 000 mV × 2500 mA = 12 V × 2.5 A = 30 W.
    expectQuantity(electricalPower(q(12000, "mV"), q(2500, "mA")), 30, "W");
  });

  it("when the current was not measured, then power is not measured", () => {
    expect(electricalPower(q(11.1, "V"), undefined)).toBe(NOT_MEASURED);
  });
});

describe("power per gram of the part", () => {
  it("divides power by the part's mass in grams", () => {
    // Own derivation: 111 W / 55.5 g = 2 W/g.
    expectQuantity(powerPerGram(q(111, "W"), q(55.5, "g")), 2, "W/g");
    // NIST SP 811 (2008), Appendix B.8: 1 oz = 28.349523125 g, so 111 W / 1 oz = 3.915409… W/g.
    expectQuantity(powerPerGram(q(111, "W"), q(1, "oz")), 111 / 28.349523125, "W/g");
  });

  it("when power is not measured, then neither is power per gram", () => {
    expect(powerPerGram(NOT_MEASURED, q(50, "g"))).toBe(NOT_MEASURED);
    expect(powerPerGram(q(111, "W"), undefined)).toBe(NOT_MEASURED);
  });

  it("when the part weighs nothing, then it says so rather than dividing by zero", () => {
    expect(powerPerGram(q(111, "W"), q(0, "g"))).toMatchObject({ error: "zero_divisor" });
  });
});

describe("thrust per watt", () => {
  it("is gram-force of thrust per watt of power", () => {
    // Own derivation: 777 gf / 111 W = 7 gf/W.
    expectQuantity(thrustPerWatt(q(777, "gf"), q(111, "W")), 7, "gf/W");
    // 3rd CGPM (1901) via NIST SP 811: 9.80665 N = 1 kgf = 1000 gf, so 9.80665 N / 100 W = 10 gf/W.
    expectQuantity(thrustPerWatt(q(9.80665, "N"), q(100, "W")), 10, "gf/W");
  });

  it("when nothing draws power, then thrust per watt has no value", () => {
    expect(thrustPerWatt(q(100, "gf"), q(0, "W"))).toMatchObject({ error: "zero_divisor" });
  });
});

describe("thrust-to-weight of the craft", () => {
  it("adds the airframe and every part on board for the all-up mass", () => {
    // Own derivation: 600 g + 250 g + 0.15 kg = 1000 g.
    expectQuantity(allUpMass(q(600, "g"), [q(250, "g"), q(0.15, "kg")]), 1000, "g");
  });

  it("is dimensionless, with g_n cancelling when both are in gram units", () => {
    // A gram-force is the weight of a gram under standard gravity g_n (3rd CGPM, 1901; NIST SP 811 (2008),
    // Appendix B.8, kilogram-force = 9.80665 N), so with both in gram units g_n cancels (own derivation).
    // 2000 gf over 1000 g = 2.
    expectQuantity(thrustToWeight(q(2000, "gf"), q(1000, "g")), 2, "1");
    // g_n = 9.80665 m/s² (3rd CGPM, 1901; NIST SP 811): 1 kg weighs 9.80665 N, so 19.6133 N over 1 kg = 2.
    expectQuantity(thrustToWeight(q(19.6133, "N"), q(1, "kg")), 2, "1");
    // NIST SP 811 (2008), Appendix B.8: 1 lb = 453.59237 g, so 1 kgf over 1 lb = 1000 / 453.59237 = 2.2046226…
    expectQuantity(thrustToWeight(q(1, "kgf"), q(1, "lb")), 1000 / 453.59237, "1");
  });

  it("when one part on board was never weighed, then thrust-to-weight is not measured", () => {
    const craftMass = allUpMass(q(600, "g"), [q(250, "g"), undefined]);
    expect(craftMass).toBe(NOT_MEASURED);
    expect(thrustToWeight(q(2000, "gf"), craftMass)).toBe(NOT_MEASURED);
    expect(thrustToWeight(undefined, q(1000, "g"))).toBe(NOT_MEASURED);
  });

  it("when the craft's mass is in the wrong unit, then it reports a unit problem", () => {
    expect(thrustToWeight(q(2000, "gf"), q(1000, "gf"))).toMatchObject({ error: "incompatible_units" });
  });
});

describe("figures for a whole run", () => {
  it("derives every figure from the run's measurements and the craft", () => {
    // Own derivations: 11.1 V × 10 A = 111 W; 111 W / 55.5 g = 2 W/g; 777 gf / 111 W = 7 gf/W;
    // 777 gf / (600 g + 55.5 g + 121.5 g = 777 g) = 1.
    const figures = runFigures(
      { voltage: q(11.1, "V"), current: q(10, "A"), mass: q(55.5, "g"), thrust: q(777, "gf") },
      { airframe: q(600, "g"), partsOnBoard: [q(55.5, "g"), q(121.5, "g")] },
    );
    expectQuantity(figures.electrical_power, 111, "W");
    expectQuantity(figures.power_per_gram, 2, "W/g");
    expectQuantity(figures.thrust_per_watt, 7, "gf/W");
    expectQuantity(figures.thrust_to_weight, 1, "1");
  });

  it("never answers NaN, whatever was left unmeasured", () => {
    const maybe = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });
    const value = fc.double({ min: 0, max: 1e4, noNaN: true });
    fc.assert(
      fc.property(maybe(value), maybe(value), maybe(value), maybe(value), maybe(value), (volts, amps, grams, thrust, airframe) => {
        const figures = runFigures(
          {
            voltage: volts === undefined ? undefined : q(volts, "V"),
            current: amps === undefined ? undefined : q(amps, "A"),
            mass: grams === undefined ? undefined : q(grams, "g"),
            thrust: thrust === undefined ? undefined : q(thrust, "gf"),
          },
          { airframe: airframe === undefined ? undefined : q(airframe, "g"), partsOnBoard: [] },
        );
        for (const figure of Object.values(figures)) {
          if (isQuantity(figure)) expect(Number.isFinite(figure.value)).toBe(true);
        }
      }),
    );
  });
});
