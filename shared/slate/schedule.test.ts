import fc from "fast-check";
import { afterEach, describe, expect, it } from "vitest";
import { addWorkingDays, lastWorkingDayOnOrBefore, localDate, parseIsoDate } from "./dates";
import { countBack, currentStageDue, defaultStageLengths, episodeRisks, publishDateOf, scheduleRisks, stageDueDateOf, stageLengthsSchema, type StageLengths } from "./schedule";
import { stages } from "./stages";

/*
 * Check values are our own derivations, counted by hand on a calendar. Weekdays come from the
 * proleptic Gregorian calendar as printed by Python's `calendar.month(2027, 2)` and friends
 * (e.g. 1 March 2027 is a Monday, 29 February 2028 a Tuesday). Each derivation is written beside
 * its check; "WD" means working day (Monday to Friday).
 */
const lengths = defaultStageLengths; // challenge 3, test plan 4, build 10, shoot 3, edit 7, sponsor read 3, publish 1

const lengthsArbitrary = fc
  .tuple(...stages.map(() => fc.integer({ min: 1, max: 30 })))
  .map((days) => Object.fromEntries(stages.map((stage, i) => [stage, days[i]!])) as StageLengths);

const dueDates = (rows: ReturnType<typeof countBack>) => Object.fromEntries(rows.map((r) => [r.stage, r.due]));
const startDates = (rows: ReturnType<typeof countBack>) => Object.fromEntries(rows.map((r) => [r.stage, r.start]));

describe("working-day arithmetic", () => {
  it("when counting back over a weekend, then Saturday and Sunday are skipped", () => {
    // Mon 1 Mar 2027 minus 1 WD: Sun 28 Feb and Sat 27 Feb are skipped, so Fri 26 Feb.
    expect(addWorkingDays("2027-03-01", -1)).toBe("2027-02-26");
    // Fri 5 Mar 2027 plus 1 WD: Sat 6 and Sun 7 skipped, so Mon 8 Mar.
    expect(addWorkingDays("2027-03-05", 1)).toBe("2027-03-08");
    // Mon 1 Mar 2027 minus 5 WD is a whole week: Mon 22 Feb.
    expect(addWorkingDays("2027-03-01", -5)).toBe("2027-02-22");
  });

  it("when a date falls on a weekend, then the last working day on or before it is the Friday", () => {
    expect(lastWorkingDayOnOrBefore("2027-10-31")).toBe("2027-10-29"); // Sun 31 Oct 2027 → Fri 29 Oct
    expect(lastWorkingDayOnOrBefore("2027-10-30")).toBe("2027-10-29"); // Sat 30 Oct 2027 → Fri 29 Oct
    expect(lastWorkingDayOnOrBefore("2027-10-29")).toBe("2027-10-29"); // a Friday stays
  });

  it("when a date is not on the calendar, then it is refused", () => {
    expect(() => parseIsoDate("2027-02-29")).toThrow(RangeError); // 2027 is not a leap year
    expect(() => parseIsoDate("2027-13-01")).toThrow(RangeError);
    expect(() => parseIsoDate("1 March 2027")).toThrow(RangeError);
    expect(parseIsoDate("2028-02-29").getDate()).toBe(29); // 2028 is (divisible by 4, not by 100)
  });
});

