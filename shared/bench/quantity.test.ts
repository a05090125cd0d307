import { describe, expect, it } from "vitest";
import { UnitError, convertQuantity, isKnownUnit, quantityOfSchema, quantitySchema, valueIn } from "./quantity";

describe("unit conversion", () => {
  it("converts avoirdupois ounces and pounds by their exact definitions", () => {
    // NIST SP 811 (2008), Appendix B.8: ounce (avoirdupois) = 2.834952 E-02 kg, exactly 28.349523125 g.
    expect(valueIn({ value: 1, unit: "oz" }, "g")).toBeCloseTo(28.349523125, 9);
    // NIST SP 811 (2008), Appendix B.8: pound (avoirdupois) = 0.45359237 kg exactly.
    expect(valueIn({ value: 1, unit: "lb" }, "kg")).toBeCloseTo(0.45359237, 12);
    // Derived from the two above: 16 × 28.349523125 g = 453.59237 g = 1 lb.
    expect(valueIn({ value: 16, unit: "oz" }, "lb")).toBeCloseTo(1, 12);
  });

  it("defines gram-force and kilogram-force from standard gravity", () => {
    // g_n = 9.80665 m/s² exact (3rd CGPM, 1901; NIST SP 811 (2008), Appendix B.8):
    // 1 gf = 0.001 kg × 9.80665 m/s² = 0.00980665 N, and 1 kgf = 9.80665 N.
    expect(valueIn({ value: 1, unit: "gf" }, "N")).toBeCloseTo(0.00980665, 12);
    expect(valueIn({ value: 1, unit: "kgf" }, "N")).toBeCloseTo(9.80665, 12);
    // Derived: 1000 gf = 1 kgf.
    expect(valueIn({ value: 1000, unit: "gf" }, "kgf")).toBeCloseTo(1, 12);
  });

  it("applies SI prefixes and the minute", () => {
    // BIPM SI Brochure (9th ed., 2019), section 3, Table 7 (SI prefixes): milli = 10⁻³. So 1500 mA = 1.5 A, 12 600 mV = 12.6 V.
    expect(valueIn({ value: 1500, unit: "mA" }, "A")).toBeCloseTo(1.5, 12);
    expect(valueIn({ value: 12600, unit: "mV" }, "V")).toBeCloseTo(12.6, 12);
    // BIPM SI Brochure (9th ed., 2019), section 4, Table 8 (non-SI units accepted for use with the SI): 1 min = 60 s.
    expect(valueIn({ value: 2, unit: "min" }, "s")).toBe(120);
  });

  it("converts quotients such as thrust per watt", () => {
    // Derived from 1 kgf = 1000 gf (CGPM 1901 via NIST SP 811): 5 gf/W = 0.005 kgf/W.
    expect(valueIn({ value: 5, unit: "gf/W" }, "kgf/W")).toBeCloseTo(0.005, 12);
  });

  it("keeps the value exactly when the unit does not change", () => {
    expect(convertQuantity({ value: 2000, unit: "gf" }, "gf")).toEqual({ value: 2000, unit: "gf" });
  });

  it("throws a UnitError naming both units when they measure different things", () => {
    const attempt = () => convertQuantity({ value: 1, unit: "g" }, "N");
    expect(attempt).toThrow(UnitError);
    expect(attempt).toThrow("cannot convert g to N");
    expect(attempt).toThrow(expect.objectContaining({ name: "UnitError", code: "incompatible_units" }));
  });

  it("refuses units the bench does not use, even ones mathjs knows", () => {
    expect(() => convertQuantity({ value: 1, unit: "ft" }, "m/s")).toThrow(/"ft" is not a unit Kerf measures in/);
    expect(() => convertQuantity({ value: 1, unit: "g" }, "kV")).toThrow(UnitError);
  });

  it("keeps a plain ratio apart from every real unit", () => {
    expect(() => convertQuantity({ value: 2, unit: "1" }, "g")).toThrow(UnitError);
    expect(convertQuantity({ value: 2, unit: "1" }, "1")).toEqual({ value: 2, unit: "1" });
  });
});

describe("quantity schema", () => {
  it("accepts the bench units, their quotients and the ratio unit", () => {
    for (const unit of ["g", "kg", "oz", "lb", "V", "mV", "A", "mA", "W", "gf", "kgf", "N", "s", "min", "m/s", "gf/W", "W/g", "1"]) {
      expect(quantitySchema.safeParse({ value: 1, unit }).success, unit).toBe(true);
    }
  });

  it("rejects unknown units, doubly compound units and numbers that are not finite", () => {
    expect(isKnownUnit("ft")).toBe(false);
    expect(isKnownUnit("m/s/W")).toBe(false);
    expect(isKnownUnit("gf/W/g")).toBe(false);
    expect(quantitySchema.safeParse({ value: Number.NaN, unit: "g" }).success).toBe(false);
    expect(quantitySchema.safeParse({ value: Number.POSITIVE_INFINITY, unit: "g" }).success).toBe(false);
    expect(quantitySchema.safeParse({ value: "5", unit: "g" }).success).toBe(false);
  });

  it("when thrust is written in grams of mass, then the schema asks for a force", () => {
    const thrust = quantityOfSchema("force", "thrust");
    const result = thrust.safeParse({ value: 800, unit: "g" });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe("thrust must be in gf, kgf, N");
    expect(thrust.safeParse({ value: 800, unit: "gf" }).success).toBe(true);
  });
});
