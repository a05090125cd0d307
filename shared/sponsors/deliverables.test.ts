import { describe, expect, it } from "vitest";
import {
  type MovableItem,
  type TemplateItem,
  deskGroupOf,
  dueDateFor,
  followedDueDates,
  generateDeliverables,
  latenessOf,
  pairedByTemplate,
  reminderFor,
} from "./deliverables";

// Every check value below is our own derivation from the Gregorian calendar (ISO 8601 dates): the
// leap-year rule is "divisible by 4, except centuries, except centuries divisible by 400". The
// counting is written beside each check so a reader can redo it by hand.

const item = (anchor: TemplateItem["anchor"], offsetDays: number, kind: TemplateItem["kind"] = "other"): TemplateItem => ({
  kind,
  title: `${kind} ${anchor} ${offsetDays}`,
  anchor,
  offsetDays,
  ownerRole: null,
});

describe("due dates from a template", () => {
  it("counts back from the publish date across a month end in a common year", () => {
    // 2027 is not a leap year (2027 ÷ 4 leaves 3): 2 March − 1 = 1 March, − 2 = 28 Feb, − 3 = 27 Feb.
    expect(dueDateFor(item("before_publish", 3), { publishDate: "2027-03-02", goLiveDate: null })).toBe("2027-02-27");
  });

  it("counts back into 29 February in a leap year, and not in a century that isn't one", () => {
    // 2028 ÷ 4 = 507: leap year, so the day before 1 March is 29 February.
    expect(dueDateFor(item("before_publish", 1), { publishDate: "2028-03-01", goLiveDate: null })).toBe("2028-02-29");
    // 2100 is divisible by 100 but not by 400: not a leap year, so the day before 1 March is 28 February.
    expect(dueDateFor(item("before_publish", 1), { publishDate: "2100-03-01", goLiveDate: null })).toBe("2100-02-28");
    // 2000 is divisible by 400: a leap year.
    expect(dueDateFor(item("before_publish", 1), { publishDate: "2000-03-01", goLiveDate: null })).toBe("2000-02-29");
  });

  it("counts back across a year end", () => {
    // 10 January − 10 days = 31 December; 11 more days back = 20 December 2026.
    expect(dueDateFor(item("before_publish", 21), { publishDate: "2027-01-10", goLiveDate: null })).toBe("2026-12-20");
  });

  it("counts forward from go-live across February", () => {
    // 31 January + 28 days = 28 February 2027; + 2 more = 2 March 2027.
    expect(dueDateFor(item("after_go_live", 30), { publishDate: "2027-01-31", goLiveDate: null })).toBe("2027-03-02");
    // 31 May + 30 days: June has 30 days, so 30 June.
    expect(dueDateFor(item("after_go_live", 30), { publishDate: "2027-05-31", goLiveDate: null })).toBe("2027-06-30");
  });

  it("counts from the deal's own go-live date when it has one", () => {
    // go-live 15 April + 30 = 15 May (April has 30 days).
    expect(dueDateFor(item("after_go_live", 30), { publishDate: "2027-03-02", goLiveDate: "2027-04-15" })).toBe("2027-05-15");
  });

  it("keeps calendar days through daylight-saving changes", () => {
    // EU summer time 2027 starts on Sunday 28 March; US on Sunday 14 March. A date is a date:
    // 29 March − 2 = 27 March, and 15 March − 1 = 14 March, whatever the process's zone.
    expect(dueDateFor(item("before_publish", 2), { publishDate: "2027-03-29", goLiveDate: null })).toBe("2027-03-27");
    expect(dueDateFor(item("before_publish", 1), { publishDate: "2027-03-15", goLiveDate: null })).toBe("2027-03-14");
  });

  it("when the episode has no publish date, then the items have no date yet", () => {
    const generated = generateDeliverables([item("before_publish", 7), item("after_go_live", 30)], { publishDate: null, goLiveDate: null });
    expect(generated.map((g) => g.dueDate)).toEqual([null, null]);
  });

  it("links each approval item to the item it approves, by the template's positions", () => {
    const paired = pairedByTemplate([{ approves: null }, { approves: 0 }, { approves: 2 }, { approves: 9 }], ["a", "b", "c", "d"]);
    // Pointing at itself or past the end pairs with nothing.
    expect(paired.map((p) => [p.id, p.approvesId])).toEqual([
      ["a", null],
      ["b", "a"],
      ["c", null],
      ["d", null],
    ]);
  });

  it("keeps the template's order as positions", () => {
    const generated = generateDeliverables([item("before_publish", 14), item("before_publish", 7)], { publishDate: "2027-06-30", goLiveDate: null });
    expect(generated.map((g) => [g.position, g.dueDate])).toEqual([
      [0, "2027-06-16"], // 30 June − 14 = 16 June
      [1, "2027-06-23"], // 30 June − 7 = 23 June
    ]);
  });
});

