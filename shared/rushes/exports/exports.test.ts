import { parse as parseCsv } from "csv-parse/sync";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { frameRates } from "../../timecode/rates";
import type { ExportClip } from "./clip-ranges";
import { EdlError, MAX_EDL_EVENTS, footageEdls } from "./edl";
import { EdlParseError, parseEdl } from "./edl-parse";
import { edlRateOf, edlRates, formatOfEdlRate } from "./edl-rates";
import { reelName, uniqueReels } from "./edl-reels";
import { exportClip as clip } from "./export-clip.fixture";
import { footageCsv, footageCsvHead, footageCsvRecords } from "./footage-csv";
import { TIMELINE_NAME, mediaFileNames, mediaUrl } from "./media-names";
import { isOneLine, oneLine } from "./one-line";
import { footageOtio, otioWriter } from "./otio";

const namesOf = (clips: ExportClip[]) => mediaFileNames(clips);
const edls = (clips: ExportClip[], only?: string) => footageEdls("Test", clips, namesOf(clips), only);
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const df2997 = { frameRate: frameRates["29.97"], dropFrame: true };

// Every character that ends a line for some reader (one-line.ts says whose rules).
const lineBreaks = ["\r", "\n", "\r\n", "\v", "\f", "\u001c", "\u001d", "\u001e", "\u0085", "\u2028", "\u2029"];

describe("CMX 3600 edit decision list", () => {
  it("when a 25 fps clip is used whole, then source and record times are its own and the out point is exclusive", () => {
    const [list] = edls([clip()]);
    expect(list!.text).toContain("FCM: NON-DROP FRAME\r\n");
    // The event line's columns and spacing as OpenTimelineIO's CMX 3600 adapter writes them
    // (OpenTimelineIO/otio-cmx3600-adapter, src/otio_cmx3600_adapter/cmx_3600_writer.py, EventLine.to_edl_format).
    // 10 s at 25 fps: 250 frames; the out point is the first frame after the event.
    expect(list!.text).toContain("\r\n001  A001C007 V     C        10:00:00:00 10:00:10:00 01:00:00:00 01:00:10:00\r\n");
    const parsed = parseEdl(list!.text, formatOfEdlRate(list!.rate));
    expect(parsed.events[0]!.comments).toEqual(["FROM CLIP NAME: A001_C007.mov"]);
    expect(parsed.notes).toContain("REEL A001C007: A001_C007.mov");
  });

  it("when a 29.97 drop-frame mark crosses a minute, then record times count the skipped labels", () => {
    // Frames 1798 to 1802: 59;28, 59;29, then 01:00;02 and ;03, since 29.97 DF skips ;00 and ;01 at minute 1
    // (OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: frame 30 × 59 + 29 = 1799 is
    // 00:00:59;29, 1800 is 00:01:00;02, 1802 is 00:01:00;04). Four frames, ending before 00:01:00;04.
    const marks = [{ in: "00:00:59;28", out: "00:01:00;04", inFrame: 1798, outFrame: 1802, note: "" }];
    const [list] = edls([clip({ ...df2997, startTimecode: "00:00:00;00", durationMs: 120_000, marks })]);
    const edl = parseEdl(list!.text, formatOfEdlRate(list!.rate));
    expect(edl.dropFrame).toBe(true);
    expect(edl.events[0]).toMatchObject({ sourceIn: "00:00:59;28", sourceOut: "00:01:00;04", recordIn: "01:00:00;00", recordOut: "01:00:00;04" });
  });

  it("when clips run at different rates, then each rate gets its own list and no source timecode is converted", () => {
    const a = clip({ id: id(1), fileName: "a.mov" });
    const b = clip({ id: id(2), fileName: "b.mov" });
    const c = clip({ id: id(3), fileName: "c.mov", frameRate: frameRates["50"], startTimecode: "00:00:02:00", durationMs: 1000 });
    const lists = edls([c, a, b]);
    // Most clips first: the 25 fps list (2 clips), then the 50 fps one.
    expect(lists.map((l) => [l.rate, l.clips, l.events])).toEqual([["25", 2, 2], ["50", 1, 1]]);
    const fifty = parseEdl(lists[1]!.text, formatOfEdlRate("50"));
    // 00:00:02:00 at 50 fps stays 00:00:02:00, and 1 s is 50 frames of its own: 00:00:03:00.
    expect(fifty.events[0]).toMatchObject({ sourceIn: "00:00:02:00", sourceOut: "00:00:03:00", recordIn: "01:00:00:00", recordOut: "01:00:01:00" });
    expect(fifty.notes[0]).toBe("FRAME RATE: 50 fps non-drop-frame, every timecode of this list (CMX 3600 does not say the rate: set it on import)");
    expect(fifty.notes[1]).toBe(
      "OTHER RATES: this filter also holds 25 fps non-drop-frame (2 clips), each in a list of its own. A CMX 3600 list holds one frame rate, and Kerf never converts a clip's timecode.",
    );
    expect(edls([c, a, b], "50").map((l) => l.rate)).toEqual(["50"]);
    expect(() => edls([a], "29.97df")).toThrow(new EdlError("None of these clips is at 29.97 fps drop-frame."));
  });

  it("leaves out clips with no frame rate, naming them, and refuses a list of none", () => {
    const lists = edls([clip({ id: id(1) }), clip({ id: id(2), fileName: "phone.mp4", frameRate: null })]);
    expect(parseEdl(lists[0]!.text).notes).toContain("LEFT OUT (no frame rate Kerf can time): phone.mp4");
    expect(() => edls([clip({ frameRate: null })])).toThrow(EdlError);
  });

  it(`refuses a list of more than ${MAX_EDL_EVENTS} events`, () => {
    // CMX 3600 event numbers are three digits (OpenTimelineIO/otio-cmx3600-adapter, cmx_3600_writer.py: "{edit:03d}").
    const marks = Array.from({ length: 500 }, (_, i) => ({ in: "", out: "", inFrame: 900_000 + i, outFrame: 900_001 + i, note: "" }));
    expect(() => edls([clip({ id: id(1), marks }), clip({ id: id(2), marks })])).toThrow(/at most 999/);
  });
});

