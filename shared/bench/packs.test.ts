import { describe, expect, it } from "vitest";
import { cellsFromLabel, checkPackMinimum, checkPackRating, checkVoltageRating, lipoPack } from "./packs";

const volts = (value: number) => ({ value, unit: "V" });

describe("a lithium-polymer pack by cell count", () => {
  it("gives nominal, full and minimum voltages for n cells in series", () => {
    // Common practice (retailer and maker guides; no standard text): 3.7 V nominal, 4.2 V full,
    // about 3.0 V minimum a cell. A 3S pack is 11.1 V nominal and a 6S pack 22.2 V.
    // Own derivations: 3 × 4.2 = 12.6 V full; 3 × 3.0 = 9.0 V minimum.
    expect(lipoPack(3)).toMatchObject({ label: "3S", nominal: volts(11.1), full: volts(12.6), minimum: volts(9) });
    expect(lipoPack(6).nominal).toEqual(volts(22.2));
    // Own derivations: 1S = 3.7 / 4.2 / 3.0 V; 14S = 14 × 3.7 = 51.8 V, 14 × 4.2 = 58.8 V, 14 × 3.0 = 42 V.
    expect(lipoPack(1)).toMatchObject({ nominal: volts(3.7), full: volts(4.2), minimum: volts(3) });
    expect(lipoPack(14)).toMatchObject({ nominal: volts(51.8), full: volts(58.8), minimum: volts(42) });
  });

  it("carries a caution that defers to the maker and local rules", () => {
    expect(lipoPack(3).caution).toMatch(/maker's ratings and your local rules/);
  });

  it("refuses cell counts outside 1 to 14", () => {
    expect(() => lipoPack(0)).toThrow(RangeError);
    expect(() => lipoPack(15)).toThrow("A LiPo pack has 1 to 14 cells in series, not 15");
    expect(() => lipoPack(2.5)).toThrow(RangeError);
  });

  it("reads labels such as 3S", () => {
    expect(cellsFromLabel("3S")).toBe(3);
    expect(cellsFromLabel(" 6s ")).toBe(6);
    expect(cellsFromLabel("15S")).toBeUndefined();
    expect(cellsFromLabel("S")).toBeUndefined();
  });
});

describe("over-rating", () => {
  it("when the supply is above the part's rated voltage, then it flags the run with a caution", () => {
    // Own derivation: 12.6 V − 12 V = 0.6 V over.
    const check = checkVoltageRating(volts(12.6), volts(12));
    expect(check).toMatchObject({ status: "over_rated", overBy: volts(0.6) });
    if (check.status !== "over_rated") throw new Error("expected over_rated");
    expect(check.caution).toContain("The supply of 12.6 V is above the part's rated 12 V");
    expect(check.caution).toContain("manufacturer's ratings, local codes and licensed practice");
  });

  it("compares across prefixes and lets a supply equal to the rating through", () => {
    // SI Brochure (9th ed., 2019), section 3, Table 7: 12 600 mV = 12.6 V.
    expect(checkVoltageRating({ value: 12600, unit: "mV" }, volts(12)).status).toBe("over_rated");
    expect(checkVoltageRating(volts(12), volts(12)).status).toBe("within_rating");
    expect(checkVoltageRating(volts(11.1), volts(12)).status).toBe("within_rating");
  });

  it("when the part has no rating, or the rating is not a voltage, then it says so", () => {
    expect(checkVoltageRating(volts(11.1), undefined).status).toBe("no_rating");
    expect(checkVoltageRating(volts(11.1), { value: 12, unit: "A" })).toMatchObject({ status: "unit_problem" });
  });

  it("judges a pack at full charge, not at its nominal voltage", () => {
    // Common practice: a 3S pack is 11.1 V nominal but 3 × 4.2 = 12.6 V full, above a 12 V rating.
    expect(checkPackRating(3, volts(12)).status).toBe("over_rated");
    expect(checkPackRating(3, volts(12.6)).status).toBe("within_rating");
  });

  it("flags a pack run below about 3.0 V a cell", () => {
    // Common practice: about 3.0 V a cell minimum, so 9.0 V for 3S (own derivation, 3 × 3.0).
    expect(checkPackMinimum(3, volts(8.9)).status).toBe("below_minimum");
    expect(checkPackMinimum(3, volts(9)).status).toBe("above_minimum");
    expect(checkPackMinimum(3, { value: 9, unit: "A" }).status).toBe("unit_problem");
  });
});
