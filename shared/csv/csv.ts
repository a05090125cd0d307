// The browser builds of csv-stringify and csv-parse: no Node built-ins, so shared/ stays importable by the client.
import { parse } from "csv-parse/browser/esm/sync";
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

/**
 * Rows of a CSV file people bring (RFC 4180; a byte-order mark, blank lines and spaces around fields
 * tolerated): the first row's cells as they are, the rest as lists of cells. Throws with csv-parse's
 * own words when the file is not CSV.
 */
export function readCsvRows(text: string): { header: string[]; rows: string[][] } {
  const [header = [], ...rows] = parse(text, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: true }) as string[][];
  return { header, rows };
}
