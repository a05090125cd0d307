import { describe, expect, it } from "vitest";
import { GiB, MiB, checkClipFile, checkStillFile, partRange, planParts } from "./limits";

describe("planning parts", () => {
  it("when a file is small, then it is one part; parts are 8 MiB otherwise", () => {
    expect(planParts(1000)).toEqual({ partSize: 8 * MiB, partCount: 1 });
    expect(planParts(17 * MiB)).toEqual({ partSize: 8 * MiB, partCount: 3 });
  });

  it("when 10,000 parts of 8 MiB would not hold the file, then parts grow in whole MiB", () => {
    // S3's limit is 10,000 parts per upload (AWS S3 User Guide, "Amazon S3 multipart upload limits").
    const plan = planParts(200 * GiB);
    expect(plan.partCount).toBeLessThanOrEqual(10_000);
    expect(plan.partSize % MiB).toBe(0);
    expect(plan.partSize).toBe(21 * MiB);
  });

  it("gives each part its byte range, the last one short", () => {
    expect(partRange(1, 8 * MiB, 17 * MiB)).toEqual({ start: 0, end: 8 * MiB });
    expect(partRange(3, 8 * MiB, 17 * MiB)).toEqual({ start: 16 * MiB, end: 17 * MiB });
  });
});

describe("what Kerf takes", () => {
  it("takes camera files by extension, whatever their case", () => {
    expect(checkClipFile("C0001.MP4", 10)).toEqual({ ok: true, contentType: "video/mp4" });
    expect(checkClipFile("A001.MXF", 10)).toEqual({ ok: true, contentType: "application/mxf" });
  });

  it("refuses other types with 415 and oversize files with 413, saying what it takes", () => {
    expect(checkClipFile("notes.txt", 10)).toMatchObject({ ok: false, status: 415 });
    expect(checkClipFile("big.mov", 501 * GiB)).toMatchObject({ ok: false, status: 413 });
    expect(checkStillFile("part.gif", 10)).toMatchObject({ ok: false, status: 415, message: expect.stringContaining(".jpg") });
    expect(checkStillFile("part.jpg", 21 * MiB)).toMatchObject({ ok: false, status: 413 });
    expect(checkClipFile("empty.mov", 0)).toMatchObject({ ok: false, status: 400 });
  });
});