describe("counting the stages back from the publish date", () => {
  it("when the episode publishes on Friday 5 March 2027, then every due date follows by hand", () => {
    const rows = countBack("2027-03-05", lengths);
    expect(dueDates(rows)).toEqual({
      publish: "2027-03-05", //      the target date itself; publish takes Fri 5 Mar (1 WD)
      sponsor_read: "2027-03-04", // WD before Fri 5 Mar = Thu 4 Mar; takes Tue 2, Wed 3, Thu 4 (3 WD)
      edit: "2027-03-01", //         WD before Tue 2 Mar = Mon 1 Mar; takes Mon 1 Mar, Fri 26, Thu 25, Wed 24, Tue 23, Mon 22, Fri 19 Feb (7 WD, across the month end)
      shoot: "2027-02-18", //        WD before Fri 19 Feb = Thu 18 Feb; takes Thu 18, Wed 17, Tue 16 (3 WD)
      build: "2027-02-15", //        WD before Tue 16 Feb = Mon 15 Feb; takes 15, 12, 11, 10, 9, 8, 5, 4, 3, 2 Feb (10 WD)
      test_plan: "2027-02-01", //    WD before Tue 2 Feb = Mon 1 Feb; takes Mon 1 Feb, Fri 29, Thu 28, Wed 27 Jan (4 WD)
      challenge: "2027-01-26", //    WD before Wed 27 Jan = Tue 26 Jan; takes Tue 26, Mon 25, Fri 22 Jan (3 WD)
    });
    expect(startDates(rows)).toEqual({
      challenge: "2027-01-22", // Fri 22 Jan, the first of its 3 WD
      test_plan: "2027-01-27",
      build: "2027-02-02",
      shoot: "2027-02-16",
      edit: "2027-02-19",
      sponsor_read: "2027-03-02",
      publish: "2027-03-05",
    });
    expect(rows.every((r) => !r.overridden && r.due === r.countedDue)).toBe(true);
  });

  it("when the publish date is a Sunday, then the stage before counts from the Friday", () => {
    // Sun 31 Oct 2027: publish's 1 WD is Fri 29 Oct, so sponsor read is due Thu 28 Oct,
    // takes Thu 28, Wed 27, Tue 26 Oct, and edit is due Mon 25 Oct.
    const due = dueDates(countBack("2027-10-31", lengths));
    expect(due.publish).toBe("2027-10-31");
    expect(due.sponsor_read).toBe("2027-10-28");
    expect(due.edit).toBe("2027-10-25");
  });

  it("when counting back over the end of February in a leap year, then the 29th counts", () => {
    // Wed 1 Mar 2028: publish takes Wed 1 Mar; sponsor read is due Tue 29 Feb 2028 and takes
    // Tue 29, Mon 28, Fri 25 Feb; edit is due Thu 24 Feb.
    const due = dueDates(countBack("2028-03-01", lengths));
    expect(due.sponsor_read).toBe("2028-02-29");
    expect(due.edit).toBe("2028-02-24");
  });

  it("when counting back over the end of the year, then December follows January", () => {
    // Mon 4 Jan 2027: publish takes Mon 4 Jan; sponsor read is due Fri 1 Jan 2027 (Kerf knows no
    // public holidays) and takes Fri 1 Jan, Thu 31 Dec, Wed 30 Dec 2026; edit is due Tue 29 Dec 2026.
    const due = dueDates(countBack("2027-01-04", lengths));
    expect(due.sponsor_read).toBe("2027-01-01");
    expect(due.edit).toBe("2026-12-29");
  });

  it("when the publish date moves a week later, then every due date moves a week later", () => {
    // Five WD are a whole week, so each date shifts by 7 calendar days: Fri 12 Mar 2027 from Fri 5 Mar.
    const before = dueDates(countBack("2027-03-05", lengths));
    const after = dueDates(countBack("2027-03-12", lengths));
    expect(after.build).toBe("2027-02-22"); // Mon 15 Feb + 7 days
    expect(after.challenge).toBe("2027-02-02"); // Tue 26 Jan + 7 days
    expect(after.edit).toBe("2027-03-08"); // Mon 1 Mar + 7 days
    expect(Object.keys(before)).toEqual(Object.keys(after));
  });

  it("when one due date is overridden, then only that date changes", () => {
    const rows = countBack("2027-03-05", lengths, { build: "2027-02-26" });
    const build = rows.find((r) => r.stage === "build")!;
    expect(build).toMatchObject({ due: "2027-02-26", countedDue: "2027-02-15", overridden: true });
    expect(dueDates(rows).shoot).toBe("2027-02-18");
    expect(dueDates(rows).test_plan).toBe("2027-02-01");
    // Shoot starts the WD after build's due date in force: Fri 26 Feb → Mon 1 Mar.
    expect(startDates(rows).shoot).toBe("2027-03-01");
  });

  it("when the publish stage is given an override, then the target date still rules", () => {
    const rows = countBack("2027-03-05", lengths, { publish: "2027-03-09" });
    expect(dueDates(rows).publish).toBe("2027-03-05");
  });

  it("when only the current stage is asked for, then it matches the full countback", () => {
    fc.assert(
      fc.property(fc.date({ min: new Date(2020, 0, 1), max: new Date(2040, 0, 1), noInvalidDate: true }), lengthsArbitrary, fc.constantFrom(...stages), (date, ls, stage) => {
        const target = localDate(date, "UTC");
        const full = countBack(target, ls).find((r) => r.stage === stage)!;
        expect(currentStageDue(target, ls, stage)).toBe(full.due);
      }),
    );
  });
});

