import { describe, expect, it } from "vitest";
import { checkDisclosure, hasDisclosure } from "./disclosure";

describe("disclosure check", () => {
  it("finds the plain labels the published guidance names", () => {
    // FTC staff guidance "Disclosures 101 for Social Media Influencers" (2019): plain words such as
    // "ad" or "sponsored" are enough. CAP/CMA "Influencers' guide to making clear that ads are ads" (2023): "Ad", "#ad".
    expect(hasDisclosure("This video is sponsored by Northbeam Tools.", null)).toBe(true);
    expect(hasDisclosure("#ad Today's build is brought to you by…", null)).toBe(true);
    expect(hasDisclosure("AD: a paid mention", null)).toBe(true);
    expect(hasDisclosure("A paid partnership with Northbeam", null)).toBe(true);
  });

  it("does not take a word that merely contains a label", () => {
    expect(hasDisclosure("I soldered a USB adapter and added a heat sink.", null)).toBe(false);
    expect(hasDisclosure("", null)).toBe(false);
  });

  it("finds the deal's own wording", () => {
    expect(hasDisclosure("Northbeam paid for this segment; thanks!", "Northbeam paid for this segment")).toBe(true);
  });

  it("checks the segment and the description separately", () => {
    expect(checkDisclosure({ script: "Sponsored by Northbeam.", description: "Parts list below.", wording: null })).toEqual({
      inSegment: true,
      inDescription: false,
    });
  });
});
