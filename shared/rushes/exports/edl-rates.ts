import { z } from "zod";
import { type TimecodeFormat, describeFormat, frameRateName, frameRateNames, frameRates, labelsDroppedPerMinute } from "../../timecode/rates";

/**
 * A CMX 3600 list states drop-frame or not (its FCM line) but no frame rate: every timecode in it, source and
 * record, is read at the one rate the editing program is told on import. So a list holds the clips of one
 * rate, and a filter that mixes rates gets one list per rate. Each is named by a key: "25", "29.97df".
 */
export const edlRates = [...frameRateNames]
  .sort((a, b) => Number(a) - Number(b))
  .flatMap((name) => (labelsDroppedPerMinute(frameRates[name]) ? [name, `${name}df`] : [name]));
export type EdlRate = string;

export const edlRateSchema = z.enum(edlRates as [string, ...string[]], { message: `Choose one of ${edlRates.join(", ")}.` });

/** The key of a clip's format; null when Kerf has no timecode for it (no rate, or one it doesn't support). */
export function edlRateOf(format: TimecodeFormat | null): EdlRate | null {
  const name = format ? frameRateName(format.rate) : undefined;
  if (!format || !name) return null;
  if (format.dropFrame && labelsDroppedPerMinute(format.rate) === undefined) return null;
  return format.dropFrame ? `${name}df` : name;
}

export function formatOfEdlRate(rate: EdlRate): TimecodeFormat {
  const dropFrame = rate.endsWith("df");
  return { rate: frameRates[(dropFrame ? rate.slice(0, -2) : rate) as keyof typeof frameRates], dropFrame };
}

export const edlRateLabel = (rate: EdlRate) => describeFormat(formatOfEdlRate(rate));

/** What the footage list asks before offering its EDL: the rates of the filter's clips, most clips first. */
export interface EdlRatesView {
  rates: { rate: EdlRate; label: string; clips: number }[];
  /** Clips the lists leave out: no frame rate, or one Kerf has no timecode for. */
  withoutRate: number;
}
