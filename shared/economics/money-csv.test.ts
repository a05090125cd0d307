import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { moneyCsv, type MoneyCsvLine } from "./money-csv";

const line = (overrides: Partial<MoneyCsvLine>): MoneyCsvLine => ({
  on: "2027-03-04",
  episode: "Ducted fan, 3S",
  side: "cost",
  kind: "Other purchase",
  description: "Balsa",
  party: "Timber yard",
  quantity: null,
  amountMinor: 1250,
  currency: "EUR",
  rate: null,
  channelMinor: 1250,
  ...overrides,
});

describe("the money export", () => {
  it("writes CRLF records and quotes fields holding commas, quotes or line breaks (RFC 4180, section 2)", () => {
    const csv = moneyCsv([line({ description: 'Spruce "A" grade' })], "EUR");
    expect(csv.endsWith("\r\n")).toBe(true);
    expect(csv).toContain('2027-03-04,"Ducted fan, 3S",cost,Other purchase,"Spruce ""A"" grade",Timber yard,,12.50,EUR,,12.50\r\n');
    const [header, record] = parse(csv) as string[][];
    expect(header).toHaveLength(11);
    expect(header?.[10]).toBe("amount in EUR");
    expect(record?.[4]).toBe('Spruce "A" grade');
  });

  it("writes each currency's minor-unit digits (ISO 4217 Table A.1: JPY 0, KWD 3) and the rate used", () => {
    const csv = moneyCsv([line({ amountMinor: 1800, currency: "JPY", rate: "0.0062", channelMinor: 1116 }), line({ amountMinor: 1800500, currency: "KWD", rate: "3.05", channelMinor: 549153 })], "EUR");
    const records = parse(csv) as string[][];
    expect(records[1]?.slice(7)).toEqual(["1800", "JPY", "0.0062", "11.16"]);
    expect(records[2]?.slice(7)).toEqual(["1800.500", "KWD", "3.05", "5491.53"]);
  });

  it("defuses text a spreadsheet would run as a formula (OWASP, \"CSV Injection\")", () => {
    const records = parse(moneyCsv([line({ description: "=HYPERLINK(\"x\")", party: "+1 shop", episode: "@ep" })], "EUR")) as string[][];
    expect(records[1]?.[4]).toBe("'=HYPERLINK(\"x\")");
    expect(records[1]?.[5]).toBe("'+1 shop");
    expect(records[1]?.[1]).toBe("'@ep");
  });

  it("leaves an amount that counts nothing yet empty", () => {
    const records = parse(moneyCsv([line({ kind: "Hours", amountMinor: null, channelMinor: null })], "EUR")) as string[][];
    expect(records[1]?.slice(7)).toEqual(["", "EUR", "", ""]);
  });
});
