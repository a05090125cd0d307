import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { amountDecimalTextSchema, amountTextSchema, plainAmount, readAmount } from "./amounts";

const read = (text: string) => {
  const reading = readAmount(text);
  return reading.ok ? reading.text : reading.problem;
};

describe("readAmount", () => {
  it("reads the forms people type", () => {
    expect(read("1800.50")).toBe("1800.50");
    expect(read("1,800.50")).toBe("1800.50");
    expect(read("1,800")).toBe("1800");
    expect(read("1,234,567.8")).toBe("1234567.8");
    expect(read("1 800,50")).toBe("1800.50");
    expect(read("1.800,50")).toBe("1800.50");
    expect(read("1’800.50")).toBe("1800.50");
    expect(read("2,5")).toBe("2.5");
    expect(read("0.99")).toBe("0.99");
    expect(read("  250 ")).toBe("250");
    expect(read("007")).toBe("7");
  });

  it("says why it can't read the rest", () => {
    expect(read("")).toBe("blank");
    expect(read("-5")).toBe("negative");
    expect(read("−5")).toBe("negative");
    expect(read("1.2.3")).toBe("unreadable");
    expect(read("12,34,567")).toBe("unreadable");
    expect(read("€100")).toBe("unreadable");
    expect(read("1,800.505")).toBe("decimals");
    expect(read("1.")).toBe("unreadable");
    expect(read(",5")).toBe("unreadable");
  });

  // Each locale's own grouping and decimal marks, as the runtime's CLDR data writes them
  // (Unicode CLDR, "Number Symbols"; Intl.NumberFormat, ECMA-402 section 16).
  const locales = ["en-US", "en-GB", "en-IN", "de-DE", "fr-FR", "es-ES", "it-IT", "nl-NL", "pt-BR", "de-CH", "sv-SE", "pl-PL"];
  it.each(locales)("reads back what %s writes for amounts with two decimals", (locale) => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999_99 }), (cents) => {
        const written = new Intl.NumberFormat(locale, { minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(cents / 100);
        // en-IN groups in twos above the thousands (12,34,567.00): outside the rule, refused rather than misread.
        if (locale === "en-IN" && cents >= 100_000_00) return readAmount(written).ok === false;
        const reading = readAmount(written);
        return reading.ok && Math.round(reading.value * 100) === cents;
      }),
    );
  });
});

describe("the schemas", () => {
  it("tells a negative budget it must be zero or more", () => {
    const result = amountTextSchema("budget").safeParse("-20");
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe("The budget must be zero or more.");
    expect(plainAmount(amountTextSchema("budget").parse("1,800.50"))).toBe("1800.50");
    expect(plainAmount("")).toBe("");
  });

  it("understands a fee typed 1,800.50 and still takes a number, keeping the decimals as typed for its currency to check", () => {
    const fee = amountDecimalTextSchema("fee", 1_000_000_000, 4);
    expect(fee.parse("1,800.50")).toBe("1800.50");
    expect(fee.parse(1800.5)).toBe("1800.5");
    expect(fee.parse(1800)).toBe("1800");
    expect(fee.parse(0.0001)).toBe("0.0001");
    expect(fee.parse(999_999_999.1234)).toBe("999999999.1234");
    expect(fee.parse(0.1 + 0.2)).toBe("0.3");
    expect(fee.parse("1,800.505")).toBe("1800.505");
    expect(fee.parse("1.800")).toBe("1.800");
    expect(fee.safeParse("1.80055").error?.issues[0]?.message).toBe("Use at most four decimals for the fee.");
    expect(fee.safeParse(1.80055).error?.issues[0]?.message).toBe("Use at most four decimals for the fee.");
    expect(fee.safeParse("eighteen hundred").error?.issues[0]?.message).toBe("Write the fee as a number, e.g. 1800.50 or 1,800.50.");
    expect(fee.safeParse(-1).error?.issues[0]?.message).toBe("The fee must be zero or more.");
    expect(fee.safeParse(2_000_000_000).error?.issues[0]?.message).toBe("That fee is too large.");
  });
});
