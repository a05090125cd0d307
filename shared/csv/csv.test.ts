import { parse } from "csv-parse/sync";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { safeText, toCsv } from "./csv";

describe("CSV (RFC 4180)", () => {
  it("ends every record with CRLF and separates fields with commas (RFC 4180, section 2, rules 1 and 4)", () => {
    expect(toCsv([["a", "b"], ["1", "2"]])).toBe("a,b\r\n1,2\r\n");
  });

  it("encloses fields holding commas, quotes, CR or LF in double quotes and doubles inner quotes (section 2, rules 6 and 7)", () => {
    expect(toCsv([["plain", "a,b", 'say "hi"', "two\nlines", "cr\rhere", "two\r\nlines", ""]])).toBe(
      'plain,"a,b","say ""hi""","two\nlines","cr\rhere","two\r\nlines",\r\n',
    );
  });

  it("writes numbers as themselves and absent values as empty fields", () => {
    expect(toCsv([[12, -3.5, null, undefined, "x"]])).toBe("12,-3.5,,,x\r\n");
  });

  it("when any table of text is written, then csv-parse (an independent RFC 4180 reader) reads back the same table", () => {
    const cell = fc.string({ maxLength: 12 });
    fc.assert(
      fc.property(fc.array(fc.array(cell, { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 6 }), (rows) => {
        const width = rows[0]!.length;
        const table = rows.map((r) => Array.from({ length: width }, (_, i) => r[i] ?? ""));
        // A single empty field on a record is indistinguishable from an empty line; RFC 4180 leaves it open.
        fc.pre(width > 1 || table.every((r) => r[0] !== ""));
        expect(parse(toCsv(table), { record_delimiter: "\r\n" })).toEqual(table);
      }),
    );
  });

  it("prefixes text that would start a formula (OWASP CSV Injection, common practice)", () => {
    for (const risky of ["=1+1", "+1", "-1", "@SUM(A1)", "\tx", "\rx"]) expect(safeText(risky).startsWith("'")).toBe(true);
    expect(safeText("Motor B")).toBe("Motor B");
  });
});
