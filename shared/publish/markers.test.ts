import { describe, expect, it } from "vitest";
import { frameRates } from "../timecode/rates";
import { chaptersFromCsv, chaptersFromEdl, chaptersFromMarks } from "./markers";

const at25 = { rate: frameRates["25"], dropFrame: false };
const at2997df = { rate: frameRates["29.97"], dropFrame: true };

// A marker list written as RFC 4180 CSV (CRLF lines, quoted field with a doubled quote), with a header
// row naming its columns, as editing programs export marker lists.
const csv = ['"Marker Name","Timecode","Duration","Comment"', '"Cold open","01:00:00:00","00:00:00:01",""', '"The ""big"" motor","01:00:12:13","00:00:00:01",""', '"Results","01:03:00:00","00:00:00:01",""'].join("\r\n");

describe("chapters from a CSV marker list", () => {
  it("reads the name and timecode columns, counting from the timeline start", () => {
    expect(chaptersFromCsv(csv, { format: at25, start: "01:00:00:00" })).toEqual({
      chapters: [
        { startSeconds: 0, title: "Cold open" },
        { startSeconds: 12, title: 'The "big" motor' },
        { startSeconds: 180, title: "Results" },
      ],
      problems: [],
    });
  });
  it("takes plain clock times and reports a bad row", () => {
    const result = chaptersFromCsv("Title,Time\nIntro,0:00\nBuild,1:30\nOops,soon\n", { format: at25 });
    expect(result.chapters).toEqual([{ startSeconds: 0, title: "Intro" }, { startSeconds: 90, title: "Build" }]);
    expect(result.problems).toEqual(['Row 4: "soon" is not a time; it was left out.']);
  });
  it("asks for the columns it needs", () => {
    expect(chaptersFromCsv("a,b\n1,2\n", { format: at25 }).problems[0]).toMatch(/needs a time column/);
  });
});

// A CMX 3600 list as SMPTE 258M describes it: TITLE and FCM header lines, event lines (number, reel,
// channel, transition, source in/out, record in/out), comment lines starting with "*"; markers as
// "* LOC: <timecode> <colour> <name>", the form OpenTimelineIO's cmx_3600 adapter reads.
const edl = [
  "TITLE: BATTERY BENCH CUT",
  "FCM: DROP FRAME",
  "",
  "001  A001C003 V     C        01:00:00;00 01:00:30;00 01:00:00;00 01:00:30;00",
  "* FROM CLIP NAME: A001C003.MOV",
  "* LOC: 01:00:00;00 YELLOW  Why this test",
  "002  A001C007 V     C        02:10:00;00 02:11:00;00 01:00:30;00 01:01:30;00",
  "* LOC: 01:00:30;00 YELLOW  Building the rig",
  "* LOC: 01:01:00;02 RED     Verdict",
  "",
].join("\r\n");

describe("chapters from a CMX 3600 EDL", () => {
  it("reads LOC markers from the first event's record in, drop-frame per FCM", () => {
    // 29.97 DF: 01:01:00;02 is 1,800 frames after 01:00:00;00 (SMPTE ST 12-1 as restated in
    // OpenTimelineIO's tests/test_opentime.py), 1800 × 1001 / 30000 = 60.06 s.
    expect(chaptersFromEdl(edl, { format: { ...at2997df, dropFrame: false } })).toEqual({
      chapters: [
        { startSeconds: 0, title: "Why this test" },
        { startSeconds: 30, title: "Building the rig" },
        { startSeconds: 60, title: "Verdict" },
      ],
      problems: [],
    });
  });
  it("says when a list has no markers", () => {
    expect(chaptersFromEdl("TITLE: X\nFCM: NON-DROP FRAME\n", { format: at25 }).problems).toEqual(['The list has no markers ("* LOC:" lines) to make chapters from.']);
  });
});

// Kerf's own marks, laid end to end as the footage's EDL lays its events (record side from the start).
// 30000/1001 is NTSC's rate (SMPTE ST 12-1): 1800 frames last 60.06 s, so the third mark starts past 1:00.
describe("chapters from Kerf's marks", () => {
  const ntsc = frameRates["29.97"];
  it("starts a chapter at each noted mark, counting the lengths of the marks before it", () => {
    const spans = [
      { frames: 250, rate: frameRates["25"], note: "Cold open" },
      { frames: 100, rate: frameRates["25"], note: "" },
      { frames: 1800, rate: ntsc, note: "The first spin-up" },
      { frames: 30, rate: ntsc, note: "Results" },
    ];
    expect(chaptersFromMarks(spans)).toEqual({
      chapters: [
        { startSeconds: 0, title: "Cold open" },
        { startSeconds: 14, title: "The first spin-up" },
        { startSeconds: 74, title: "Results" },
      ],
      problems: [],
    });
  });
  it("says so when there are no marks, or none with a note", () => {
    expect(chaptersFromMarks([]).problems[0]).toMatch(/no marks yet/);
    expect(chaptersFromMarks([{ frames: 25, rate: frameRates["25"], note: " " }]).problems).toHaveLength(2);
  });
});
