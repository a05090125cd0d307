import { describe, expect, it } from "vitest";
import { type TimecodeFormat, frameRates } from "./rates";
import { TimecodeError, checkTimecode, durationFrames, formatTimecode, framesToSeconds, parseTimecode } from "./timecode";

const ndf = (rate: keyof typeof frameRates): TimecodeFormat => ({ rate: frameRates[rate], dropFrame: false });
const df = (rate: "29.97" | "59.94"): TimecodeFormat => ({ rate: frameRates[rate], dropFrame: true });

function expectBothWays(format: TimecodeFormat, frame: number, label: string) {
  expect(formatTimecode(frame, format), `frame ${frame}`).toBe(label);
  expect(parseTimecode(label, format), label).toBe(frame);
}

// Kerf counts frames from 0, as do the sources below.
describe("29.97 fps drop-frame", () => {
  it("counts 17,982 frames per ten minutes and 107,892 per hour", () => {
    // OpenTimelineIO, tests/test_opentime.py: TestTime.test_dropframe_timecode_2997fps (30 × 59 + 30 = 1800 is 00:01:00;02) and
    // TestTime.test_timecode_2997 (17982 is 00:10:00;00). smpte-timecode 1.3.6, test/smpte-timecode-test.js,
    // "drop-frame counts": 10:00:00;00 is frame 1,078,920; an hour is a tenth of that, 107,892 (own derivation).
    expectBothWays(df("29.97"), 1800, "00:01:00;02");
    expectBothWays(df("29.97"), 17982, "00:10:00;00");
    expectBothWays(df("29.97"), 107892, "01:00:00;00");
  });

  it("rolls over minutes as OpenTimelineIO's worked examples do", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps.
    const examples: [number, string][] = [
      [0, "00:00:00;00"], [1, "00:00:00;01"], [2, "00:00:00;02"], [3, "00:00:00;03"],
      [30 * 59 + 29, "00:00:59;29"], [30 * 59 + 30, "00:01:00;02"], [30 * 59 + 33, "00:01:00;05"],
      [30 * 299 + 29 - 2 * 4, "00:04:59;29"], [30 * 299 + 30 - 2 * 4, "00:05:00;02"],
      [30 * 419 + 29 - 2 * 6, "00:06:59;29"], [30 * 419 + 30 - 2 * 6, "00:07:00;02"],
      [30 * 599 + 29 - 2 * 9, "00:09:59;29"], [30 * 599 + 30 - 2 * 9, "00:10:00;00"], [30 * 599 + 33 - 2 * 9, "00:10:00;03"],
      [30 * 7199 + 29 - 2 * 108, "01:59:59;29"], [30 * 7199 + 30 - 2 * 108, "02:00:00;00"],
      [30 * 8999 + 30 - 2 * 135, "02:30:00;00"],
      [30 * 35999 + 29 - 2 * 540, "09:59:59;29"], [30 * 35999 + 30 - 2 * 540, "10:00:00;00"],
      [30 * 36179 + 29 - 2 * 542, "10:02:59;29"], [30 * 36179 + 30 - 2 * 542, "10:03:00;02"], [30 * 36179 + 33 - 2 * 542, "10:03:00;05"],
    ];
    for (const [frame, label] of examples) expectBothWays(df("29.97"), frame, label);
  });

  it("matches OpenTimelineIO's reference pairs in both forms", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_2997: (frame, NDF, DF).
    const pairs: [number, string, string][] = [
      [10789, "00:05:59:19", "00:05:59;29"],
      [10790, "00:05:59:20", "00:06:00;02"],
      [17981, "00:09:59:11", "00:09:59;29"],
      [17982, "00:09:59:12", "00:10:00;00"],
      [17983, "00:09:59:13", "00:10:00;01"],
      [17984, "00:09:59:14", "00:10:00;02"],
    ];
    for (const [frame, nonDrop, drop] of pairs) {
      expectBothWays(ndf("29.97"), frame, nonDrop);
      expectBothWays(df("29.97"), frame, drop);
    }
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_ntsc_2997fps.
    expectBothWays(df("29.97"), 1084319, "10:03:00;05");
    expectBothWays(ndf("29.97"), 1084319, "10:02:23:29");
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_passing_ndf_tc_at_df_rate.
    expectBothWays(df("29.97"), 107957, "01:00:02;05");
    expectBothWays(ndf("29.97"), 107957, "00:59:58:17");
  });

  it("rejects the labels drop-frame skips, with a message that says why", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps ("we drop 2 frames per minute
    // except every 10th", and its roll-overs): ;00 and ;01 are skipped at every minute but each tenth.
    expect(() => parseTimecode("00:01:00;00", df("29.97"))).toThrow(
      "00:01:00;00 does not exist in 29.97 fps drop-frame: labels ;00 and ;01 are skipped at the start of every minute except each tenth minute",
    );
    expect(checkTimecode("00:01:00;01", df("29.97"))).toMatchObject({ ok: false, code: "skipped_label" });
    expect(checkTimecode("01:59:00;00", df("29.97"))).toMatchObject({ ok: false, code: "skipped_label" });
    expect(checkTimecode("00:10:00;00", df("29.97"))).toEqual({ ok: true, frame: 17982 });
    expect(checkTimecode("00:01:00;02", df("29.97"))).toEqual({ ok: true, frame: 1800 });
  });
});