describe("reel names", () => {
  it("keeps a reel to 8 letters, digits and underscores, dropping underscores before cutting", () => {
    // 8 characters: OpenTimelineIO/otio-cmx3600-adapter, tests/test_cmx_3600_adapter.py, test_reelname_length, and its
    // writer's reelname_len=8 default (cmx_3600_writer.py). Its writer drops underscores too; Kerf drops them only
    // when the name is too long, as camera reels use them (own choice).
    expect(reelName("A001_C001.mov")).toBe("A001C001");
    expect(reelName("B_CAM.mov")).toBe("B_CAM");
    expect(reelName("cam-b take 3.MOV")).toBe("CAMBTAKE");
    expect(reelName("Émile.mov")).toBe("EMILE");
    expect(reelName("....mov")).toBe("CLIP");
  });

  it("when two files would share a reel, then the later one ends in a number, and each reel names its file", () => {
    const files = ["A001_C001.mov", "A001_C002.mov", "bridge test take 1.mov", "bridge test take 2.mov", "BRIDGET2.mov"].map((fileName, i) => ({ id: id(i), fileName }));
    expect([...uniqueReels(files).values()]).toEqual(["A001C001", "A001C002", "BRIDGETE", "BRIDGET2", "BRIDGET3"]);
    const clips = files.map((f) => clip({ ...f, marks: [{ in: "", out: "", inFrame: 900_000, outFrame: 900_010, note: "" }] }));
    const edl = parseEdl(edls(clips)[0]!.text);
    expect(new Set(edl.events.map((e) => e.reel)).size).toBe(5);
    expect(edl.notes.filter((n) => n.startsWith("REEL "))).toEqual(files.map((f, i) => `REEL ${edl.events[i]!.reel}: ${f.fileName}`));
  });

  it("gives a clip's marks one reel", () => {
    const marks = [0, 100].map((f) => ({ in: "", out: "", inFrame: 900_000 + f, outFrame: 900_010 + f, note: "" }));
    const edl = parseEdl(edls([clip({ marks })])[0]!.text);
    expect(edl.events.map((e) => e.reel)).toEqual(["A001C007", "A001C007"]);
  });
});