describe("when the publish date moves", () => {
  const items: MovableItem[] = [
    { id: "script", anchor: "before_publish", offsetDays: 21, status: "not_started", dueDate: "2027-02-09" },
    { id: "approved", anchor: "before_publish", offsetDays: 14, status: "approved", dueDate: "2027-02-16" },
    { id: "done", anchor: "before_publish", offsetDays: 10, status: "done", dueDate: "2027-02-20" },
    { id: "fixed", anchor: "fixed", offsetDays: 0, fixedDate: "2027-02-25", status: "not_started", dueDate: "2027-02-25" },
    { id: "report", anchor: "after_go_live", offsetDays: 30, status: "sent", dueDate: "2027-04-01" },
  ];

  it("then open items follow by their offsets and done, approved and fixed items stay", () => {
    // Publish moves from 2 March to 5 April 2027.
    const changes = followedDueDates(items, { publishDate: "2027-04-05", goLiveDate: null });
    expect(changes).toEqual([
      // 5 April − 21 days: 5 April − 5 = 31 March, − 16 more = 15 March.
      { id: "script", from: "2027-02-09", to: "2027-03-15" },
      // 5 April + 30 days: April has 30 days, so 5 May.
      { id: "report", from: "2027-04-01", to: "2027-05-05" },
    ]);
  });

  it("then items counted from a go-live of the deal's own do not move", () => {
    const changes = followedDueDates(items, { publishDate: "2027-04-05", goLiveDate: "2027-03-02" });
    // The report stays at go-live (2 March) + 30 = 1 April: unchanged, so not listed.
    expect(changes.map((c) => c.id)).toEqual(["script"]);
  });

  it("then moving back to the old date gives the old dates again", () => {
    const moved = followedDueDates(items, { publishDate: "2027-04-05", goLiveDate: null });
    const after = items.map((i) => ({ ...i, dueDate: moved.find((c) => c.id === i.id)?.to ?? i.dueDate }));
    const back = followedDueDates(after, { publishDate: "2027-03-02", goLiveDate: null });
    expect(back.map((c) => [c.id, c.to])).toEqual([
      ["script", "2027-02-09"], // 2 March − 21 = 9 February
      ["report", "2027-04-01"], // 2 March + 30 = 1 April
    ]);
  });

  it("when the publish date is cleared, then open counted items lose their date", () => {
    const changes = followedDueDates(items, { publishDate: null, goLiveDate: null });
    expect(changes).toEqual([
      { id: "script", from: "2027-02-09", to: null },
      { id: "report", from: "2027-04-01", to: null },
    ]);
  });
});

