import { z } from "zod";

/** A frame rate as an exact fraction of frames per second, e.g. 30000/1001 for 29.97. */
export type FrameRate = { numerator: number; denominator: number };

export const frameRates = {
  "23.976": { numerator: 24000, denominator: 1001 },
  "24": { numerator: 24, denominator: 1 },
  "25": { numerator: 25, denominator: 1 },
  "29.97": { numerator: 30000, denominator: 1001 },
  "30": { numerator: 30, denominator: 1 },
  "50": { numerator: 50, denominator: 1 },
  "59.94": { numerator: 60000, denominator: 1001 },
  "60": { numerator: 60, denominator: 1 },
} as const satisfies Record<string, FrameRate>;

export type FrameRateName = keyof typeof frameRates;
export const frameRateNames = Object.keys(frameRates) as FrameRateName[];

/** How a clip's labels are written: its own frame rate, and drop-frame or not. */
export type TimecodeFormat = { rate: FrameRate; dropFrame: boolean };

const sameRate = (a: FrameRate, b: FrameRate) => a.numerator * b.denominator === b.numerator * a.denominator;

export function frameRateName(rate: FrameRate): FrameRateName | undefined {
  return frameRateNames.find((name) => sameRate(frameRates[name], rate));
}

/**
 * The whole number of frame labels per second. 23.976 is labelled like 24, 29.97 like 30 and
 * 59.94 like 60; their pictures run slightly slower than the labels.
 */
export function labelsPerSecond(rate: FrameRate): number {
  return Math.round(rate.numerator / rate.denominator);
}

/**
 * Labels skipped at the start of each minute not divisible by ten: 2 at 29.97 (SMPTE ST 12-1
 * as restated by open-source timecode libraries), 4 at 59.94 (the software convention).
 * 23.976 has no drop-frame form.
 */
export function labelsDroppedPerMinute(rate: FrameRate): number | undefined {
  const name = frameRateName(rate);
  if (name === "29.97") return 2;
  if (name === "59.94") return 4;
  return undefined;
}

export function describeFormat(format: TimecodeFormat): string {
  const name = frameRateName(format.rate) ?? `${format.rate.numerator}/${format.rate.denominator}`;
  return `${name} fps ${format.dropFrame ? "drop-frame" : "non-drop-frame"}`;
}

/** Accepts "29.97", "30000/1001" or "30"; undefined for a rate Kerf does not support. */
export function frameRateFromText(text: string): FrameRate | undefined {
  const trimmed = text.trim();
  if (trimmed in frameRates) return frameRates[trimmed as FrameRateName];
  const match = /^(\d+)\s*\/\s*(\d+)$/.exec(trimmed);
  if (!match) return undefined;
  const rate = { numerator: Number(match[1]), denominator: Number(match[2]) };
  const name = rate.denominator > 0 ? frameRateName(rate) : undefined;
  return name ? frameRates[name] : undefined;
}

export const frameRateSchema = z
  .object({ numerator: z.number().int().positive(), denominator: z.number().int().positive() })
  .refine((rate) => frameRateName(rate) !== undefined, {
    message: `Kerf supports ${frameRateNames.join(", ")} fps`,
  });

export const timecodeFormatSchema = z
  .object({ rate: frameRateSchema, dropFrame: z.boolean() })
  .refine((format) => !format.dropFrame || labelsDroppedPerMinute(format.rate) !== undefined, {
    message: "Drop-frame exists only at 29.97 and 59.94 fps",
    path: ["dropFrame"],
  });
