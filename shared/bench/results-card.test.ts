import { describe, expect, it } from "vitest";
import { colourProblems, contrastRatio, defaultCardColours, MARK_CONTRAST, relativeLuminance, TEXT_CONTRAST, verdictColoursOn } from "./card-colours";
import type { Comparable } from "./comparison";
import type { Criterion } from "./criteria";
import { CARD_ROWS, cardTable, clip, resultsCardSvg, svgText, wrap } from "./results-card";

const q = (value: number, unit: string) => ({ value, unit });
const run = (number: number, verdict: Comparable["evaluation"]["verdict"], values: Comparable["evaluation"]["values"]): Comparable => ({ id: `r${number}`, number, label: `Run label ${number}`, evaluation: { verdict, values } });
const criteria: Criterion[] = [{ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W"), required: true, note: "" } as Criterion];

describe("the card's colours", () => {
  // WCAG 2.1, Understanding SC 1.4.3: white on black is 21 : 1, and #777777 on white about 4.48 : 1.
  it("computes contrast as WCAG 2.1 defines it", () => {
    expect(relativeLuminance("#ffffff")).toBeCloseTo(1, 9);
    expect(contrastRatio("#000000", "#ffffff")).toBeCloseTo(21, 9);
    expect(contrastRatio("#777777", "#ffffff")).toBeCloseTo(4.48, 2);
  });

  it("defaults to text that reads at 4.5 : 1 and verdict marks at 3 : 1 or more", () => {
    expect(colourProblems(defaultCardColours)).toEqual([]);
    expect(contrastRatio(defaultCardColours.ink, defaultCardColours.background)).toBeGreaterThanOrEqual(TEXT_CONTRAST);
    for (const colour of Object.values(verdictColoursOn(defaultCardColours.background))) expect(contrastRatio(colour, defaultCardColours.background)).toBeGreaterThanOrEqual(MARK_CONTRAST);
    for (const colour of Object.values(verdictColoursOn("#1f2a2c"))) expect(contrastRatio(colour, "#1f2a2c")).toBeGreaterThanOrEqual(MARK_CONTRAST);
  });

  it("says when the text would not read", () => {
    expect(colourProblems({ background: "#ffffff", ink: "#aaaaaa", accent: "#f2b33d" })).toEqual(["The text colour has 2.3 : 1 contrast with the background; it needs at least 4.5 : 1."]);
  });
});

describe("the card's table", () => {
  it("shows the plan's figures first, in the plan's unit, rounded as the bench table rounds", () => {
    const runs = [run(1, "pass", { thrust_per_watt: q(5.944, "gf/W"), thrust: q(1.2, "kgf") }), run(2, "fail", { thrust_per_watt: q(4.1, "gf/W") })];
    const table = cardTable({ runs, criteria });
    expect(table.columns.map((c) => [c.key, c.unit])).toEqual([["thrust_per_watt", "gf/W"], ["thrust", "gf"]]);
    expect(table.rows.map((r) => r.figures)).toEqual([["5.94", "1200"], ["4.1", "–"]]);
    expect(table.rows.map((r) => r.best)).toEqual([true, false]);
    expect(table.plan).toEqual(["Thrust per watt ≥ 5 gf/W"]);
  });

  it("keeps the best run on the card when there are more runs than rows", () => {
    const runs = Array.from({ length: 9 }, (_, i) => run(i + 1, i === 8 ? "pass" : "fail", { thrust_per_watt: q(i + 1, "gf/W") }));
    const table = cardTable({ runs, criteria });
    expect(table.rows).toHaveLength(CARD_ROWS);
    expect(table.rows.map((r) => r.number)).toEqual([1, 2, 3, 4, 9]);
    expect(table.more).toBe(4);
  });
});

describe("the card's SVG", () => {
  it("is 1920 × 1080 and carries people's text as text, never as markup", () => {
    const svg = resultsCardSvg({ title: "Fans <b>& rotors</b>", channelName: "Test bench", runs: [run(1, "pass", { thrust_per_watt: q(6, "gf/W") })], criteria }, defaultCardColours);
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg" width="1920" height="1080"/);
    expect(svg).toContain("Fans &lt;b&gt;&amp; rotors&lt;/b&gt;");
    expect(svg).not.toContain("<b>");
    expect(svgText("a\u0007b")).toBe("ab");
    expect(clip("A very long configuration name", 10)).toBe("A very lo…");
    expect(wrap("Thrust-to-weight", 11, 2)).toEqual(["Thrust-to-", "weight"]);
    expect(wrap("Twelve 80 mm fans on the bench supply, all on one harness", 20, 2)).toEqual(["Twelve 80 mm fans on", "the bench supply, a…"]);
  });
});
