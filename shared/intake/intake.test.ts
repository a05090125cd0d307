import { describe, expect, it } from "vitest";
import { guessMapping } from "./columns";
import { hasHiddenCharacter } from "./hidden";
import { mapRow } from "./import-rows";
import { combine, combinedScore } from "./weighing";

describe("hidden characters in a suggestion", () => {
  // Code points from Unicode's DerivedCoreProperties.txt (Default_Ignorable_Code_Point): U+200B ZERO
  // WIDTH SPACE, U+2060 WORD JOINER, U+FEFF ZERO WIDTH NO-BREAK SPACE, U+00AD SOFT HYPHEN.
  it("refuses zero-width and other default-ignorable characters", () => {
    for (const c of ["\u200B", "\u2060", "\uFEFF", "\u00AD", "\u200C"]) expect(hasHiddenCharacter(`free${c}money`)).toBe(true);
    expect(hasHiddenCharacter("plain words, é and ß")).toBe(false);
  });
  // Unicode Technical Standard #51, "Emoji ZWJ Sequences": U+1F469 U+200D U+1F467 is one picture.
  it("allows the zero-width joiner only inside an emoji sequence", () => {
    expect(hasHiddenCharacter("a family 👩\u200D👧")).toBe(false);
    expect(hasHiddenCharacter("a\u200Db")).toBe(true);
  });
});

describe("weighing", () => {
  // Worked by hand: means (3+2)/2 = 2.5, (2+3)/2 = 2.5, (2+1)/2 = 1.5, (3+2)/2 = 2.5; the combined
  // figure turns spend and danger round (4 − x): (2.5 + 2.5 + 2.5 + 1.5) / 4 = 2.25, shown as 2.3.
  it("averages each dimension and turns spend and danger round in the combined figure", () => {
    const means = combine([
      { draw: 3, reach: 2, spend: 2, danger: 3 },
      { draw: 2, reach: 3, spend: 1, danger: 2 },
    ]);
    expect(means).toEqual({ draw: 2.5, reach: 2.5, spend: 1.5, danger: 2.5 });
    expect(combinedScore(means)).toBe(2.3);
    expect(combinedScore(combine([]))).toBeNull();
  });
});

describe("a CSV row of comments", () => {
  const headers = ["Comment ID", "Author", "Comment", "Published", "Link"];
  const mapping = guessMapping(headers)!;
  it("guesses the columns from common header words", () => {
    expect(mapping).toEqual({ text: "Comment", author: "Author", link: "Link", postedAt: "Published", commentId: "Comment ID" });
  });
  it("maps a good row and names the line of a bad one", () => {
    expect(mapRow(["c1", "Ada", " Can it fly? ", "2026-11-02T10:00:00Z", "https://video.example/c1"], headers, mapping, 2)).toEqual({
      row: { line: 2, text: "Can it fly?", author: "Ada", link: "https://video.example/c1", postedAt: "2026-11-02T10:00:00.000Z", commentId: "c1" },
    });
    expect(mapRow(["c2", "Bo", "", "", ""], headers, mapping, 3)).toMatchObject({ line: 3 });
    expect(mapRow(["c3", "Cy", "fine", "yesterday", ""], headers, mapping, 4)).toMatchObject({ line: 4, problem: expect.stringMatching(/not a date/) });
    expect(mapRow(["c4", "Di", "x".repeat(700), "", ""], headers, mapping, 5)).toMatchObject({ row: { text: expect.stringMatching(/^x{599}…$/) } });
  });
});
