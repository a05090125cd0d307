import { describe, expect, it } from "vitest";
import { moneySchema, type MoneyInput } from "./schemas";

/*
 * A deal's fee holds as many decimals as its currency has: ISO 4217's minor unit (ISO 4217:2015,
 * Table A.1): none for JPY, two for EUR, three for KWD and BHD.
 */
const money = (fee: MoneyInput["fee"], currency: string): MoneyInput => ({ fee, currency, paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null });
const feeProblem = (fee: MoneyInput["fee"], currency: string) => moneySchema.safeParse(money(fee, currency)).error?.issues.find((issue) => issue.path[0] === "fee")?.message;

describe("a deal's fee", () => {
  it("takes the decimals its currency has, as typed or as a number", () => {
    expect(moneySchema.parse(money("1,800.50", "EUR")).fee).toBe(1800.5);
    expect(moneySchema.parse(money("1,800.125", "KWD")).fee).toBe(1800.125);
    expect(moneySchema.parse(money(0.125, "BHD")).fee).toBe(0.125);
    expect(moneySchema.parse(money("180,000", "jpy"))).toMatchObject({ fee: 180000, currency: "JPY" });
  });

  it("refuses more decimals than its currency has, saying how many it has", () => {
    expect(feeProblem("1800.50", "JPY")).toBe("JPY has no minor unit: use whole amounts.");
    expect(feeProblem(1800.5, "JPY")).toBe("JPY has no minor unit: use whole amounts.");
    expect(feeProblem("1800.125", "EUR")).toBe("EUR has 2 decimals at most.");
    // "1.800" in a two-decimal currency is refused, not read as 1.80: it may be 1,800 with a grouping point.
    expect(feeProblem("1.800", "EUR")).toBe("EUR has 2 decimals at most.");
    expect(feeProblem("1800.1255", "KWD")).toBe("KWD has 3 decimals at most.");
    expect(feeProblem("1800.12555", "KWD")).toBe("Use at most four decimals for the fee.");
  });
});
