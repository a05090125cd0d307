import { describe, expect, it } from "vitest";
import { frameRates } from "./rates";
import { frameAtSeconds, frameCount, frameOfLabel, secondsForFrame, sourceLabel } from "./playhead";

const ntsc = frameRates["29.97"];
const df = { rate: ntsc, dropFrame: true };

describe("the frame on screen at a playback position", () => {
  it("when the position is a frame's own start time, then that frame shows", () => {
    // Frame n begins at n × 1001 / 30000 s at 29.97 fps: a constant rate's definition, as in
    // OpenTimelineIO's RationalTime (value / rate seconds; from memory of its documentation).
    for (const n of [0, 1, 29, 30, 1799, 1800, 107891]) expect(frameAtSeconds((n * 1001) / 30000, ntsc)).toBe(n);
  });

  it("when the position is anywhere inside a frame's period, then that frame shows", () => {
    expect(frameAtSeconds(0.0333, ntsc)).toBe(0); // frame 1 begins at 0.03337 s
    expect(frameAtSeconds(0.03337, ntsc)).toBe(1);
    expect(frameAtSeconds(1.5, frameRates["25"])).toBe(37);
  });

  it("when seeking to a frame, then the position chosen is inside that frame and nowhere near its edges", () => {
    for (const n of [0, 12, 89, 1800, 107891]) {
      const seconds = secondsForFrame(n, ntsc);
      expect(frameAtSeconds(seconds, ntsc)).toBe(n);
      expect(seconds - (n * 1001) / 30000).toBeCloseTo(1001 / 60000, 9);
    }
  });
});

describe("frames of a clip", () => {
  it("when a clip runs 3.003 s at 29.97 fps, then it has 90 frames", () => {
    // 90 frames × 1001 / 30000 s = 3.003 s (own arithmetic).
    expect(frameCount(3003, ntsc)).toBe(90);
    expect(frameCount(2000, frameRates["25"])).toBe(50);
  });

  it("when a drop-frame clip crosses a minute, then the playhead's labels skip ;00 and ;01", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: 00:00:59;29 is
    // followed by 00:01:00;02. A clip starting at 01:00:59;18 reaches the minute on its 12th frame.
    expect(sourceLabel("01:00:59;18", 0, df)).toBe("01:00:59;18");
    expect(sourceLabel("01:00:59;18", 11, df)).toBe("01:00:59;29");
    expect(sourceLabel("01:00:59;18", 12, df)).toBe("01:01:00;02");
    expect(frameOfLabel("01:00:59;18", "01:01:00;02", df)).toBe(12);
  });

  it("when a clip has no start timecode, then its labels count from 00:00:00", () => {
    expect(sourceLabel(null, 30, { rate: frameRates["25"], dropFrame: false })).toBe("00:00:01:05");
    expect(frameOfLabel(null, "00:00:01:05", { rate: frameRates["25"], dropFrame: false })).toBe(30);
  });
});
