import { describe, expect, it } from "vitest";
import type { CalendarEntry } from "./entries";
import { findConflicts, movedEntries, newConflictMessages } from "./conflicts";

const entry = (over: Partial<CalendarEntry>): CalendarEntry => ({
  key: "k",
  kind: "publish",
  title: "t",
  detail: "",
  day: "2031-05-16",
  at: null,
  zone: null,
  episodeId: null,
  episodeTitle: null,
  sponsorId: null,
  sponsorName: null,
  people: [],
  href: "/",
  fee: null,
  episodeVersion: null,
  ...over,
});

// Product rules of Kerf's own (no outside source): what a producer calls a clash.
describe("calendar conflicts", () => {
  it("marks two episodes publishing on one day, not one episode's day and release time", () => {
    const a = entry({ key: "publish:a", episodeId: "a", episodeTitle: "A" });
    const aTimed = entry({ key: "release:a", kind: "release", episodeId: "a", episodeTitle: "A" });
    expect(findConflicts([a, aTimed], [])).toEqual({});
    const b = entry({ key: "publish:b", episodeId: "b", episodeTitle: "B" });
    expect(findConflicts([a, b], [])["publish:a"]).toEqual(["Another episode publishes this day too: “B”."]);
  });

  it("marks a shoot day after its shoot stage is due, even when the due date is outside the days shown", () => {
    const shoot = entry({ key: "shoot:1", kind: "shoot", episodeId: "a", day: "2031-05-14" });
    const due = entry({ key: "stage_due:a:shoot", kind: "stage_due", episodeId: "a", day: "2031-05-01" });
    expect(findConflicts([shoot], [], [shoot, due])["shoot:1"]).toEqual(["Shoots after the shoot stage is due (Thu 1 May 2031)."]);
  });

  it("marks a member on two shoot days of one date by name", () => {
    const one = entry({ key: "shoot:1", kind: "shoot", people: ["p"] });
    const two = entry({ key: "shoot:2", kind: "shoot", people: ["p", "q"] });
    const conflicts = findConflicts([one, two], [{ id: "p", name: "Pat" }]);
    expect(conflicts["shoot:2"]).toEqual(["Pat is booked on two shoot days this day."]);
  });

  it("lists what moved, appeared or went, and only the new conflict messages", () => {
    const before = [entry({ key: "x", day: "2031-05-16" }), entry({ key: "y", day: "2031-05-10" })];
    const after = [entry({ key: "x", day: "2031-05-23" }), entry({ key: "z", day: "2031-05-20" })];
    expect(movedEntries(before, after).map((m) => [m.key, m.from, m.to])).toEqual([
      ["y", "2031-05-10", null],
      ["z", null, "2031-05-20"],
      ["x", "2031-05-16", "2031-05-23"],
    ]);
    expect(newConflictMessages({ a: ["old"] }, { a: ["old", "new"] })).toEqual(["new"]);
  });
});
