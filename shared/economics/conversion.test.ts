import { describe, expect, it } from "vitest";
import { convertMinor, divideRounded, hoursMinor, lineMinor, rateMillionths, readMinutes } from "./conversion";

describe("rates as members enter them", () => {
  it("reads up to six decimals, as the euro's fixed rates were given (Council Regulation (EC) No 2866/98, Article 1: 1 EUR = 1.95583 DEM)", () => {
    expect(rateMillionths("1.95583")).toBe(1955830n);
    expect(rateMillionths("0.000001")).toBe(1n);
  });
  it("refuses zero, negatives, seven decimals and words", () => {
    for (const bad of ["0", "0.000000", "-1", "1.0000001", "about 1", ""]) expect(rateMillionths(bad)).toBeNull();
  });
});

describe("rounding to the minor unit", () => {
  // Council Regulation (EC) No 1103/97, Article 5: to the nearest cent, a result of exactly half rounded up.
  it("rounds a half up and anything less down", () => {
    expect(divideRounded(5n, 10n)).toBe(1n);
    expect(divideRounded(4n, 10n)).toBe(0n);
    expect(divideRounded(15n, 10n)).toBe(2n);
    expect(divideRounded(-15n, 10n)).toBe(-2n);
  });
});

describe("converting into the channel's currency", () => {
  it("converts 100.00 EUR at 1.95583 into 195.58 DEM (195.583 rounded to the pfennig; rate from Council Regulation (EC) No 2866/98)", () => {
    expect(convertMinor(10000, "EUR", "DEM", "1.95583")).toBe(19558);
  });
  it("takes each currency's exponent from ISO 4217 (Table A.1: JPY 0, EUR 2, KWD 3)", () => {
    // 100 yen at 0.0062 EUR a yen is 0.62 EUR.
    expect(convertMinor(100, "JPY", "EUR", "0.0062")).toBe(62);
    // 1.000 KWD (1000 fils) at 3.25 EUR is 3.25 EUR.
    expect(convertMinor(1000, "KWD", "EUR", "3.25")).toBe(325);
    // 1.00 EUR at 0.3077 KWD is 0.3077 KWD: 307.7 fils, 308 to the fils.
    expect(convertMinor(100, "EUR", "KWD", "0.3077")).toBe(308);
    // 12.34 EUR at 161.5 JPY is 1992.91 yen: 1993 yen.
    expect(convertMinor(1234, "EUR", "JPY", "161.5")).toBe(1993);
  });
  it("leaves an amount in the channel's own currency as it is, whatever rate is given", () => {
    expect(convertMinor(180050, "EUR", "EUR", "2")).toBe(180050);
  });
});

describe("parts, hours", () => {
  it("multiplies whole quantities by whole prices", () => {
    expect(lineMinor(3, 1250)).toBe(3750);
  });
  it("costs minutes at an hourly rate to the nearest minor unit", () => {
    expect(hoursMinor(90, 4000)).toBe(6000);
    expect(hoursMinor(1, 4000)).toBe(67); // 66.67 cents
  });
  it("reads hours typed as a decimal or as hours and minutes", () => {
    expect(readMinutes("2.5")).toBe(150);
    expect(readMinutes("2,25")).toBe(135);
    expect(readMinutes("0:45")).toBe(45);
    expect(readMinutes("0")).toBeNull();
    expect(readMinutes("1:75")).toBeNull();
    expect(readMinutes("two")).toBeNull();
  });
});
