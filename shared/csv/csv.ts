// The browser build of csv-stringify: no Node built-ins, so shared/ stays importable by the client.
import { stringify } from "csv-stringify/browser/esm/sync";

export type CsvCell = string | number | null | undefined;

/**
 * CSV as RFC 4180 describes it (section 2): records end with CRLF; a field holding a comma, a double
 * quote, CR or LF is enclosed in double quotes, and a double quote inside it is written twice.
 * csv-stringify quotes a lone CR or LF only when told to, hence `quoted_match`.
 */
export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  return stringify(
    rows.map((row) => [...row]),
    { record_delimiter: "windows", quoted_match: /[\r\n]/ },
  );
}

/**
 * Free text that a spreadsheet would read as a formula (starting with =, +, -, @, tab or CR) gets a
 * leading apostrophe, as OWASP's "CSV Injection" page advises (common practice). Only for text the
 * people typed; numbers Kerf writes itself are left alone so they stay numbers.
 */
export function safeText(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}
