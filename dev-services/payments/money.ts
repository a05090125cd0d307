/**
 * Amounts are integers in the currency's minor unit everywhere in the provider's API. An invoice
 * item may instead give a unit amount as a decimal string in minor units (up to 12 decimal places)
 * and a quantity; the item's amount is then their product, rounded to a whole minor unit.
 */
const DECIMAL = /^(-?)(\d+)(?:\.(\d{1,12}))?$/;
const SCALE_DIGITS = 12;
const SCALE = 10n ** BigInt(SCALE_DIGITS);

export function isDecimalString(value: string): boolean {
  return DECIMAL.test(value);
}

/** Rounds halves away from zero (common practice; the provider's reference does not say how it rounds). */
export function amountFromUnitDecimal(unitAmountDecimal: string, quantity: number): number {
  const match = DECIMAL.exec(unitAmountDecimal);
  if (!match) throw new Error(`not a decimal: ${unitAmountDecimal}`);
  const [, sign, whole, fraction = ""] = match;
  const scaled = BigInt(whole!) * SCALE + BigInt(fraction.padEnd(SCALE_DIGITS, "0"));
  const product = scaled * BigInt(quantity);
  const rounded = (product + SCALE / 2n) / SCALE;
  return Number(sign === "-" ? -rounded : rounded);
}

/** ISO 4217's minor unit of a currency (EUR 2, JPY 0, KWD 3), as the runtime's Intl data has it. */
export function minorUnitDigits(currency: string): number {
  return new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

export function isKnownCurrency(currency: string): boolean {
  return Intl.supportedValuesOf("currency").includes(currency.toUpperCase());
}

/** "€1,800.50" from (180050, "eur", "en-GB"), without passing through a binary fraction. */
export function formatMinorUnits(amount: number | string, currency: string, locale: string): string {
  const match = DECIMAL.exec(String(amount));
  if (!match) throw new Error(`not an amount: ${amount}`);
  const [, sign, whole, fraction = ""] = match;
  const digits = minorUnitDigits(currency);
  // Moves the decimal point from minor to major units; a unit amount may hold fractions of a minor unit.
  const padded = whole!.padStart(digits + 1, "0");
  const majorFraction = `${padded.slice(padded.length - digits)}${fraction}`.replace(/0+$/, "");
  const major = `${sign}${padded.slice(0, padded.length - digits)}${majorFraction ? `.${majorFraction}` : ""}`;
  const format = new Intl.NumberFormat(locale, {
    style: "currency",
    currency: currency.toUpperCase(),
    minimumFractionDigits: digits,
    maximumFractionDigits: Math.max(digits, majorFraction.length),
  });
  // Node 20's Intl formats decimal strings exactly (Intl.NumberFormat v3); its types still say number.
  return format.format(major as unknown as number);
}
