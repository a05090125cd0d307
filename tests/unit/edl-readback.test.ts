import Timecode from "smpte-timecode";
import { describe, expect, it } from "vitest";
import type { ExportClip } from "../../shared/rushes/exports/clip-ranges";
import { footageEdls } from "../../shared/rushes/exports/edl";
import { parseEdl } from "../../shared/rushes/exports/edl-parse";
import { formatOfEdlRate } from "../../shared/rushes/exports/edl-rates";
import { exportClip } from "../../shared/rushes/exports/export-clip.fixture";
import { mediaFileNames } from "../../shared/rushes/exports/media-names";
import { frameRates } from "../../shared/timecode/rates";
import { readLikeOtio } from "../support/cmx3600-otio-rules";

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const df = { frameRate: frameRates["29.97"], dropFrame: true };
const mark = (inLabel: string, outLabel: string, inFrame: number, outFrame: number, note = "") => ({ in: inLabel, out: outLabel, inFrame, outFrame, note });

// A day's footage from two cameras: a 29.97 drop-frame one and a 25 fps one, interleaved as the filter sorts them.
const clips: ExportClip[] = [
  // Whole clip across minute 1, where 29.97 DF skips ;00 and ;01: 4.004 s is 120 frames, 00:00:58;00 + 120 = 00:01:02;02.
  exportClip({ id: id(1), fileName: "DF_whole.mov", ...df, startTimecode: "00:00:58;00", durationMs: 4004 }),
  // 00:00:59;28 is frame 1798, 00:01:00;04 is 1802 (OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps).
  exportClip({ id: id(2), fileName: "A001_C001.mov", startTimecode: "10:00:00:00", marks: [mark("10:00:01:00", "10:00:02:00", 900_025, 900_050, "first\u2028light")] }),
  exportClip({ id: id(3), fileName: "DF_marked.mov", ...df, startTimecode: "00:00:00;00", durationMs: 120_000, marks: [mark("00:00:59;28", "00:01:00;04", 1798, 1802, "relay\rclicks")] }),
  exportClip({ id: id(4), fileName: "A001_C002.mov", startTimecode: "03:20:00:00", durationMs: 2000 }),
];

/** The labels a clip's event must carry, by the reference library smpte-timecode 1.3.6, from the clip's own facts. */
function expectedSource(clip: ExportClip): string[] {
  const rate: [number, number] = [clip.frameRate!.numerator, clip.frameRate!.denominator];
  if (clip.marks.length > 0) return clip.marks.flatMap((m) => [m.in, m.out]);
  const frames = Math.round((clip.durationMs / 1000) * (rate[0] / rate[1]));
  return [clip.startTimecode!, Timecode(clip.startTimecode!, rate, clip.dropFrame).add(frames).toString()];
}

describe("an EDL of clips at 29.97 drop-frame and 25 fps, read back", () => {
  const names = mediaFileNames(clips);
  const lists = footageEdls("Mixed day", clips, names);

  it("when the filter mixes rates, then there is one list per rate, and each says so", () => {
    expect(lists.map((l) => l.rate)).toEqual(["29.97df", "25"]);
    for (const list of lists) expect(parseEdl(list.text).notes.some((n) => n.startsWith("OTHER RATES:"))).toBe(true);
  });

  it.each(["29.97df", "25"])("when the %s list is read by Kerf's strict reader and by OpenTimelineIO's rules, then both see the same events", (rate) => {
    const list = lists.find((l) => l.rate === rate)!;
    const strict = parseEdl(list.text, formatOfEdlRate(rate));
    const loose = readLikeOtio(list.text);
    expect(loose.title).toBe("Mixed day");
    expect(loose.events.map((e) => [e.editNumber, e.reel, e.channels, e.editType, e.sourceIn, e.sourceOut, e.recordIn, e.recordOut])).toEqual(
      strict.events.map((e) => [String(e.event), e.reel, e.channel, e.transition, e.sourceIn, e.sourceOut, e.recordIn, e.recordOut]),
    );
    expect(strict.dropFrame).toBe(rate === "29.97df");
  });

  it("when read back, then every source timecode is the clip's own, in its own rate and drop-frame labels", () => {
    let events = 0;
    for (const list of lists) {
      for (const event of readLikeOtio(list.text).events) {
        const clip = clips.find((c) => names.get(c.id) === event.clipName)!;
        expect(clip, `event ${event.editNumber} names a clip`).toBeDefined();
        expect([event.sourceIn, event.sourceOut]).toEqual(expectedSource(clip));
        // Each label exists at the clip's rate (the reference library throws on one that doesn't, e.g. a skipped ;00).
        for (const label of [event.sourceIn, event.sourceOut]) expect(() => Timecode(label, [clip.frameRate!.numerator, clip.frameRate!.denominator], clip.dropFrame)).not.toThrow();
        events++;
      }
    }
    expect(events).toBe(4);
  });

  it("when two camera files share the first 8 characters, then their reels differ and a comment maps each reel to its file", () => {
    const strict = parseEdl(lists.find((l) => l.rate === "25")!.text);
    expect(strict.events.map((e) => e.reel)).toEqual(["A001C001", "A001C002"]);
    expect(strict.notes.filter((n) => n.startsWith("REEL "))).toEqual(["REEL A001C001: A001_C001.mov", "REEL A001C002: A001_C002.mov"]);
  });

  it("when a note holds a line or paragraph separator or a lone CR, then it stays on its comment line", () => {
    const comments = lists.flatMap((l) => readLikeOtio(l.text).events.flatMap((e) => e.comments));
    expect(comments).toEqual(expect.arrayContaining(["COMMENT: first light", "COMMENT: relay clicks"]));
  });
});
