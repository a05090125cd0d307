import { describe, expect, it } from "vitest";
import { checkChapterText, formatChapters, formatChapterTime, parseChapters } from "./chapters";

// YouTube Help, "Video chapters": the first timestamp starts with 0:00; at least three timestamps
// listed in ascending order; the minimum length for a chapter is 10 seconds.
describe("chapter rules", () => {
  it("passes a list that keeps every rule", () => {
    expect(checkChapterText("0:00 Intro\n0:10 Wiring\n1:02:03 Results").problems).toEqual([]);
  });
  it("says when the first is not at 0:00", () => {
    expect(checkChapterText("0:05 Intro\n1:00 A\n2:00 B").problems).toEqual(["The first chapter must start at 0:00; it starts at 0:05."]);
  });
  it("says when there are fewer than three", () => {
    expect(checkChapterText("0:00 Intro\n1:00 A").problems).toEqual(["The platform needs at least 3 chapters; there are 2."]);
  });
  it("says once when times go down, naming each place", () => {
    expect(checkChapterText("0:00 A\n2:00 B\n1:00 C\n0:30 D").problems).toEqual(["Chapters must go up in time: 1:00 comes after 2:00; 0:30 comes after 1:00."]);
  });
  it("says once when chapters are shorter than 10 seconds", () => {
    expect(checkChapterText("0:00 A\n0:09 B\n0:20 C").problems).toEqual(['Each chapter must last at least 10 seconds: "A" lasts 9 s.']);
  });
  it("reports unreadable lines", () => {
    expect(parseChapters("0:00 A\nhello\n0:70 B").unreadable.map((u) => u.line)).toEqual([2, 3]);
  });
  it("writes times as the platform shows them", () => {
    expect([0, 65, 600, 3723].map(formatChapterTime)).toEqual(["0:00", "1:05", "10:00", "1:02:03"]);
    expect(formatChapters([{ startSeconds: 0, title: "Intro" }])).toBe("0:00 Intro");
  });
});
