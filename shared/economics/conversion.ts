import { minorUnitDigits } from "../money/minor-units";

/**
 * Amounts in another currency are turned into the channel's currency with the rate the member entered
 * for the day the amount was recorded: Kerf never fetches a rate. A rate says what one unit of the
 * amount's currency is worth in the channel's ("1 USD = 0.92 EUR" is 0.92), with up to six decimals.
 * Every step is integer arithmetic on minor units (BigInt), never a binary fraction.
 */
export const RATE_DECIMALS = 6;
const rateText = /^(\d{1,6})(?:\.(\d{1,6}))?$/;

/** "0.92" → 920000 (millionths); null when it isn't a plain positive decimal with at most six decimals. */
export function rateMillionths(rate: string): bigint | null {
  const match = rateText.exec(rate.trim());
  if (!match) return null;
  const [, whole = "0", fraction = ""] = match;
  const value = BigInt(whole) * 10n ** BigInt(RATE_DECIMALS) + BigInt(fraction.padEnd(RATE_DECIMALS, "0"));
  return value > 0n ? value : null;
}

/**
 * numerator / denominator to the nearest whole number, a half rounded away from zero: the rule of
 * Council Regulation (EC) No 1103/97, Article 5 (conversions rounded to the nearest minor unit, "if
 * the application of the conversion rate gives a result which is exactly half, the sum shall be
 * rounded up"), the usual rule for money.
 */
export function divideRounded(numerator: bigint, denominator: bigint): bigint {
  if (denominator <= 0n) throw new RangeError("The denominator must be positive.");
  const negative = numerator < 0n;
  const size = negative ? -numerator : numerator;
  const quotient = (size * 2n + denominator) / (denominator * 2n);
  return negative ? -quotient : quotient;
}

function toSafe(value: bigint): number {
  if (value > BigInt(Number.MAX_SAFE_INTEGER) || value < -BigInt(Number.MAX_SAFE_INTEGER)) throw new RangeError("The amount is too large to hold.");
  return Number(value);
}

/**
 * An amount of `from` minor units in `to` minor units at `rate`: the exponents of both currencies
 * (ISO 4217) are taken into account, so 100 JPY at 0.0062 is 0.62 EUR (62 cents).
 */
export function convertMinor(amountMinor: number, from: string, to: string, rate: string): number {
  if (from.toUpperCase() === to.toUpperCase()) return amountMinor;
  const millionths = rateMillionths(rate);
  if (millionths === null) throw new RangeError(`"${rate}" is not a rate.`);
  const numerator = BigInt(amountMinor) * millionths * 10n ** BigInt(minorUnitDigits(to));
  const denominator = 10n ** BigInt(RATE_DECIMALS) * 10n ** BigInt(minorUnitDigits(from));
  return toSafe(divideRounded(numerator, denominator));
}

/** Quantity × price, both whole: 3 parts at 1250 cents are 3750 cents. */
export function lineMinor(quantity: number, unitMinor: number): number {
  return toSafe(BigInt(quantity) * BigInt(unitMinor));
}

/** Minutes of work at an hourly rate in minor units, rounded to the nearest minor unit (half up). */
export function hoursMinor(minutes: number, hourRateMinor: number): number {
  return toSafe(divideRounded(BigInt(minutes) * BigInt(hourRateMinor), 60n));
}

/** "2.5" hours → 150 minutes; "0:45" → 45. Null when it is neither, or not above zero. */
export function readMinutes(typed: string): number | null {
  const text = typed.trim();
  const clock = /^(\d{1,4}):([0-5]\d)$/.exec(text);
  if (clock) {
    const minutes = Number(clock[1]) * 60 + Number(clock[2]);
    return minutes > 0 ? minutes : null;
  }
  const decimal = /^(\d{1,4})(?:[.,](\d{1,2}))?$/.exec(text);
  if (!decimal) return null;
  const hundredths = Number(decimal[1]) * 100 + Number((decimal[2] ?? "").padEnd(2, "0"));
  const minutes = Number(divideRounded(BigInt(hundredths) * 60n, 100n));
  return minutes > 0 ? minutes : null;
}