describe("late is computed", () => {
  it("is late from the day after the due date, counted in calendar days", () => {
    // Due 28 Feb 2027; 2027 has no 29 February, so 1 March is one day late.
    expect(latenessOf({ status: "sent", dueDate: "2027-02-28" }, "2027-03-01")).toEqual({ late: true, daysLate: 1 });
    // Due 28 Feb 2028; 29 Feb exists, so 1 March 2028 is two days late.
    expect(latenessOf({ status: "sent", dueDate: "2028-02-28" }, "2028-03-01")).toEqual({ late: true, daysLate: 2 });
  });

  it("is not late on the due date itself", () => {
    expect(latenessOf({ status: "not_started", dueDate: "2027-03-01" }, "2027-03-01")).toEqual({ late: false, daysLate: 0 });
  });

  it("is never late once approved or done, or without a date", () => {
    expect(latenessOf({ status: "approved", dueDate: "2027-01-01" }, "2027-03-01").late).toBe(false);
    expect(latenessOf({ status: "done", dueDate: "2027-01-01" }, "2027-03-01").late).toBe(false);
    expect(latenessOf({ status: "changes_asked", dueDate: null }, "2027-03-01").late).toBe(false);
  });
});

describe("the desk's groups", () => {
  const today = "2027-03-01";
  it("puts each open item in one group: overdue, waiting on the sponsor, due in 7 days, later", () => {
    expect(deskGroupOf({ status: "sent", dueDate: "2027-02-27" }, today)).toBe("overdue");
    expect(deskGroupOf({ status: "sent", dueDate: "2027-03-03" }, today)).toBe("waiting");
    expect(deskGroupOf({ status: "not_started", dueDate: "2027-03-01" }, today)).toBe("due_soon");
    // 1 March + 7 = 8 March: still inside the seven days; 9 March is later.
    expect(deskGroupOf({ status: "not_started", dueDate: "2027-03-08" }, today)).toBe("due_soon");
    expect(deskGroupOf({ status: "not_started", dueDate: "2027-03-09" }, today)).toBe("later");
    expect(deskGroupOf({ status: "not_started", dueDate: null }, today)).toBe("later");
  });

  it("puts changes the sponsor asked for among the things to act on now, whatever the date, unless already overdue", () => {
    expect(deskGroupOf({ status: "changes_asked", dueDate: "2027-03-08" }, today)).toBe("changes_asked");
    expect(deskGroupOf({ status: "changes_asked", dueDate: "2027-09-30" }, today)).toBe("changes_asked");
    expect(deskGroupOf({ status: "changes_asked", dueDate: null }, today)).toBe("changes_asked");
    expect(deskGroupOf({ status: "changes_asked", dueDate: "2027-02-28" }, today)).toBe("overdue");
  });

  it("leaves settled items off the desk", () => {
    expect(deskGroupOf({ status: "done", dueDate: "2027-02-01" }, today)).toBeNull();
    expect(deskGroupOf({ status: "approved", dueDate: "2027-03-02" }, today)).toBeNull();
  });
});

describe("reminders", () => {
  const today = "2027-02-27";
  it("calls for a reminder from N days before the due date up to the due date", () => {
    // 27 Feb + 2 = 1 March 2027 (no 29 Feb): two days ahead, inside a two-day window.
    expect(reminderFor({ status: "not_started", dueDate: "2027-03-01" }, today, 2)).toBe("before");
    // 2 March is three days ahead: not yet.
    expect(reminderFor({ status: "not_started", dueDate: "2027-03-02" }, today, 2)).toBeNull();
    expect(reminderFor({ status: "sent", dueDate: "2027-02-27" }, today, 2)).toBe("before");
    expect(reminderFor({ status: "sent", dueDate: "2027-02-27" }, today, 0)).toBe("before");
  });

  it("calls for the late reminder once the due date has passed", () => {
    expect(reminderFor({ status: "sent", dueDate: "2027-02-26" }, today, 2)).toBe("late");
  });

  it("calls for nothing on settled or undated items", () => {
    expect(reminderFor({ status: "done", dueDate: "2027-02-26" }, today, 2)).toBeNull();
    expect(reminderFor({ status: "approved", dueDate: "2027-02-28" }, today, 2)).toBeNull();
    expect(reminderFor({ status: "not_started", dueDate: null }, today, 2)).toBeNull();
  });
});
