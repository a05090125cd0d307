/**
 * Money as the payments provider and Kerf's invoices hold it: an integer count of the currency's
 * minor unit (cents for EUR, yen for JPY, fils for KWD). The exponent of each currency is ISO 4217's
 * "minor unit" column (ISO 4217:2015, Table A.1, current currency and funds code list); currencies
 * not listed below have two, as most do. Conversions go through decimal text, never a binary fraction.
 */
export const minorUnitExceptions: Readonly<Record<string, number>> = {
  // ISO 4217 Table A.1, minor unit 0.
  BIF: 0, CLP: 0, DJF: 0, GNF: 0, ISK: 0, JPY: 0, KMF: 0, KRW: 0, PYG: 0, RWF: 0, UGX: 0, UYI: 0, VND: 0, VUV: 0, XAF: 0, XOF: 0, XPF: 0,
  // Minor unit 3.
  BHD: 3, IQD: 3, JOD: 3, KWD: 3, LYD: 3, OMR: 3, TND: 3,
  // Minor unit 4 (units of account).
  CLF: 4, UYW: 4,
};

/** The most decimals any currency has (ISO 4217's units of account, CLF and UYW). */
export const MOST_MINOR_DIGITS = 4;

export function minorUnitDigits(currency: string): number {
  return minorUnitExceptions[currency.toUpperCase()] ?? 2;
}

/** Decimals in a plain decimal text ("1800.50" has 2), counted as typed: trailing zeros too. */
export const decimalsOf = (decimal: string) => decimal.split(".")[1]?.length ?? 0;

export const tooManyDecimals = (currency: string) => {
  const digits = minorUnitDigits(currency);
  return digits === 0 ? `${currency} has no minor unit: use whole amounts.` : `${currency} has ${digits} decimals at most.`;
};

const plainDecimal = /^(\d+)(?:\.(\d+))?$/;

/**
 * "1800.50" EUR → 180050. Null when the text isn't a plain decimal or has more decimals than the
 * currency's minor unit allows (a JPY amount with cents): the caller says what is wrong.
 */
export function toMinorUnits(decimal: string, currency: string): number | null {
  const match = plainDecimal.exec(decimal.trim());
  if (!match) return null;
  const digits = minorUnitDigits(currency);
  const [, whole = "0", fraction = ""] = match;
  const significant = fraction.replace(/0+$/, "");
  if (significant.length > digits) return null;
  const minor = BigInt(whole) * 10n ** BigInt(digits) + BigInt(significant.padEnd(digits, "0") || "0");
  return minor > BigInt(Number.MAX_SAFE_INTEGER) ? null : Number(minor);
}

/**
 * A stored amount written with its currency's decimals: "1800.5000" EUR → "1800.50", "1800.1250" KWD →
 * "1800.125". One with more decimals than its currency has (kept from before that was checked) is left
 * as it is, without its trailing zeros.
 */
export function inCurrencyDigits(decimal: string, currency: string): string {
  const minor = toMinorUnits(decimal, currency);
  return minor === null ? decimal.replace(/(\.\d*?)0+$/, "$1").replace(/\.$/, "") : fromMinorUnits(minor, currency);
}

/** 180050 EUR → "1800.50"; 1800 JPY → "1800"; 1800500 KWD → "1800.500". */
export function fromMinorUnits(minor: number, currency: string): string {
  if (!Number.isSafeInteger(minor)) throw new RangeError(`${minor} is not a whole number of minor units`);
  const digits = minorUnitDigits(currency);
  const sign = minor < 0 ? "-" : "";
  const text = String(Math.abs(minor)).padStart(digits + 1, "0");
  return digits === 0 ? `${sign}${text}` : `${sign}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

/**
 * 180050 EUR in "de-DE" → "1.800,50 €". The decimal text is handed to Intl as a string, which
 * formats it exactly (ECMA-402 Intl.NumberFormat v3), with exactly the currency's minor-unit digits.
 */
export function formatMinorUnits(minor: number, currency: string, locale: string): string {
  const digits = minorUnitDigits(currency);
  const format = new Intl.NumberFormat(locale, { style: "currency", currency: currency.toUpperCase(), minimumFractionDigits: digits, maximumFractionDigits: digits });
  return format.format(fromMinorUnits(minor, currency) as unknown as number);
}
