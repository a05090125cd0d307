import { describe, expect, it } from "vitest";
import { episodeTotals, monthlyMargins } from "./totals";

describe("an episode's margin", () => {
  const lines = [
    { kind: "part" as const, channelMinor: 3750 },
    { kind: "purchase" as const, channelMinor: 12000 },
    { kind: "hours" as const, channelMinor: 6000 },
    { kind: "hours" as const, channelMinor: null },
    { kind: "income" as const, channelMinor: 2500 },
  ];

  it("counts money in as paid fees and other income, less every cost", () => {
    const totals = episodeTotals(lines, [{ channel: { feeMinor: 180050, invoicedMinor: 90025, paidMinor: 90025 } }]);
    expect(totals).toMatchObject({ partsMinor: 3750, purchasesMinor: 12000, hoursMinor: 6000, costsMinor: 21750, feesMinor: 180050, invoicedMinor: 90025, paidMinor: 90025, otherIncomeMinor: 2500, receivedMinor: 92525 });
    expect(totals.marginMinor).toBe(92525 - 21750);
    expect(totals.expectedMarginMinor).toBe(180050 + 2500 - 21750);
  });

  it("leaves out, and counts, lines and fees that wait for a rate", () => {
    const totals = episodeTotals(lines, [{ channel: null }]);
    expect(totals.feesMinor).toBe(0);
    expect(totals.uncounted).toBe(2);
  });

  it("is zero with nothing recorded", () => {
    expect(episodeTotals([], [])).toMatchObject({ costsMinor: 0, receivedMinor: 0, marginMinor: 0, uncounted: 0 });
  });
});

describe("the channel's months", () => {
  it("adds up each calendar month and keeps the empty months between", () => {
    const months = monthlyMargins([
      { on: "2026-11-30", side: "cost", channelMinor: 1000 },
      { on: "2027-01-02", side: "income", channelMinor: 5000 },
      { on: "2027-01-31", side: "cost", channelMinor: 200 },
      { on: "2026-11-01", side: "income", channelMinor: 300 },
    ]);
    expect(months).toEqual([
      { month: "2026-11", incomeMinor: 300, costsMinor: 1000, marginMinor: -700 },
      { month: "2026-12", incomeMinor: 0, costsMinor: 0, marginMinor: 0 },
      { month: "2027-01", incomeMinor: 5000, costsMinor: 200, marginMinor: 4800 },
    ]);
  });
  it("has no months without money", () => {
    expect(monthlyMargins([])).toEqual([]);
  });
});