describe("59.94 fps", () => {
  it("drop-frame skips four labels in the same minutes", () => {
    // smpte-timecode 1.3.6, test/smpte-timecode-test.js, "drop-frame counts": at 59.94 DF 00:02:00;00 and
    // 00:02:00;02 are refused and 00:02:00;04 accepted. Four labels a minute is the software convention
    // (SMPTE ST 12-1's own text is not public).
    for (const label of ["00:01:00;00", "00:01:00;01", "00:01:00;02", "00:01:00;03"]) {
      expect(checkTimecode(label, df("59.94"))).toMatchObject({ ok: false, code: "skipped_label" });
    }
    // Own derivation from that rule: the first minute keeps 3600 labels, so frame 3600 is 00:01:00;04;
    // ten minutes hold 10 × 3600 − 9 × 4 = 35,964 frames.
    expectBothWays(df("59.94"), 3600, "00:01:00;04");
    expectBothWays(df("59.94"), 35964, "00:10:00;00");
  });

  it("matches OpenTimelineIO's worked example", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_infer_drop_frame: 1084319 at 59.94 DF.
    expectBothWays(df("59.94"), 1084319, "05:01:30;03");
    // Non-drop-frame at 60000/1001, own derivation: 1,084,319 = 18,071 × 60 + 59 and 18,071 s = 5 h 1 min 11 s.
    // smpte-timecode 1.3.6 gives the same label. (That OpenTimelineIO test expects "05:01:11;59" here:
    // the same digits, written with ';' though no label is skipped; Kerf writes non-drop-frame with ':'.)
    expectBothWays(ndf("59.94"), 1084319, "05:01:11:59");
  });
});

describe("whole-number rates and 23.976", () => {
  it("labels 24 fps by plain counting", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_24.
    expectBothWays(ndf("24"), 24, "00:00:01:00");
    expectBothWays(ndf("24"), 24 * 60, "00:01:00:00");
    expectBothWays(ndf("24"), 24 * 60 * 60, "01:00:00:00");
    expectBothWays(ndf("24"), 24 * 60 * 60 * 24 - 1, "23:59:59:23");
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_time_timecode_convert: round trip.
    expect(formatTimecode(parseTimecode("00:06:56:17", ndf("24")), ndf("24"))).toBe("00:06:56:17");
  });

  it("labels 23.976 like 24", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_23976_fps ("should behave exactly like 24 fps"):
    // 24 × 60 × 60 = 86,400 is 01:00:00:00 and 24 × 60 × 60 × 24 − 1 is 23:59:59:23.
    expectBothWays(ndf("23.976"), 86400, "01:00:00:00");
    expectBothWays(ndf("23.976"), 24 * 60 * 60 * 24 - 1, "23:59:59:23");
  });

  it("labels 25, 30, 50 and 60 fps by plain counting", () => {
    // Own derivations: one hour is 25 × 3600 = 90,000 frames at 25 fps, 108,000 at 30, 180,000 at 50, 216,000 at 60.
    expectBothWays(ndf("25"), 90000, "01:00:00:00");
    expectBothWays(ndf("30"), 108000, "01:00:00:00");
    expectBothWays(ndf("50"), 180000, "01:00:00:00");
    expectBothWays(ndf("60"), 216000, "01:00:00:00");
    // Own derivation: 25 fps frame 1 499 = 59 s and 24 frames.
    expectBothWays(ndf("25"), 1499, "00:00:59:24");
  });
});

