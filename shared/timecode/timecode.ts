import {
  type FrameRate,
  type TimecodeFormat,
  describeFormat,
  frameRateName,
  labelsDroppedPerMinute,
  labelsPerSecond,
} from "./rates";

// Hand-written: smpte-timecode throws a plain Error on a bad label, where a form needs to say what is
// wrong with it (the codes below); it stays as the tests' reference library only (a devDependency).
// Kerf counts frames from 0: frame 0 of a clip is labelled 00:00:00:00 (some libraries count from 1).
// Labels run 00:00:00:00 to 23:59:59:FF, the 24-hour range of SMPTE ST 12-1 (from memory: the
// standard's text is not public).

export type TimecodeErrorCode =
  | "malformed"
  | "wrong_separator"
  | "out_of_range"
  | "skipped_label"
  | "unsupported_format"
  | "out_before_in";

/** Thrown for a label or frame number that has no place in the clip's timecode. */
export class TimecodeError extends Error {
  readonly code: TimecodeErrorCode;

  constructor(code: TimecodeErrorCode, message: string) {
    super(message);
    this.name = "TimecodeError";
    this.code = code;
  }
}

type Counting = { perSecond: number; dropped: number; perMinute: number; perTenMinutes: number; perDay: number };

function counting(format: TimecodeFormat): Counting {
  if (frameRateName(format.rate) === undefined) {
    throw new TimecodeError("unsupported_format", `Kerf has no timecode for ${describeFormat(format)}`);
  }
  const perSecond = labelsPerSecond(format.rate);
  const droppedAtThisRate = labelsDroppedPerMinute(format.rate);
  if (format.dropFrame && droppedAtThisRate === undefined) {
    throw new TimecodeError(
      "unsupported_format",
      `${describeFormat(format)} does not exist: drop-frame is only 29.97 or 59.94 fps`,
    );
  }
  const dropped = format.dropFrame ? (droppedAtThisRate ?? 0) : 0;
  // At 29.97 DF: 1798 frames in a dropping minute, 17,982 in ten minutes, 107,892 in an hour.
  const perMinute = perSecond * 60 - dropped;
  const perTenMinutes = perMinute * 10 + dropped;
  return { perSecond, dropped, perMinute, perTenMinutes, perDay: perTenMinutes * 6 * 24 };
}

const labelPattern = /^(\d{2}):(\d{2}):(\d{2})([:;])(\d{2})$/;

/** The frame number (from 0) a label names, in the clip's own format; throws TimecodeError. */
export function parseTimecode(label: string, format: TimecodeFormat): number {
  const { perSecond, dropped } = counting(format);
  const match = labelPattern.exec(label.trim());
  if (!match) {
    throw new TimecodeError(
      "malformed",
      `"${label}" is not a timecode: write HH:MM:SS:FF, or HH:MM:SS;FF for drop-frame`,
    );
  }
  const hours = Number(match[1]);
  const minutes = Number(match[2]);
  const seconds = Number(match[3]);
  const frames = Number(match[5]);
  const writtenAsDropFrame = match[4] === ";";

  if (writtenAsDropFrame !== format.dropFrame) {
    const written = writtenAsDropFrame ? "drop-frame" : "non-drop-frame";
    const expected = format.dropFrame ? "HH:MM:SS;FF" : "HH:MM:SS:FF";
    throw new TimecodeError(
      "wrong_separator",
      `${label} is written as ${written}, but this clip is ${describeFormat(format)}: write ${expected}`,
    );
  }
  if (hours > 23 || minutes > 59 || seconds > 59) {
    throw new TimecodeError("out_of_range", `${label} is out of range: hours run 00–23, minutes and seconds 00–59`);
  }
  if (frames >= perSecond) {
    throw new TimecodeError(
      "out_of_range",
      `${label} is out of range: frames run 00–${perSecond - 1} at ${describeFormat(format)}`,
    );
  }
  if (dropped > 0 && seconds === 0 && minutes % 10 !== 0 && frames < dropped) {
    const skipped = dropped === 2 ? ";00 and ;01" : `;00 to ;0${dropped - 1}`;
    throw new TimecodeError(
      "skipped_label",
      `${label} does not exist in ${describeFormat(format)}: labels ${skipped} are skipped ` +
        "at the start of every minute except each tenth minute",
    );
  }

  const totalMinutes = hours * 60 + minutes;
  const labelCount = (totalMinutes * 60 + seconds) * perSecond + frames;
  return labelCount - dropped * (totalMinutes - Math.floor(totalMinutes / 10));
}

/** The label of a frame number (from 0) in the clip's own format; throws TimecodeError. */
export function formatTimecode(frame: number, format: TimecodeFormat): string {
  const { perSecond, dropped, perMinute, perTenMinutes, perDay } = counting(format);
  if (!Number.isInteger(frame) || frame < 0 || frame >= perDay) {
    throw new TimecodeError(
      "out_of_range",
      `Frame ${frame} has no label: ${describeFormat(format)} labels frames 0 to ${perDay - 1}`,
    );
  }
  let labelCount = frame;
  if (dropped > 0) {
    // Put back the labels skipped so far: 9 dropping minutes per whole ten minutes, then one per
    // dropping minute begun in the current ten (its first minute keeps all its labels).
    const tens = Math.floor(frame / perTenMinutes);
    const intoTen = frame % perTenMinutes;
    const droppingMinutesBegun = intoTen < dropped ? 0 : Math.floor((intoTen - dropped) / perMinute);
    labelCount += dropped * (9 * tens + droppingMinutesBegun);
  }
  const frames = labelCount % perSecond;
  const totalSeconds = Math.floor(labelCount / perSecond);
  const pad = (n: number) => String(n).padStart(2, "0");
  const hours = Math.floor(totalSeconds / 3600);
  const minutes = Math.floor(totalSeconds / 60) % 60;
  return `${pad(hours)}:${pad(minutes)}:${pad(totalSeconds % 60)}${dropped > 0 ? ";" : ":"}${pad(frames)}`;
}

export type TimecodeCheck = { ok: true; frame: number } | { ok: false; code: TimecodeErrorCode; message: string };

/** Like parseTimecode, but answers with a result instead of throwing. */
export function checkTimecode(label: string, format: TimecodeFormat): TimecodeCheck {
  try {
    return { ok: true, frame: parseTimecode(label, format) };
  } catch (error) {
    if (error instanceof TimecodeError) return { ok: false, code: error.code, message: error.message };
    throw error;
  }
}

/** Frames from an in point to an out point; the out point is exclusive, as in an edit decision list. */
export function durationFrames(inLabel: string, outLabel: string, format: TimecodeFormat): number {
  const first = parseTimecode(inLabel, format);
  const end = parseTimecode(outLabel, format);
  if (end < first) {
    throw new TimecodeError("out_before_in", `The out point ${outLabel} is before the in point ${inLabel}`);
  }
  return end - first;
}

/** Real running time of a number of frames: frames × denominator / numerator seconds. */
export function framesToSeconds(frames: number, rate: FrameRate): number {
  return (frames * rate.denominator) / rate.numerator;
}
