import { describe, expect, it } from "vitest";
import { amountFromUnitDecimal, formatMinorUnits, minorUnitDigits } from "../../dev-services/payments/money";

describe("amounts in minor units", () => {
  it("when a unit amount with fractions of a minor unit is multiplied by a quantity, then the product is exact and rounded once, halves away from zero", () => {
    // Halves away from zero is common practice; the provider's reference does not say how it rounds.
    expect(amountFromUnitDecimal("450.125", 2)).toBe(900);
    expect(amountFromUnitDecimal("1250.5", 3)).toBe(3752);
    expect(amountFromUnitDecimal("0.5", 1)).toBe(1);
    expect(amountFromUnitDecimal("-0.5", 1)).toBe(-1);
    // 0.1 × 3 in binary floating point is 0.30000000000000004; here it stays 0.3 → 0.
    expect(amountFromUnitDecimal("0.1", 3)).toBe(0);
    expect(amountFromUnitDecimal("33.333333333333", 3)).toBe(100);
  });

  it("when a currency's minor unit is looked up, then it is ISO 4217's", () => {
    // ISO 4217 (SIX's list one, current currencies), "Minor unit" column.
    expect(minorUnitDigits("eur")).toBe(2);
    expect(minorUnitDigits("jpy")).toBe(0);
    expect(minorUnitDigits("kwd")).toBe(3);
  });

  it("when 180050 euro cents are written for a reader, then they read 1,800.50 in en-GB and en-US and 1.800,50 in de-DE", () => {
    // Unicode CLDR currency patterns for these locales, as Node's ICU carries them.
    expect(formatMinorUnits(180050, "eur", "en-GB")).toBe("€1,800.50");
    expect(formatMinorUnits(180050, "eur", "en-US")).toBe("€1,800.50");
    expect(formatMinorUnits(180050, "eur", "de-DE")).toBe("1.800,50\u00a0€");
    expect(formatMinorUnits(5, "eur", "en-GB")).toBe("€0.05");
    expect(formatMinorUnits("1250.5", "eur", "en-GB")).toBe("€12.505");
  });
});
