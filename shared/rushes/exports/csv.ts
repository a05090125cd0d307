/**
 * CSV as RFC 4180 defines it: CRLF between records, fields that hold a comma, a double quote or a
 * line break are quoted, and a double quote inside a quoted field is doubled.
 */
export function csvField(value: string | number | null | undefined): string {
  const text = value === null || value === undefined ? "" : String(value);
  // A leading =, +, - or @ makes spreadsheets run the cell as a formula; a leading apostrophe keeps it text
  // (OWASP, "CSV Injection"). Numbers are written as themselves.
  const safe = typeof value === "string" && /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]/.test(safe) ? `"${safe.replaceAll('"', '""')}"` : safe;
}

export function toCsv(rows: (string | number | null | undefined)[][]): string {
  return rows.map((row) => row.map(csvField).join(",")).join("\r\n") + "\r\n";
}

/** Reads RFC 4180 text back into records (used to prove what Kerf writes, and for imports). */
export function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = "";
  let i = 0;
  let quoted = false;
  let fieldStarted = false;
  while (i < text.length) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        quoted = false;
        i++;
        continue;
      }
      field += c;
      i++;
      continue;
    }
    if (c === '"' && !fieldStarted) {
      quoted = true;
      fieldStarted = true;
      i++;
    } else if (c === ",") {
      record.push(field);
      field = "";
      fieldStarted = false;
      i++;
    } else if (c === "\r" && text[i + 1] === "\n") {
      record.push(field);
      records.push(record);
      record = [];
      field = "";
      fieldStarted = false;
      i += 2;
    } else {
      field += c;
      fieldStarted = true;
      i++;
    }
  }
  if (quoted) throw new Error("CSV ends inside a quoted field");
  if (fieldStarted || record.length > 0) {
    record.push(field);
    records.push(record);
  }
  return records;
}
