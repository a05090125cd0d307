import { describe, expect, it } from "vitest";
import { addDays, addMonths, isoWeekday, monthGrid, startOfWeek, weekDays } from "./days";

// Weekdays checked against ISO 8601-1:2019, 2.2.8 (weeks begin on Monday) and a printed calendar:
// 1 May 2031 is a Thursday, 29 February 2032 a Sunday (2032 is a leap year: divisible by 4, not by 100).
describe("calendar days", () => {
  it("numbers weekdays Monday 1 to Sunday 7", () => {
    expect(isoWeekday("2031-05-01")).toBe(4);
    expect(isoWeekday("2032-02-29")).toBe(7);
    expect(startOfWeek("2032-02-29")).toBe("2032-02-23");
  });

  it("shows a month as six Monday-first weeks that hold its first day", () => {
    const grid = monthGrid("2031-05-16");
    expect(grid).toHaveLength(42);
    expect(grid[0]).toBe("2031-04-28");
    expect(grid[3]).toBe("2031-05-01");
    expect(grid[41]).toBe("2031-06-08");
  });

  it("steps over month ends, leap days and clock changes without losing a day", () => {
    expect(addDays("2032-02-28", 1)).toBe("2032-02-29");
    expect(addDays("2031-03-29", 2)).toBe("2031-03-31");
    expect(addMonths("2031-01-31", 1)).toBe("2031-02-01");
    expect(addMonths("2031-12-15", 1)).toBe("2032-01-01");
    expect(weekDays("2031-05-16")).toEqual(["2031-05-12", "2031-05-13", "2031-05-14", "2031-05-15", "2031-05-16", "2031-05-17", "2031-05-18"]);
  });
});
