import { describe, expect, it } from "vitest";
import { frameRateFromText, frameRateSchema, frameRates, timecodeFormatSchema } from "./rates";
import { markRangeAt, timecodeAt, timecodeWithFormatSchema } from "./schemas";

const dropFrame2997 = { rate: frameRates["29.97"], dropFrame: true };

describe("timecode in request schemas", () => {
  it("when a mark lands on a label drop-frame skips, then the request is refused with the reason", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: 00:00:59;29 is followed by
    // 00:01:00;02, so at 29.97 DF the labels ;00 and ;01 are skipped at the start of minute 1.
    const result = timecodeAt(dropFrame2997).safeParse("00:01:00;00");
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toMatch(/^00:01:00;00 does not exist in 29.97 fps drop-frame/);
    expect(timecodeAt(dropFrame2997).safeParse("00:01:00;02").success).toBe(true);
  });

  it("checks an in/out mark: both labels valid and the out point after the in point", () => {
    const mark = markRangeAt(dropFrame2997);
    expect(mark.safeParse({ in: "00:00:59;29", out: "00:01:00;02" }).success).toBe(true);
    const backwards = mark.safeParse({ in: "00:01:00;02", out: "00:00:59;29" });
    expect(backwards.error?.issues[0]).toMatchObject({ path: ["out"] });
    const skipped = mark.safeParse({ in: "00:01:00;01", out: "00:02:00;00" });
    expect(skipped.error?.issues.map((issue) => issue.path)).toEqual([["in"], ["out"]]);
  });

  it("checks a label against the format that travels with it", () => {
    expect(timecodeWithFormatSchema.safeParse({ timecode: "01:00:00;00", format: dropFrame2997 }).success).toBe(true);
    const wrong = timecodeWithFormatSchema.safeParse({ timecode: "01:00:00:00", format: dropFrame2997 });
    expect(wrong.error?.issues[0]).toMatchObject({ path: ["timecode"] });
  });
});

describe("frame rates", () => {
  it("accepts the supported rates as exact fractions, in any equal form", () => {
    expect(frameRateSchema.safeParse({ numerator: 30000, denominator: 1001 }).success).toBe(true);
    expect(frameRateSchema.safeParse({ numerator: 60000, denominator: 2002 }).success).toBe(true);
    expect(frameRateFromText("30000/1001")).toEqual(frameRates["29.97"]);
    expect(frameRateFromText("59.94")).toEqual(frameRates["59.94"]);
    expect(frameRateFromText("25")).toEqual(frameRates["25"]);
  });

  it("refuses rates with no timecode of their own", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_invalid_rate_to_timecode_functions: 29.98 has no timecode.
    expect(frameRateFromText("29.98")).toBeUndefined();
    expect(frameRateSchema.safeParse({ numerator: 2998, denominator: 100 }).success).toBe(false);
    expect(frameRateFromText("30/0")).toBeUndefined();
  });

  it("allows drop-frame only at 29.97 and 59.94", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_ntsc_2997fps: drop-frame at 24000/1001 is refused;
    // smpte-timecode 1.3.6, test/smpte-timecode-test.js, "drop-frame only for 29.97 and 59.94".
    expect(timecodeFormatSchema.safeParse({ rate: frameRates["59.94"], dropFrame: true }).success).toBe(true);
    const result = timecodeFormatSchema.safeParse({ rate: frameRates["23.976"], dropFrame: true });
    expect(result.error?.issues[0]).toMatchObject({ path: ["dropFrame"], message: "Drop-frame exists only at 29.97 and 59.94 fps" });
    expect(timecodeFormatSchema.safeParse({ rate: frameRates["25"], dropFrame: true }).success).toBe(false);
  });
});
