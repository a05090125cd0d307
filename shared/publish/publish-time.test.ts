import { describe, expect, it } from "vitest";
import { instantOfWallTime, wallTimeOf } from "./publish-time";

// IANA tz database (europe file): Europe/Oslo is UTC+1 in winter and UTC+2 from the last Sunday of
// March (EU summer-time rule, Directive 2000/84/EC, Article 2); America/New_York is UTC−5 / UTC−4.
describe("publish time in a zone", () => {
  it("reads a wall time in the zone", () => {
    expect(instantOfWallTime("2027-03-05T17:00", "Europe/Oslo")?.toISOString()).toBe("2027-03-05T16:00:00.000Z");
    expect(instantOfWallTime("2027-07-05T17:00", "Europe/Oslo")?.toISOString()).toBe("2027-07-05T15:00:00.000Z");
    expect(instantOfWallTime("2027-03-05T12:00", "America/New_York")?.toISOString()).toBe("2027-03-05T17:00:00.000Z");
  });
  it("writes an instant back as the zone's wall time", () => {
    expect(wallTimeOf(new Date("2027-03-05T16:00:00Z"), "Europe/Oslo")).toBe("2027-03-05T17:00");
  });
  it("refuses other text", () => expect(instantOfWallTime("tomorrow", "UTC")).toBeNull());
});
