import { describe, expect, it } from "vitest";
import { codecWord, mediaMismatches, rateFromText, type ProbedMedia, type ReportedMedia } from "./media-check";

const file: ProbedMedia = { durationMs: 12_012, frameRate: { numerator: 25, denominator: 1 }, width: 1920, height: 1080, codec: "HEVC", audioCodec: "aac" };
const browser: ReportedMedia = { durationMs: 12_000, frameRate: { numerator: 25, denominator: 1 }, width: 1920, height: 1080, codec: "HEVC" };

describe("reading ffprobe's frame rates", () => {
  // ffprobe writes avg_frame_rate and r_frame_rate as a rational "num/den", "0/0" when unknown
  // (FFmpeg documentation, ffprobe, "-show_streams"; libavutil/rational.h). 29.97 is 30000/1001
  // (SMPTE ST 12-1, as restated in shared/timecode/rates.ts).
  it("when the rate is NTSC's fraction, then it is kept exactly", () => expect(rateFromText("30000/1001")).toEqual({ numerator: 30000, denominator: 1001 }));
  it("when the fraction is not reduced, then it is", () => expect(rateFromText("50/2")).toEqual({ numerator: 25, denominator: 1 }));
  it("when ffprobe doesn't know, then there is no rate", () => {
    expect(rateFromText("0/0")).toBeNull();
    expect(rateFromText(undefined)).toBeNull();
    expect(rateFromText("25")).toBeNull();
  });
});

describe("codec names", () => {
  // ffprobe's codec_name values are libavcodec's (h264, hevc, prores, dnxhd); mediainfo's format
  // names are AVC, HEVC, ProRes, VC-3. The pairing is common practice, written from memory.
  it("when ffprobe says hevc or prores, then Kerf writes the browser reader's word", () => {
    expect(codecWord("hevc")).toBe("HEVC");
    expect(codecWord("prores")).toBe("ProRes");
    expect(codecWord("h264")).toBe("AVC");
  });
});

describe("comparing the file with the browser's report", () => {
  it("when they agree within rounding, then there is no mismatch", () => expect(mediaMismatches(file, browser)).toEqual([]));

  it("when the browser said 29.97 and the file says 25, then the frame rate is a mismatch", () => {
    expect(mediaMismatches(file, { ...browser, frameRate: { numerator: 30000, denominator: 1001 } })).toEqual([
      { field: "frameRate", file: { numerator: 25, denominator: 1 }, browser: { numerator: 30000, denominator: 1001 } },
    ]);
  });

  it("when durations, sizes and codecs differ, then each is named", () => {
    const found = mediaMismatches(file, { ...browser, durationMs: 10_000, width: 1280, height: 720, codec: "AVC" });
    expect(found.map((m) => m.field)).toEqual(["durationMs", "resolution", "codec"]);
  });

  it("when the same format goes by another name (H.264 and AVC, H.265 and HEVC), then it is no mismatch", () => {
    expect(mediaMismatches({ ...file, codec: "AVC" }, { ...browser, codec: "H.264" })).toEqual([]);
    expect(mediaMismatches(file, { ...browser, codec: "H.265" })).toEqual([]);
  });

  it("when only one side gave a value, then it is no mismatch", () => {
    expect(mediaMismatches(file, { durationMs: 0, frameRate: null, width: null, height: null, codec: null })).toEqual([]);
  });
});
