import fc from "fast-check";
import Timecode from "smpte-timecode";
import { describe, expect, it } from "vitest";
import { type TimecodeFormat, frameRates } from "./rates";
import { formatTimecode, parseTimecode } from "./timecode";

const formats: [string, TimecodeFormat][] = [
  ...Object.entries(frameRates).map(([name, rate]): [string, TimecodeFormat] => [`${name} NDF`, { rate, dropFrame: false }]),
  ["29.97 DF", { rate: frameRates["29.97"], dropFrame: true }],
  ["59.94 DF", { rate: frameRates["59.94"], dropFrame: true }],
];

// Frames in a day of labels: 86,400 s × labels a second, less the skipped ones (2 or 4 a minute in 54 of every 60 minutes).
function framesPerDay(format: TimecodeFormat): number {
  const perSecond = Math.round(format.rate.numerator / format.rate.denominator);
  const dropped = format.dropFrame ? perSecond / 15 : 0;
  return 86400 * perSecond - dropped * 54 * 24;
}

describe.each(formats)("timecode at %s", (_name, format) => {
  const frame = fc.integer({ min: 0, max: framesPerDay(format) - 1 });

  it("reads back every label it writes", () => {
    fc.assert(fc.property(frame, (n) => parseTimecode(formatTimecode(n, format), format) === n));
  });

  it("writes later labels for later frames", () => {
    fc.assert(
      fc.property(frame, (n) => {
        if (n + 1 >= framesPerDay(format)) return true;
        return formatTimecode(n, format) < formatTimecode(n + 1, format);
      }),
    );
  });

  it("agrees with the smpte-timecode reference library", () => {
    // Reference library: smpte-timecode 1.3.6 (MIT), an open-source implementation of the SMPTE ST 12-1
    // drop-frame rule that, like Kerf, counts frames from 0.
    const rate: [number, number] = [format.rate.numerator, format.rate.denominator];
    fc.assert(
      fc.property(frame, (n) => {
        expect(formatTimecode(n, format)).toBe(Timecode(n, rate, format.dropFrame).toString());
      }),
    );
  });
});
