import { describe, expect, it } from "vitest";
import { disclosureAsPublished, pdfPageCount } from "./report";

describe("the disclosure as published", () => {
  it("finds the description's line that carries the wording, whatever its case and spacing", () => {
    const description = "Paid partnership with  ohmwright cells.\nWhich pack lasts?\n";
    expect(disclosureAsPublished(description, "Paid partnership with Ohmwright Cells.")).toBe("Paid partnership with  ohmwright cells.");
    expect(disclosureAsPublished("Which pack lasts?", "Paid partnership with Ohmwright Cells.")).toBeNull();
    expect(disclosureAsPublished("anything", null)).toBeNull();
  });
});

// A page tree as PDF 32000-1:2008 (7.7.3.2) writes it: the root Pages node's /Count is the number of pages.
describe("a PDF's page count", () => {
  it("reads the root page tree's /Count, in either key order", () => {
    expect(pdfPageCount("1 0 obj << /Type /Pages /Kids [3 0 R 4 0 R] /Count 2 >> endobj")).toBe(2);
    expect(pdfPageCount("2 0 obj <</Count 1/Kids[5 0 R]/Type/Pages>> endobj")).toBe(1);
    expect(pdfPageCount("no tree")).toBeNull();
  });
});