describe("the strict reader", () => {
  const good = edls([clip()])[0]!.text;

  it("refuses a line break other than CRLF, or a control character, anywhere", () => {
    for (const bad of ["\n", "\r", "\v", "\f", "\u0085", "\u2028", "\u2029", "\u0000"]) {
      expect(() => parseEdl(good.replace("FROM CLIP NAME: ", `FROM CLIP${bad}NAME: `))).toThrow(EdlParseError);
    }
    expect(() => parseEdl(good.replaceAll("\r\n", "\n"))).toThrow(/CRLF/);
  });

  it("refuses labels written against the FCM line, skipped drop-frame labels, and broken sequences", () => {
    expect(() => parseEdl(good.replace("FCM: NON-DROP FRAME", "FCM: DROP FRAME"))).toThrow(/not written as drop-frame/);
    const df = { rate: frameRates["29.97"], dropFrame: true };
    const skipped = edls([clip({ ...df2997, startTimecode: "00:00:58;00", durationMs: 1000 })])[0]!.text.replace("00:00:59;00", "00:01:00;00");
    expect(() => parseEdl(skipped, df)).toThrow(/does not exist in 29.97 fps drop-frame/);
    expect(() => parseEdl(good.replace("\r\n001  ", "\r\n002  "))).toThrow(/out of sequence/);
    expect(() => parseEdl(good.replace("01:00:00:00 01:00:10:00", "01:00:01:00 01:00:11:00"), formatOfEdlRate("25"))).toThrow(/record in/);
    expect(() => parseEdl(good.replace("\r\n\r\n001", "\r\n001"))).toThrow(/blank line/);
  });
});

describe("people's text on an EDL line", () => {
  it("turns every kind of line break into a space", () => {
    for (const brk of lineBreaks) expect(oneLine(`carry${brk}ripples`)).toBe("carry ripples");
    expect(isOneLine("carry ripples — 16 relays")).toBe(true);
  });

  it("never lets a title, file name or note break a line, whatever they hold", () => {
    const text = fc.array(fc.oneof(fc.string({ unit: "grapheme" }), fc.constantFrom(...lineBreaks, "* ", "001  X V C", "TITLE: ")), { maxLength: 6 }).map((parts) => parts.join(""));
    const rate = fc.constantFrom(...edlRates);
    fc.assert(
      fc.property(text, fc.array(fc.tuple(text, text, rate), { minLength: 1, maxLength: 4 }), (title, specs) => {
        const clips = specs.map(([fileName, note], i) =>
          clip({ id: id(i), fileName, frameRate: formatOfEdlRate(specs[i]![2]).rate, dropFrame: formatOfEdlRate(specs[i]![2]).dropFrame, startTimecode: null, marks: [{ in: "", out: "", inFrame: 10, outFrame: 20, note }] }),
        );
        for (const list of footageEdls(title, clips, mediaFileNames(clips))) {
          const edl = parseEdl(list.text, formatOfEdlRate(list.rate));
          const inList = clips.filter((c) => edlRateOf({ rate: c.frameRate!, dropFrame: c.dropFrame }) === list.rate);
          expect(edl.events).toHaveLength(inList.length);
          edl.events.forEach((event, i) => {
            const note = oneLine(inList[i]!.marks[0]!.note);
            expect(event.comments).toEqual([`FROM CLIP NAME: ${mediaFileNames(clips).get(inList[i]!.id)}`, ...(note ? [`COMMENT: ${note}`] : [])]);
          });
        }
      }),
    );
  });
});

