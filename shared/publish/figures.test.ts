import { describe, expect, it } from "vitest";
import { toCsv } from "../csv/csv";
import { cellNumber, figureSeries, figuresFromExport, figureValuesSchema, formatFigure, videoKeys, type FigureColumns } from "./figures";

// An analytics export as video platforms write one (from memory of the common shape, not from any
// file): a header row, a "Total" row across the file, then one row per video, numbers with thousands
// separators inside quotes. Written through RFC 4180 (toCsv) so the quoting is the standard's.
const exportFile = toCsv([
  ["Content", "Video title", "Views", "Watch time (hours)", "Link clicks"],
  ["Total", "", "48,210", "3,102.4567", "1,020"],
  ["abc123XYZ", "Ninety grams of thrust", "40,001", "2,500.04", "950"],
  ["zzz999", "Another video", "8,209", "602.4", "70"],
]);
const columns: FigureColumns = { video: "Content", views: "Views", watchHours: "Watch time (hours)", linkClicks: "Link clicks", codeUses: null };

describe("figures from an analytics export", () => {
  it("reads this video's row through the channel's column names, rounding watch time to a tenth", () => {
    const keys = videoKeys("https://video.example/watch?v=abc123XYZ", "Ninety grams of thrust");
    expect(figuresFromExport(exportFile, columns, keys)).toEqual({ values: { views: 40001, watchHours: 2500, linkClicks: 950, codeUses: null }, row: 3, problems: [] });
  });
  it("finds the row by title when the channel's video column holds titles", () => {
    expect(figuresFromExport(exportFile, { ...columns, video: "Video title" }, videoKeys("https://video.example/v/other", "another video")).values?.views).toBe(8209);
  });
  it("says which column is missing and which row can't be found", () => {
    expect(figuresFromExport(exportFile, { ...columns, codeUses: "Code uses" }, []).problems).toEqual(['The file has no column "Code uses" (code uses).']);
    expect(figuresFromExport(exportFile, columns, ["nope"]).problems).toEqual(['No row\'s "Content" is this video\'s id or title.']);
    expect(figuresFromExport(exportFile, { ...columns, video: null }, []).problems[0]).toMatch(/2 rows of figures/);
  });
  it("takes the one row of a single-video export without a video column, and flags cells that are not numbers", () => {
    const single = toCsv([["Views", "Link clicks"], ["1 200", "n/a"]]);
    expect(figuresFromExport(single, { ...columns, video: null, watchHours: null }, [])).toEqual({ values: { views: 1200, watchHours: null, linkClicks: null, codeUses: null }, row: 2, problems: ['Link clicks: "n/a" is not a number.'] });
  });
  it("reads numbers as exports write them", () => {
    expect([cellNumber("1,234"), cellNumber(""), cellNumber("12.5"), cellNumber("1e3")]).toEqual([1234, null, 12.5, Number.NaN]);
  });
});

describe("figures entered by hand", () => {
  it("refuses negative and fractional counts", () => {
    expect(figureValuesSchema.safeParse({ views: -1, watchHours: 1.5, linkClicks: null, codeUses: null }).success).toBe(false);
    expect(figureValuesSchema.safeParse({ views: 1, watchHours: 1.5, linkClicks: 2.5, codeUses: null }).success).toBe(false);
    expect(figureValuesSchema.safeParse({ views: 1, watchHours: 1.5, linkClicks: 2, codeUses: null }).success).toBe(true);
  });
});

describe("figures as written and charted", () => {
  it("groups thousands and keeps a tenth", () => {
    expect([formatFigure(40001), formatFigure(2500.5), formatFigure(0), formatFigure(1234567.04)]).toEqual(["40,001", "2,500.5", "0", "1,234,567"]);
  });
  it("makes one series per figure that has values, by day", () => {
    const days = [{ day: 7, values: { views: 10, watchHours: null, linkClicks: 2, codeUses: null } }, { day: 30, values: null }];
    expect(figureSeries(days)).toEqual([
      { kind: "views", name: "Views", points: [{ label: "Day 7", value: 10 }] },
      { kind: "linkClicks", name: "Link clicks", points: [{ label: "Day 7", value: 2 }] },
    ]);
  });
});