describe("risk", () => {
  const plan = countBack("2027-03-05", lengths); // build due Mon 15 Feb 2027 (derived above)

  it("when today is the due date, then the stage is not late yet", () => {
    expect(scheduleRisks(plan, "build", "2027-02-01", "2027-02-15")).toEqual([]);
  });

  it("when today is past the current stage's due date, then it is overdue", () => {
    expect(scheduleRisks(plan, "build", "2027-02-01", "2027-02-16")).toEqual([{ code: "stage_overdue", stage: "build", date: "2027-02-15" }]);
  });

  it("when the stage began after it was already due, then the plan needed a date in the past", () => {
    expect(scheduleRisks(plan, "build", "2027-02-20", "2027-02-22")).toEqual([{ code: "plan_in_past", stage: "build", date: "2027-02-15" }]);
  });

  it("when an override pushes the current stage late, then a stage ahead that should have started is named", () => {
    // Build moved to Fri 26 Feb; edit still counts back to start Fri 19 Feb, before Mon 22 Feb.
    const pushed = countBack("2027-03-05", lengths, { build: "2027-02-26" });
    expect(scheduleRisks(pushed, "build", "2027-02-02", "2027-02-22")).toEqual([{ code: "plan_in_past", stage: "edit", date: "2027-02-19" }]);
  });

  it("when an episode is in publish, then its date passing raises no risk", () => {
    expect(scheduleRisks(plan, "publish", "2027-03-01", "2027-04-01")).toEqual([]);
  });

  it("when the board's shortcut is used, then it agrees with the full plan", () => {
    const day = fc.date({ min: new Date(2025, 0, 1), max: new Date(2030, 0, 1), noInvalidDate: true }).map((d) => localDate(d, "UTC"));
    fc.assert(
      fc.property(day, day, day, lengthsArbitrary, fc.constantFrom(...stages), fc.boolean(), (target, entered, today, ls, stage, withOverride) => {
        const overrides = withOverride ? { shoot: entered } : {};
        const full = scheduleRisks(countBack(target, ls, overrides), stage, entered, today);
        expect(episodeRisks({ targetPublishDate: target, stage, dueOverrides: overrides }, ls, entered, today)).toEqual(full);
      }),
    );
  });
});

describe("what other features read", () => {
  it("when an episode has a target date, then that is its publish date and the stages count from it", () => {
    expect(publishDateOf({ targetPublishDate: "2027-03-05" })).toBe("2027-03-05");
    expect(publishDateOf({ targetPublishDate: null })).toBeNull();
    expect(stageDueDateOf({ targetPublishDate: "2027-03-05" }, "sponsor_read")).toBe("2027-03-04");
    expect(stageDueDateOf({ targetPublishDate: "2027-03-05", dueOverrides: { sponsor_read: "2027-03-03" } }, "sponsor_read")).toBe("2027-03-03");
    expect(stageDueDateOf({ targetPublishDate: null }, "edit")).toBeNull();
  });

  it("when stage lengths are out of range, then each stage gets its own message", () => {
    const result = stageLengthsSchema.safeParse({ ...defaultStageLengths, build: 0, edit: 2.5 });
    expect(result.success).toBe(false);
    const paths = result.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(["build", "edit"]);
  });
});

describe("in other time zones", () => {
  const originalZone = process.env.TZ;
  afterEach(() => {
    process.env.TZ = originalZone;
  });

  // Daylight saving starts in the US on Sun 14 Mar 2027 (second Sunday of March, 15 U.S.C. 260a)
  // and in the EU on Sun 28 Mar 2027 (last Sunday of March, Directive 2000/84/EC).
  for (const zone of ["America/Los_Angeles", "Asia/Tokyo", "Europe/Oslo", "Pacific/Auckland"]) {
    it(`when the process runs in ${zone}, then the countback gives the same dates`, () => {
      process.env.TZ = "UTC";
      const inUtc = countBack("2027-03-30", lengths);
      process.env.TZ = zone;
      expect(countBack("2027-03-30", lengths)).toEqual(inUtc);
      expect(addWorkingDays("2027-03-15", -1)).toBe("2027-03-12"); // Mon 15 Mar → Fri 12 Mar, over the US change
    });
  }

  it("when an instant is read in a member's zone, then its calendar date is that zone's", () => {
    // 07:30 UTC on 1 Mar 2027 is 23:30 on 28 Feb in Los Angeles (PST, UTC−8) and 16:30 on 1 Mar in
    // Tokyo (JST, UTC+9): offsets from the IANA time zone database.
    const instant = new Date("2027-03-01T07:30:00Z");
    expect(localDate(instant, "America/Los_Angeles")).toBe("2027-02-28");
    expect(localDate(instant, "Asia/Tokyo")).toBe("2027-03-01");
    expect(localDate(new Date("2027-02-28T16:00:00Z"), "Asia/Tokyo")).toBe("2027-03-01");
    expect(localDate(instant, "Not/AZone")).toBe("2027-03-01");
  });
});
