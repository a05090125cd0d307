import { afterAll, describe, expect, it } from "vitest";
import { dateInZone, daysBetween, isIsoDate, shiftDate } from "./dates";

// Our own derivations from the Gregorian calendar, written beside each check.

describe("calendar dates", () => {
  it("accepts real dates only", () => {
    expect(isIsoDate("2028-02-29")).toBe(true); // 2028 is a leap year
    expect(isIsoDate("2027-02-29")).toBe(false); // 2027 is not
    expect(isIsoDate("2027-13-01")).toBe(false);
    expect(isIsoDate("2027-3-1")).toBe(false);
    expect(() => shiftDate("next tuesday", 1)).toThrow(RangeError);
  });

  it("counts whole days between dates across month and year ends", () => {
    // 27 Dec 2026 → 31 Dec is 4 days, → 3 Jan 2027 is 3 more: 7.
    expect(daysBetween("2026-12-27", "2027-01-03")).toBe(7);
    // All of 2028 (a leap year): 366 days.
    expect(daysBetween("2028-01-01", "2029-01-01")).toBe(366);
    expect(daysBetween("2027-03-01", "2027-02-27")).toBe(-2); // back over 28 Feb 2027
  });

  it("gives the date in a person's own time zone", () => {
    const instant = new Date("2027-03-01T23:30:00Z");
    // Tokyo is UTC+9 all year (no daylight saving): 08:30 on 2 March.
    expect(dateInZone(instant, "Asia/Tokyo")).toBe("2027-03-02");
    // Los Angeles is UTC−8 until US summer time starts on 14 March 2027: 15:30 on 1 March.
    expect(dateInZone(instant, "America/Los_Angeles")).toBe("2027-03-01");
    expect(dateInZone(instant, "UTC")).toBe("2027-03-01");
    // An unknown zone falls back to UTC rather than failing the reminder scan.
    expect(dateInZone(instant, "Not/A_Zone")).toBe("2027-03-01");
  });
});

describe("when the process runs in another time zone", () => {
  const original = process.env.TZ;
  afterAll(() => {
    process.env.TZ = original;
  });

  for (const zone of ["America/Los_Angeles", "Asia/Tokyo", "Europe/Oslo", "UTC"]) {
    it(`then shifting dates gives the same answers in ${zone}`, () => {
      process.env.TZ = zone; // Node re-reads TZ when it changes
      // Across the EU change (28 March 2027) and the US change (14 March 2027): days stay days.
      expect(shiftDate("2027-03-29", -2)).toBe("2027-03-27");
      expect(shiftDate("2027-03-13", 2)).toBe("2027-03-15");
      // Across the autumn changes (EU 31 October, US 7 November 2027).
      expect(shiftDate("2027-10-30", 2)).toBe("2027-11-01");
      expect(shiftDate("2027-11-08", -2)).toBe("2027-11-06");
      expect(daysBetween("2027-03-01", "2027-04-01")).toBe(31);
    });
  }
});
