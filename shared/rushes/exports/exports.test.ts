import { describe, expect, it } from "vitest";
import type { ExportClip } from "./clip-ranges";
import { footageEdl, parseEdl, reelName } from "./edl";
import { footageOtio } from "./otio";

const clip = (overrides: Partial<ExportClip> = {}): ExportClip => ({
  id: "3f7c1a52-54a8-4c1e-9d35-0a1b2c3d4e5f",
  fileName: "A001_C007.mov",
  objectKey: "c/e/k",
  episodeTitle: "Relay calculator",
  shootDay: null,
  shotDescription: null,
  kind: null,
  rating: null,
  tags: [],
  camera: "",
  recordedAt: "2026-12-01T10:00:00.000Z",
  durationMs: 10_000,
  frameRate: { numerator: 25, denominator: 1 },
  dropFrame: false,
  startTimecode: "10:00:00:00",
  size: 1,
  notes: "",
  marks: [],
  ...overrides,
});

describe("CMX 3600 edit decision list", () => {
  it("when a 25 fps clip is used whole, then source and record times are its own and the out point is exclusive", () => {
    const edl = footageEdl("Test", [clip()]);
    expect(edl).toContain("FCM: NON-DROP FRAME\r\n");
    // The event line's columns and spacing as OpenTimelineIO's CMX 3600 adapter writes them
    // (OpenTimelineIO/otio-cmx3600-adapter, tests/test_cmx_3600_adapter.py, test_reelname_length).
    // 10 s at 25 fps: 250 frames; the out point is the first frame after the event.
    expect(edl).toContain("001  A001_C00 V     C        10:00:00:00 10:00:10:00 01:00:00:00 01:00:10:00");
    expect(parseEdl(edl).events[0]!.comments).toEqual(["FROM CLIP NAME: A001_C007.mov"]);
  });

  it("when a 29.97 drop-frame mark crosses a minute, then record times count the skipped labels", () => {
    // Frames 1798 to 1802: 59;28, 59;29, then 01:00;02 and ;03, since 29.97 DF skips ;00 and ;01 at minute 1
    // (OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: frame 30 × 59 + 29 = 1799 is
    // 00:00:59;29, 1800 is 00:01:00;02, 1802 is 00:01:00;04). Four frames, ending before 00:01:00;04.
    const marks = [{ in: "00:00:59;28", out: "00:01:00;04", inFrame: 1798, outFrame: 1802, note: "" }];
    const edl = parseEdl(footageEdl("DF", [clip({ frameRate: { numerator: 30000, denominator: 1001 }, dropFrame: true, startTimecode: "00:00:00;00", durationMs: 120_000, marks })]));
    expect(edl.dropFrame).toBe(true);
    expect(edl.events[0]).toMatchObject({ sourceIn: "00:00:59;28", sourceOut: "00:01:00;04", recordIn: "01:00:00;00", recordOut: "01:00:00;04" });
  });

  it("when a clip runs at another rate than the list, then its times are converted by real time and noted", () => {
    const a = clip({ fileName: "a.mov" });
    const b = clip({ fileName: "b.mov" });
    const c = clip({ fileName: "c.mov", frameRate: { numerator: 50, denominator: 1 }, startTimecode: "00:00:02:00", durationMs: 1000 });
    const edl = parseEdl(footageEdl("Mixed", [a, b, c]));
    // 00:00:02:00 at 50 fps is 2 s: 00:00:02:00 at the list's 25 fps, and 1 s long.
    expect(edl.events[2]).toMatchObject({ sourceIn: "00:00:02:00", sourceOut: "00:00:03:00" });
    expect(edl.events[2]!.comments).toContain("SOURCE FORMAT: 50 fps non-drop-frame, times converted to 25 fps");
  });

  it("keeps reel names to 8 characters of letters, digits and underscores", () => {
    // OpenTimelineIO/otio-cmx3600-adapter, tests/test_cmx_3600_adapter.py, test_reelname_length: reels are cut to
    // 8 characters by default; its writer (src/otio_cmx3600_adapter) falls back to "AX". It also drops underscores; Kerf keeps
    // them, as camera reel names use them (own choice, common practice).
    expect(reelName("cam-b take 3.MOV")).toBe("CAMBTAKE");
    expect(reelName("....mov")).toBe("AX");
  });
});

describe("OpenTimelineIO", () => {
  it("when a clip has two marks, then it becomes two Clip.2 objects sharing one available range", () => {
    const marks = [
      { in: "10:00:01:00", out: "10:00:02:00", inFrame: 900_025, outFrame: 900_050, note: "first" },
      { in: "10:00:05:00", out: "10:00:06:12", inFrame: 900_125, outFrame: 900_162, note: "" },
    ];
    const timeline = JSON.parse(footageOtio("T", [clip({ marks })]));
    const clips = timeline.tracks.children[0].children;
    expect(clips.map((c: { name: string }) => c.name)).toEqual(["A001_C007.mov #1", "A001_C007.mov #2"]);
    expect(clips[1].source_range).toEqual({
      OTIO_SCHEMA: "TimeRange.1",
      start_time: { OTIO_SCHEMA: "RationalTime.1", value: 900_125, rate: 25 },
      duration: { OTIO_SCHEMA: "RationalTime.1", value: 37, rate: 25 },
    });
    // 10:00:00:00 at 25 fps is frame 900,000; 10 s is 250 frames.
    expect(clips[0].media_references.DEFAULT_MEDIA.available_range.start_time.value).toBe(900_000);
    expect(clips[0].media_references.DEFAULT_MEDIA.available_range.duration.value).toBe(250);
  });
});
