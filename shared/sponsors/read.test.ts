import { describe, expect, it } from "vitest";
import { frameRates } from "../timecode/rates";
import {
  DEFAULT_WORDS_PER_MINUTE,
  analyseRead,
  bareLink,
  checkTalkingPoint,
  countWords,
  formatSeconds,
  measuredSeconds,
  mentionsCode,
  mentionsLink,
  READ_TIME_ROUNDING,
  readSeconds,
  readTimeWorking,
} from "./read";

const words = (n: number) => Array.from({ length: n }, (_, i) => `word${i}`).join(" ");

describe("read time", () => {
  it("reads 750 words in 5:00 for a host with no rate of their own", () => {
    // About 150 words a minute for conversational US English (the National Center for Voice and Speech's
    // figure, as widely cited; from memory): 750 ÷ 150 = 5 minutes = 300 s.
    expect(readSeconds(750, DEFAULT_WORDS_PER_MINUTE)).toBe(300);
    expect(formatSeconds(readSeconds(750, DEFAULT_WORDS_PER_MINUTE))).toBe("5:00");
  });

  it("scales with the host's own rate", () => {
    // S. E. Lucas, The Art of Public Speaking: 125–150 wpm. At the slow end, 100 words take
    // 100 ÷ 125 × 60 = 48 s; at 160 wpm (a brisk narrator, common practice) 100 words take 37.5 s.
    expect(readSeconds(100, 125)).toBe(48);
    expect(readSeconds(100, 160)).toBe(37.5);
    expect(() => readSeconds(100, 0)).toThrow(RangeError);
  });

  it("counts words as runs holding a letter or digit", () => {
    expect(countWords("")).toBe(0);
    expect(countWords("  Hello — world  ")).toBe(2); // the dash alone is no word
    expect(countWords("Use code GANTRY10 at kerf.example/gantry, today!")).toBe(6);
    expect(countWords("line one\nline two\tthree")).toBe(5);
    expect(countWords(words(750))).toBe(750);
  });

  it("formats seconds as m:ss, signed when negative", () => {
    expect(formatSeconds(59.6)).toBe("1:00");
    expect(formatSeconds(-12)).toBe("−0:12");
    expect(formatSeconds(0)).toBe("0:00");
  });

  it("says how the shown time is rounded: to the nearest second, a half second up", () => {
    // 151 words at 150 wpm = 60.4 s, shown 1:00; 1 word at 120 wpm = 0.5 s, shown 0:01 (JavaScript's Math.round,
    // ECMAScript 2024, 21.3.2.28: a half rounds towards +∞; common practice for a shown duration).
    expect(formatSeconds(readSeconds(151, 150))).toBe("1:00");
    expect(formatSeconds(readSeconds(1, 120))).toBe("0:01");
    expect(formatSeconds(readSeconds(1, 121))).toBe("0:00");
    expect(READ_TIME_ROUNDING).toBe("rounded to the nearest second (a half second rounds up)");
    expect(readTimeWorking(180, 150)).toBe("180 words ÷ 150 words a minute = 72.0\u00a0s, rounded to the nearest second (a half second rounds up)");
    expect(readTimeWorking(1, 120)).toBe("1 word ÷ 120 words a minute = 0.5\u00a0s, rounded to the nearest second (a half second rounds up)");
  });

  it("compares the estimate with the contracted length", () => {
    // 180 words at 150 wpm = 72 s, against a 60 s contract: 12 s long.
    const report = analyseRead({ script: words(180), wordsPerMinute: 150, contractedSeconds: 60, talkingPoints: [], link: null, promoCode: null });
    expect(report.estimatedSeconds).toBe(72);
    expect(report.overBySeconds).toBe(12);
    expect(report.linkInScript).toBeNull();
    expect(report.codeInScript).toBeNull();
  });
});