describe("file names in a download", () => {
  it("keeps each file's own name, numbering repeats whatever the order, and never gives out the timeline's name", () => {
    const files = [
      { id: id(3), fileName: "take.mov" },
      { id: id(1), fileName: "TAKE.mov" },
      { id: id(2), fileName: "take (2).mov" },
      { id: id(4), fileName: "../../etc/passwd" },
      { id: id(5), fileName: ".hidden" },
      { id: id(6), fileName: TIMELINE_NAME },
    ];
    const names = mediaFileNames(files);
    expect(Object.fromEntries(names)).toEqual({
      [id(1)]: "TAKE.mov",
      [id(2)]: "take (2).mov",
      [id(3)]: "take (3).mov",
      [id(4)]: "passwd",
      [id(5)]: "hidden",
      [id(6)]: "timeline (2).otio",
    });
    expect(mediaFileNames([...files].reverse())).toEqual(names);
  });

  it("names are unique whatever the files are called, and each URL leads back to its name", () => {
    const files = fc.uniqueArray(fc.record({ id: fc.uuid(), fileName: fc.oneof(fc.string({ unit: "grapheme" }), fc.constantFrom("a.mov", "A.MOV", "a (2).mov", "%41.mov", "x#y?.mov", "c:clip.mov", "..")) }), {
      selector: (f) => f.id,
      maxLength: 12,
    });
    fc.assert(
      fc.property(files, (list) => {
        const names = mediaFileNames(list);
        const all = [...names.values()];
        expect(new Set(all.map((n) => n.toLowerCase())).size).toBe(list.length);
        expect(mediaFileNames([...list].reverse())).toEqual(names);
        for (const name of all) {
          expect(name).not.toMatch(/[/\\]|^\./);
          expect(isOneLine(name)).toBe(true);
          // A relative reference resolved against the folder of the timeline (RFC 3986, section 5.2) names the file beside it.
          const url = new URL(mediaUrl(name), "file:///footage/");
          expect(url.pathname).toBe(`/footage/${mediaUrl(name)}`);
          expect(url.search + url.hash).toBe("");
          expect(decodeURIComponent(url.pathname.slice("/footage/".length))).toBe(name);
        }
      }),
    );
  });
});

describe("OpenTimelineIO", () => {
  it("when a clip has two marks, then it becomes two Clip.2 objects sharing one available range", () => {
    const marks = [
      { in: "10:00:01:00", out: "10:00:02:00", inFrame: 900_025, outFrame: 900_050, note: "first" },
      { in: "10:00:05:00", out: "10:00:06:12", inFrame: 900_125, outFrame: 900_162, note: "" },
    ];
    const clips = [clip({ fileName: "A001 C007 #2.mov", marks })];
    const timeline = JSON.parse(footageOtio("T", clips, namesOf(clips)));
    const children = timeline.tracks.children[0].children;
    expect(children.map((c: { name: string }) => c.name)).toEqual(["A001 C007 #2.mov #1", "A001 C007 #2.mov #2"]);
    expect(children[1].source_range).toEqual({
      OTIO_SCHEMA: "TimeRange.1",
      start_time: { OTIO_SCHEMA: "RationalTime.1", value: 900_125, rate: 25 },
      duration: { OTIO_SCHEMA: "RationalTime.1", value: 37, rate: 25 },
    });
    // 10:00:00:00 at 25 fps is frame 900,000; 10 s is 250 frames.
    const media = children[0].media_references.DEFAULT_MEDIA;
    expect(media.available_range.start_time.value).toBe(900_000);
    expect(media.available_range.duration.value).toBe(250);
    // The space and "#" percent-encoded (RFC 3986, 2.1), so "#2" is not read as a fragment.
    expect(media.target_url).toBe("A001%20C007%20%232.mov");
  });

  it("when written in batches, then the pieces make the same single JSON document", () => {
    const clips = [1, 2, 3].map((n) => clip({ id: id(n), fileName: `c${n}.mov` }));
    const names = namesOf(clips);
    const writer = otioWriter("T");
    const streamed = writer.head + writer.clips(clips.slice(0, 1), names) + writer.clips([], names) + writer.clips(clips.slice(1), names) + writer.tail;
    const whole = JSON.parse(footageOtio("T", clips, names));
    expect(JSON.parse(streamed).tracks).toEqual(whole.tracks);
  });
});

describe("CSV in batches", () => {
  it("when written as a header and batches of records, then it is the same RFC 4180 text", () => {
    const clips = [clip({ id: id(1), notes: "=SUM(A1)" }), clip({ id: id(2), marks: [{ in: "10:00:01:00", out: "10:00:02:00", inFrame: 900_025, outFrame: 900_050, note: "line\none" }] })];
    const streamed = footageCsvHead() + footageCsvRecords(clips.slice(0, 1)) + footageCsvRecords([]) + footageCsvRecords(clips.slice(1));
    expect(streamed).toBe(footageCsv(clips));
    const records: string[][] = parseCsv(streamed, { record_delimiter: "\r\n" });
    expect(records).toHaveLength(3);
    expect(records[1]![16]).toBe("'=SUM(A1)");
    expect(records[2]![15]).toBe("line\none");
  });
});
