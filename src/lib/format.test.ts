import { describe, expect, it } from "vitest";
import { formatDay, formatDuration, formatInstant, formatInstantDay, formatInstantNamingZone, formatMoney, formatSeconds, formatSize } from "./format";

// Offsets and daylight-saving dates from the IANA time zone database (tzdata, files `asia` and
// `northamerica`): Asia/Tokyo keeps UTC+9 all year (no daylight saving since 1951); America/Los_Angeles
// is UTC−8 until the second Sunday of March at 02:00 local, then UTC−7 (US rule of the Energy Policy
// Act of 2005, sec. 110: 14 March in 2027). Asia/Kolkata is UTC+5:30 all year. Weekdays checked
// against the proleptic Gregorian calendar (GNU `date`): 5 March 2027 is a Friday.

describe("formatDay: a calendar date, the same in every zone", () => {
  it("writes weekday, day, month and year", () => {
    expect(formatDay("2027-03-05")).toBe("Fri 5 Mar 2027");
    expect(formatDay("2027-09-05")).toBe("Sun 5 Sep 2027");
  });

  it("leaves the year off where asked", () => {
    expect(formatDay("2027-02-15", { withYear: false })).toBe("Mon 15 Feb");
  });

  it("writes nothing for no date, and leaves a value that is not a date as it came", () => {
    expect(formatDay(null)).toBe("");
    expect(formatDay("")).toBe("");
    expect(formatDay("soon")).toBe("soon");
  });
});

describe("formatInstant: a moment in the reader's zone, naming the zone", () => {
  const nearMidnight = "2027-03-05T23:30:00Z";

  it("puts a moment just before UTC midnight on the next day in Tokyo", () => {
    expect(formatInstant(nearMidnight, "Asia/Tokyo")).toBe("Sat 6 Mar 2027, 08:30 UTC+9");
  });

  it("puts the same moment in the afternoon of the same day in Los Angeles", () => {
    expect(formatInstant(nearMidnight, "America/Los_Angeles")).toBe("Fri 5 Mar 2027, 15:30 UTC-8");
  });

  it("follows daylight saving: Los Angeles is UTC−7 after 14 March 2027", () => {
    expect(formatInstant("2027-03-15T06:30:00Z", "America/Los_Angeles")).toBe("Sun 14 Mar 2027, 23:30 UTC-7");
  });

  it("names half-hour offsets and UTC itself", () => {
    expect(formatInstant(nearMidnight, "Asia/Kolkata")).toBe("Sat 6 Mar 2027, 05:00 UTC+5:30");
    expect(formatInstant(nearMidnight, "UTC")).toBe("Fri 5 Mar 2027, 23:30 UTC");
  });

  it("falls back to UTC, and says so, for a zone name it doesn't know", () => {
    expect(formatInstant(nearMidnight, "Mars/Olympus_Mons")).toBe("Fri 5 Mar 2027, 23:30 UTC");
  });

  it("gives only the day where the time of day doesn't matter, still in the reader's zone", () => {
    expect(formatInstantDay(nearMidnight, "Asia/Tokyo")).toBe("Sat 6 Mar 2027");
    expect(formatInstantDay(nearMidnight, "America/Los_Angeles")).toBe("Fri 5 Mar 2027");
  });
});

describe("formatInstantNamingZone: for a reader who may not know the zone, its name too", () => {
  const nearMidnight = "2027-03-05T23:30:00Z";
  // Europe/Berlin is UTC+1 in winter, UTC+2 from the last Sunday of March (tzdata file `europe`, EU rule
  // of Directive 2000/84/EC): 12 Dec 2026 is in winter; 12 Dec 2026 is a Saturday (GNU `date`).
  it("writes the offset and the zone's name", () => {
    expect(formatInstantNamingZone("2026-12-12T17:00:00Z", "Europe/Berlin")).toBe("Sat 12 Dec 2026, 18:00 UTC+1 (Europe/Berlin)");
    expect(formatInstantNamingZone(nearMidnight, "Asia/Kolkata")).toBe("Sat 6 Mar 2027, 05:00 UTC+5:30 (Asia/Kolkata)");
  });

  it("lets UTC name itself, and an unknown zone falls back to UTC without borrowing its name", () => {
    expect(formatInstantNamingZone(nearMidnight, "UTC")).toBe("Fri 5 Mar 2027, 23:30 UTC");
    expect(formatInstantNamingZone(nearMidnight, "Mars/Olympus_Mons")).toBe("Fri 5 Mar 2027, 23:30 UTC");
  });
});

describe("formatDuration: two largest units, the smaller in two digits", () => {
  const s = 1000;
  const min = 60 * s;
  const h = 60 * min;

  it("writes hours and minutes, minutes and seconds, or seconds", () => {
    expect(formatDuration(h + 5 * min + 40 * s)).toBe("1 h 05 min");
    expect(formatDuration(4 * min + 7 * s)).toBe("4 min 07 s");
    expect(formatDuration(45 * s)).toBe("45 s");
    expect(formatDuration(0)).toBe("0 s");
  });

  it("leaves off a smaller unit that is zero", () => {
    expect(formatDuration(2 * min)).toBe("2 min");
    expect(formatDuration(3 * h + 20 * s)).toBe("3 h");
  });

  it("rounds to the nearest second", () => {
    expect(formatDuration(59_600)).toBe("1 min");
    expect(formatDuration(1_499)).toBe("1 s");
  });

  it("counts whole hours and days for a stay, and says when it was under an hour", () => {
    expect(formatDuration(3 * 24 * h + 4 * h + 50 * min, { smallest: "h" })).toBe("3 d 4 h");
    expect(formatDuration(5 * h + 59 * min, { smallest: "h" })).toBe("5 h");
    expect(formatDuration(2 * 24 * h, { smallest: "h" })).toBe("2 d");
    expect(formatDuration(59 * min, { smallest: "h" })).toBe("under 1 h");
  });

  it("writes seconds of a read the same way, with a minus sign when short", () => {
    expect(formatSeconds(62)).toBe("1 min 02 s");
    expect(formatSeconds(60)).toBe("1 min");
    expect(formatSeconds(-8)).toBe("−8 s");
  });
});

describe("formatSize: binary units", () => {
  // 1 KiB = 1024 bytes, 1 MiB = 1024² bytes (IEC 80000-13:2008, binary prefixes).
  it("writes bytes, KiB, MiB and GiB, with one decimal below ten", () => {
    expect(formatSize(512)).toBe("512 B");
    expect(formatSize(812 * 1024)).toBe("812 KiB");
    expect(formatSize(Math.round(8.5 * 1024 * 1024))).toBe("8.5 MiB");
    expect(formatSize(Math.round(12.4 * 1024 * 1024))).toBe("12 MiB");
    expect(formatSize(3.1 * 1024 ** 3)).toBe("3.1 GiB");
  });
});

describe("formatMoney: the amount with its currency", () => {
  it("writes the currency's sign and its usual decimals", () => {
    expect(formatMoney(1800.5, "EUR")).toBe("€1,800.50");
    expect(formatMoney("250", "USD")).toBe("US$250.00");
    // The yen has no minor unit in use (ISO 4217 lists 0 decimals for JPY).
    expect(formatMoney(2750, "JPY")).toBe("JP¥2,750");
  });

  it("writes an unknown currency code after the amount", () => {
    expect(formatMoney(12, "XX")).toBe("12.00 XX");
  });
});
