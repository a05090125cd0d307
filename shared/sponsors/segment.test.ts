import { describe, expect, it } from "vitest";
import { pinTimecode, segmentProblems, segmentRange, type SegmentClip } from "./segment";

const pal: SegmentClip = { durationMs: 6000, frameRate: { numerator: 25, denominator: 1 }, dropFrame: false, startTimecode: "01:00:00:00" };
const ntscDf: SegmentClip = { durationMs: 3003, frameRate: { numerator: 30000, denominator: 1001 }, dropFrame: true, startTimecode: "01:00:59;18" };

describe("where a segment runs in its clip", () => {
  it("reads in and out in the clip's own timecode, from its start timecode", () => {
    // 25 fps non-drop-frame: 01:00:02:00 is 50 frames after 01:00:00:00, 2 s; the out (exclusive) 100 frames, 4 s.
    // Labels count 25 frames a second (SMPTE ST 12-1 as restated in OpenTimelineIO's opentime, from_timecode).
    expect(segmentRange(pal, { inTimecode: "01:00:02:00", outTimecode: "01:00:04:00", frameRate: "25", dropFrame: false })).toEqual({ startSeconds: 2, endSeconds: 4, wholeFile: false });
  });

  it("counts across a drop-frame minute at 29.97", () => {
    // 01:00:59;18 → 01:01:00;02: ;18 to ;29 is 12 frames, and ;00 and ;01 of minute 1 are not labels
    // (drop-frame skips two labels each minute not divisible by ten: SMPTE ST 12-1 as restated in
    // OpenTimelineIO's opentime, TestTime.test_dropframe_timecode_2997fps). 12 frames × 1001/30000 s.
    const range = segmentRange(ntscDf, { inTimecode: "01:01:00;02", outTimecode: "01:01:01;02", frameRate: "29.97", dropFrame: true })!;
    expect(range.startSeconds).toBeCloseTo((12 * 1001) / 30000, 9);
    expect(range.endSeconds - range.startSeconds).toBeCloseTo((30 * 1001) / 30000, 9);
  });

  it("is the whole file without an in and out", () => {
    expect(segmentRange(pal, null)).toEqual({ startSeconds: 0, endSeconds: 6, wholeFile: true });
  });

  it("says why an in and out don't fit the clip", () => {
    const timing = (inTimecode: string, outTimecode: string, frameRate = "25") => ({ inTimecode, outTimecode, frameRate, dropFrame: false });
    expect(segmentProblems(pal, timing("01:00:02:00", "01:00:04:00"))).toBeNull();
    expect(segmentProblems(pal, timing("01:00:02:00", "01:00:04:00", "30"))).toEqual({ "timing.frameRate": "This clip runs at 25 fps: the in and out are counted in its frames." });
    expect(segmentProblems(pal, timing("00:59:59:24", "01:00:04:00"))).toEqual({ "timing.inTimecode": "The clip starts at 01:00:00:00: the in point can't come before it." });
    // 6 s at 25 fps is 150 frames: the last frame is 01:00:05:24, and the out may be the boundary after it.
    expect(segmentProblems(pal, timing("01:00:02:00", "01:00:06:00"))).toBeNull();
    expect(segmentProblems(pal, timing("01:00:02:00", "01:00:06:01"))).toEqual({ "timing.outTimecode": "The clip ends at 01:00:06:00: the out point can't come after it." });
  });

  it("names a moment of the segment by the clip's label of the frame then on screen", () => {
    const timing = { inTimecode: "01:00:02:00", outTimecode: "01:00:04:00", frameRate: "25", dropFrame: false };
    const range = segmentRange(pal, timing)!;
    // 2 s + 1.2 s = 3.2 s = frame 80 = 3 s and 5 frames at 25 fps.
    expect(pinTimecode(pal, timing, range, 1.2)).toBe("01:00:03:05");
    // A moment inside a frame's period names that frame: 1.239 s is still frame 80 (80.975 frames in).
    expect(pinTimecode(pal, timing, range, 1.239)).toBe("01:00:03:05");
  });
});
