import { describe, expect, it } from "vitest";
import { csvField, csvNumber, safeText, toCsv } from "./csv";

describe("CSV (RFC 4180)", () => {
  it("ends every record with CRLF and separates fields with commas (RFC 4180, section 2, rules 1 and 4)", () => {
    expect(toCsv([["a", "b"], ["1", "2"]])).toBe("a,b\r\n1,2\r\n");
  });

  it("encloses fields holding commas, quotes, CR or LF in double quotes and doubles inner quotes (section 2, rules 6 and 7)", () => {
    expect(csvField("plain")).toBe("plain");
    expect(csvField("a,b")).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField("two\nlines")).toBe('"two\nlines"');
    expect(csvField("cr\rhere")).toBe('"cr\rhere"');
    expect(csvField("")).toBe("");
  });

  it("writes numbers without float noise", () => {
    // Own derivation: 3 × 3.7 is 11.100000000000001 in binary floating point; the pack is 11.1 V.
    expect(csvNumber(3 * 3.7)).toBe("11.1");
    expect(csvNumber(0.1 + 0.2)).toBe("0.3");
    expect(csvNumber(1 / 3)).toBe("0.333333333333");
  });

  it("prefixes text that would start a formula (OWASP CSV Injection, common practice)", () => {
    for (const risky of ["=1+1", "+1", "-1", "@SUM(A1)", "\tx", "\rx"]) expect(safeText(risky).startsWith("'")).toBe(true);
    expect(safeText("Motor B")).toBe("Motor B");
  });
});