describe("talking points", () => {
  const script =
    "This part of the video is sponsored by Northbeam Tools. Their bench supply holds 0.1 mV ripple. Shipping is free on orders over 50 euros! Use code GANTRY10 at northbeam.example/gantry.";

  it("ticks a point said word for word, ignoring case and punctuation", () => {
    expect(checkTalkingPoint("Holds 0.1 mV ripple", script).covered).toBe("phrase");
  });

  it("ticks a point whose keywords all appear in one sentence", () => {
    expect(checkTalkingPoint("Free shipping over 50 euros", script)).toMatchObject({ covered: "words", missing: [] });
  });

  it("does not tick a point whose words are spread across sentences or missing", () => {
    const spread = checkTalkingPoint("free bench", script);
    expect(spread.covered).toBeNull();
    const missing = checkTalkingPoint("Two-year warranty", script);
    expect(missing.covered).toBeNull();
    expect(missing.missing).toEqual(["two", "year", "warranty"]);
  });

  it("ticks a point whose numbers and units the script says in words", () => {
    const spoken = "It charges to eighty percent in under an hour. Three hundred watts peak, all day. Shipping is free on orders over fifty euros.";
    expect(checkTalkingPoint("Charges to 80% in under an hour", spoken).covered).toBe("phrase");
    expect(checkTalkingPoint("300 W peak", spoken).covered).toBe("phrase");
    expect(checkTalkingPoint("Free shipping over 50 euros", spoken)).toMatchObject({ covered: "words", missing: [] });
    expect(checkTalkingPoint("$50 off", "Fifty dollars off today.").covered).toBe("phrase");
  });

  it("names what is missing as the point says it", () => {
    expect(checkTalkingPoint("80% charge in 30 minutes", "Charge to 80% in an hour.")).toMatchObject({ covered: null, missing: ["30", "minutes"] });
    expect(checkTalkingPoint("Three hundred watts", "It makes 250 W.").missing).toEqual(["three hundred"]);
  });

  it("counts covered points in the read report", () => {
    const report = analyseRead({
      script,
      wordsPerMinute: 150,
      contractedSeconds: 30,
      talkingPoints: ["Holds 0.1 mV ripple", "Free shipping over 50 euros", "Two-year warranty"],
      link: "https://www.northbeam.example/gantry/",
      promoCode: "gantry10",
    });
    expect(report.pointsCovered).toBe(2);
    expect(report.linkInScript).toBe(true);
    expect(report.codeInScript).toBe(true);
  });
});

describe("link and code presence", () => {
  it("finds a link with or without its scheme and www.", () => {
    expect(bareLink("HTTPS://www.Northbeam.example/gantry/")).toBe("northbeam.example/gantry");
    expect(mentionsLink("go to northbeam.example/gantry now", "https://northbeam.example/gantry")).toBe(true);
    expect(mentionsLink("go to northbeam.example now", "https://northbeam.example/gantry")).toBe(false);
  });

  it("finds a code only as a word of its own", () => {
    expect(mentionsCode("Use code gantry10.", "GANTRY10")).toBe(true);
    expect(mentionsCode("Use code GANTRY100.", "GANTRY10")).toBe(false);
    expect(mentionsCode("Use code X.Y", "X.Y")).toBe(true); // special characters are taken literally
    expect(mentionsCode("anything", "  ")).toBe(false);
  });
});

describe("the segment's measured length in the cut", () => {
  it("takes real time from drop-frame timecode", () => {
    // OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: at 29.97 DF, frame
    // 30 × 59 + 30 = 1800 is labelled 00:01:00;02. 1800 frames × 1001 / 30000 s = 60.06 s.
    expect(measuredSeconds("00:00:00;00", "00:01:00;02", { rate: frameRates["29.97"], dropFrame: true })).toBeCloseTo(60.06, 9);
  });

  it("takes real time from non-drop-frame timecode at 25 fps", () => {
    // 00:00:10:00 → 00:01:10:00 is 60 s of labels = 1500 frames at 25 fps = 60 s exactly.
    expect(measuredSeconds("00:00:10:00", "00:01:10:00", { rate: frameRates["25"], dropFrame: false })).toBe(60);
  });

  it("refuses an out point before the in point", () => {
    expect(() => measuredSeconds("00:01:00:00", "00:00:10:00", { rate: frameRates["25"], dropFrame: false })).toThrow(/before the in point/);
  });
});
