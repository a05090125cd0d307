/**
 * CSV as RFC 4180 describes it (section 2): records end with CRLF; a field holding a comma, a double
 * quote, CR or LF is enclosed in double quotes, and a double quote inside it is written twice.
 */
export function toCsv(rows: readonly (readonly string[])[]): string {
  return rows.map((row) => row.map(csvField).join(",") + "\r\n").join("");
}

export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * Free text that a spreadsheet would read as a formula (starting with =, +, -, @, tab or CR) gets a
 * leading apostrophe, as OWASP's "CSV Injection" page advises (common practice). Only for text the
 * people typed; numbers Kerf writes itself are left alone so they stay numbers.
 */
export function safeText(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** A number without float noise (11.100000000000001 → 11.1); twelve significant figures are far beyond any bench reading. */
export function csvNumber(value: number): string {
  return String(Number(value.toPrecision(12)));
}
