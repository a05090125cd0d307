import { describe, expect, it } from "vitest";
import { fold, highlight, queryWords, trigramSimilarity, wordAnswers } from "./highlight";
import { searchHitPath } from "./hit-path";

const marked = (runs: { text: string; match: boolean }[]) => runs.map((r) => (r.match ? `[${r.text}]` : r.text)).join("");

describe("search highlighting", () => {
  it("folds accents and case as PostgreSQL's unaccent and lower do", () => {
    expect(fold("Crème Brûlée")).toBe("creme brulee");
    expect(fold("ÅNGSTRÖM")).toBe("angstrom");
  });

  // The rule of the PostgreSQL 15 manual, F.35.1 "pg_trgm Concepts" (the trigrams of "cat" are "  c", " ca",
  // "cat", "at "); figures worked by hand from it, and checked against the database's own similarity()
  // in tests/api/search.test.ts.
  it("measures trigram similarity as pg_trgm does", () => {
    expect(trigramSimilarity("word", "words")).toBeCloseTo(4 / 7, 5);
    expect(trigramSimilarity("sholder", "shoulder")).toBeCloseTo(6 / 11, 5);
  });

  it("takes the query's words, leaving out excluded ones and operators", () => {
    expect(queryWords('"Pack swell" or rotor -foam')).toEqual(["pack", "swell", "rotor"]);
  });

  it("marks exact words, partial words, stems, typos and accents", () => {
    expect(wordAnswers("shoulder", "sholder")).toBe(true);
    expect(wordAnswers("Crème", "creme")).toBe(true);
    expect(wordAnswers("swelled", "swelling")).toBe(true);
    expect(wordAnswers("dovetail", "dove")).toBe(true);
    expect(wordAnswers("rotor", "motor")).toBe(false);
    expect(marked(highlight("The pack swelled at the shoulder", ["swell", "sholder"]))).toBe("The pack [swelled] at the [shoulder]");
  });

  it("keeps a window around the first match in a long text", () => {
    const text = `${"filler words here ".repeat(20)}the rotor cracked ${"more words after ".repeat(20)}`;
    const runs = highlight(text, ["rotor"], 80);
    const shown = marked(runs);
    expect(shown.startsWith("…")).toBe(true);
    expect(shown.endsWith("…")).toBe(true);
    expect(shown).toContain("[rotor]");
    expect(shown.length).toBeLessThan(100);
  });
});

describe("where a hit leads", () => {
  it("opens a mark's clip at the mark, and an episode's record at its section", () => {
    expect(searchHitPath("c1", { kind: "mark", id: "m1", episodeId: "e1", place: { clipId: "k1" } })).toBe("/c/c1/rushes?clip=k1&mark=m1");
    expect(searchHitPath("c1", { kind: "testPlan", id: "e1", episodeId: "e1", place: {} })).toBe("/c/c1/episodes/e1/test-plan");
    expect(searchHitPath("c1", { kind: "part", id: "p1", episodeId: null, place: {} })).toBe("/c/c1/shelf/p1");
  });
});
