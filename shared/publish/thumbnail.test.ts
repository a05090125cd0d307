import { describe, expect, it } from "vitest";
import { thumbnailProblems } from "./thumbnail";

// YouTube Help, "Add video thumbnails": resolution 1280 × 720 (minimum width 640 pixels), JPG, GIF or PNG,
// under 2 MB, 16:9 aspect ratio.
const good = { width: 1280, height: 720, sizeBytes: 300_000, contentType: "image/png" };

describe("thumbnail rules", () => {
  it("takes the recommended size", () => expect(thumbnailProblems(good)).toEqual([]));
  it("takes 640 × 360 and refuses 639 wide", () => {
    expect(thumbnailProblems({ ...good, width: 640, height: 360 })).toEqual([]);
    expect(thumbnailProblems({ ...good, width: 630, height: 354 })[0]).toMatch(/630 px wide; the platform needs at least 640/);
  });
  it("refuses a ratio other than 16:9", () => {
    expect(thumbnailProblems({ ...good, width: 1280, height: 960 })).toEqual(["The picture is 1280 × 960, not 16:9 (1280 × 720 is best)."]);
  });
  it("refuses 2 MB and more, and other formats", () => {
    expect(thumbnailProblems({ ...good, sizeBytes: 2 * 1024 * 1024 + 1 })[0]).toMatch(/under 2 MB/);
    expect(thumbnailProblems({ ...good, contentType: "image/webp" })).toEqual(["The platform takes JPG, GIF or PNG thumbnails."]);
  });
});
