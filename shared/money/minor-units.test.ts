import { describe, expect, it } from "vitest";
import { readAmount } from "../fields/amounts";
import { formatMinorUnits, fromMinorUnits, minorUnitDigits, toMinorUnits, inCurrencyDigits, decimalsOf, tooManyDecimals } from "./minor-units";

/** What a person reads back from a formatted amount: the figure without the currency's sign or code. */
const readBack = (text: string, currency: string) => {
  const reading = readAmount(text.replace(/[^\d.,\s\u00a0\u202f'’]/g, ""));
  return reading.ok ? toMinorUnits(reading.text, currency) : null;
};

describe("minor units", () => {
  // Exponents: ISO 4217:2015, Table A.1 (current currency and funds code list), column "Minor unit":
  // EUR 2, USD 2, JPY 0, KRW 0, KWD 3, BHD 3, CLF 4.
  it("takes each currency's exponent from ISO 4217", () => {
    expect(minorUnitDigits("EUR")).toBe(2);
    expect(minorUnitDigits("usd")).toBe(2);
    expect(minorUnitDigits("JPY")).toBe(0);
    expect(minorUnitDigits("KRW")).toBe(0);
    expect(minorUnitDigits("KWD")).toBe(3);
    expect(minorUnitDigits("BHD")).toBe(3);
    expect(minorUnitDigits("CLF")).toBe(4);
  });

  it("round-trips a fee of 1,800.50 EUR through 180050 minor units in en-GB, de-DE and en-US", () => {
    const typed = readAmount("1,800.50");
    expect(typed.ok && typed.text).toBe("1800.50");
    const minor = toMinorUnits("1800.50", "EUR");
    expect(minor).toBe(180050);
    // The written forms are CLDR's currency patterns for each locale (from memory; Node's ICU agrees).
    const written = { "en-GB": "€1,800.50", "de-DE": "1.800,50\u00a0€", "en-US": "€1,800.50" };
    for (const [locale, text] of Object.entries(written)) {
      expect(formatMinorUnits(180050, "EUR", locale)).toBe(text);
      expect(readBack(text, "EUR")).toBe(180050);
    }
    expect(fromMinorUnits(180050, "EUR")).toBe("1800.50");
  });

  it("has no minor unit for JPY: 1800 yen is 1800 units, and a fraction of a yen is refused", () => {
    expect(toMinorUnits("1800", "JPY")).toBe(1800);
    expect(toMinorUnits("1800.00", "JPY")).toBe(1800);
    expect(toMinorUnits("1800.50", "JPY")).toBeNull();
    expect(fromMinorUnits(1800, "JPY")).toBe("1800");
    expect(formatMinorUnits(1800, "JPY", "en-GB")).toBe("JP¥1,800");
  });

  it("has three decimals for KWD: 1800.500 dinars is 1,800,500 fils", () => {
    expect(toMinorUnits("1800.5", "KWD")).toBe(1800500);
    expect(toMinorUnits("1800.505", "KWD")).toBe(1800505);
    expect(toMinorUnits("1800.5055", "KWD")).toBeNull();
    expect(fromMinorUnits(1800505, "KWD")).toBe("1800.505");
    expect(formatMinorUnits(1800505, "KWD", "en-GB")).toBe("KWD\u00a01,800.505");
  });

  it("writes a stored amount (four decimals in the column) with its currency's decimals, and counts decimals as typed", () => {
    expect(inCurrencyDigits("1800.5000", "EUR")).toBe("1800.50");
    expect(inCurrencyDigits("1800.5050", "KWD")).toBe("1800.505");
    expect(inCurrencyDigits("180000.0000", "JPY")).toBe("180000");
    // A yen fee with sen, kept from before fees were checked against their currency: shown as it is.
    expect(inCurrencyDigits("1800.5000", "JPY")).toBe("1800.5");
    expect(decimalsOf("1.800")).toBe(3);
    expect(decimalsOf("1800")).toBe(0);
    expect(tooManyDecimals("JPY")).toBe("JPY has no minor unit: use whole amounts.");
    expect(tooManyDecimals("EUR")).toBe("EUR has 2 decimals at most.");
  });

  it("refuses what is not a plain amount, and amounts past exact integers", () => {
    expect(toMinorUnits("1,800.50", "EUR")).toBeNull();
    expect(toMinorUnits("-5", "EUR")).toBeNull();
    expect(toMinorUnits("99999999999999999", "EUR")).toBeNull();
    expect(toMinorUnits("0.05", "EUR")).toBe(5);
    expect(fromMinorUnits(5, "EUR")).toBe("0.05");
  });
});