describe("labels that do not belong to the clip", () => {
  it("rejects frames beyond the rate", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_time_timecode_convert_bad_rate: 01:00:13:24 at 24.
    expect(checkTimecode("01:00:13:24", ndf("24"))).toMatchObject({ ok: false, code: "out_of_range" });
    expect(() => parseTimecode("01:00:13:24", ndf("24"))).toThrow("frames run 00–23 at 24 fps non-drop-frame");
  });

  it("rejects drop-frame at a rate that has none", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_faulty_formatted_timecode_24: 01:00:13;23 at 24.
    expect(checkTimecode("01:00:13;23", ndf("24"))).toMatchObject({ ok: false, code: "wrong_separator" });
    expect(checkTimecode("01:00:13;23", { rate: frameRates["24"], dropFrame: true })).toMatchObject({ ok: false, code: "unsupported_format" });
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_ntsc_2997fps: drop-frame at 24000/1001 is refused.
    expect(checkTimecode("00:00:00;00", { rate: frameRates["23.976"], dropFrame: true })).toMatchObject({ ok: false, code: "unsupported_format" });
  });

  it("rejects a rate Kerf has no timecode for", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_invalid_rate_to_timecode_functions: 29.98 has no timecode.
    const oddRate = { rate: { numerator: 2998, denominator: 100 }, dropFrame: false };
    expect(checkTimecode("00:00:01:00", oddRate)).toMatchObject({ ok: false, code: "unsupported_format" });
    expect(() => formatTimecode(100, oddRate)).toThrow(TimecodeError);
  });

  it("rejects a separator that does not match the clip's form", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_timecode_2997: frame 17982 is 00:09:59:12 without drops and
    // 00:10:00;00 with them: ';' before the frames marks drop-frame, ':' non-drop-frame.
    expect(checkTimecode("00:10:00:00", df("29.97"))).toMatchObject({ ok: false, code: "wrong_separator" });
    expect(checkTimecode("00:10:00;00", ndf("29.97"))).toMatchObject({ ok: false, code: "wrong_separator" });
  });

  it("rejects negative, garbled and out-of-day labels", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_negative_timecode and test_bogus_timecode.
    expect(checkTimecode("-01:00:13:13", ndf("24"))).toMatchObject({ ok: false, code: "malformed" });
    expect(checkTimecode("pink elephants", ndf("24"))).toMatchObject({ ok: false, code: "malformed" });
    // Hours run 00–23 in SMPTE ST 12-1 (from memory; the standard's text is not public). OTIO accepts 24:00:00:00.
    expect(checkTimecode("24:00:00:00", ndf("24"))).toMatchObject({ ok: false, code: "out_of_range" });
    expect(checkTimecode("00:60:00:00", ndf("24"))).toMatchObject({ ok: false, code: "out_of_range" });
  });

  it("refuses to label negative or fractional frame numbers", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_converting_negative_values_to_timecode: −1 at 25.
    expect(() => formatTimecode(-1, ndf("25"))).toThrow(TimecodeError);
    expect(() => formatTimecode(1.5, ndf("25"))).toThrow(TimecodeError);
    // Own derivation: a 29.97 DF day is 24 × 107,892 = 2,589,408 frames, so that frame has no label.
    expect(() => formatTimecode(2589408, df("29.97"))).toThrow(TimecodeError);
    expect(formatTimecode(2589407, df("29.97"))).toBe("23:59:59;29");
  });
});

describe("durations", () => {
  it("counts from in to an exclusive out point", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_duration: frames 100 to 200 at 24 last 100 frames.
    // Own derivation of the labels: 100 = 4 s 4 fr, 200 = 8 s 8 fr.
    expect(durationFrames("00:00:04:04", "00:00:08:08", ndf("24"))).toBe(100);
  });

  it("counts real frames across skipped labels", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: 00:00:59;29 is frame
    // 30 × 59 + 29 = 1799 and 00:01:00;02 is frame 1800. So the two labels are one frame apart.
    expect(durationFrames("00:00:59;29", "00:01:00;02", df("29.97"))).toBe(1);
  });

  it("when the out point is before the in point, then it says so", () => {
    expect(() => durationFrames("00:00:08:08", "00:00:04:04", ndf("24"))).toThrow("The out point 00:00:04:04 is before the in point 00:00:08:08");
  });

  it("turns frames into running time at the exact rate", () => {
    // Own derivation: 107,892 frames × 1001 / 30000 = 3599.9964 s, so a drop-frame hour runs 3.6 ms short of one.
    expect(framesToSeconds(107892, frameRates["29.97"])).toBeCloseTo(3599.9964, 9);
    // Own derivation: 86,400 frames × 1001 / 24000 = 3603.6 s, so a 23.976 "hour" of labels runs 3.6 s long.
    expect(framesToSeconds(86400, frameRates["23.976"])).toBeCloseTo(3603.6, 9);
  });
});
