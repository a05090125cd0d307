import { describe, expect, it } from "vitest";
import { invoiceStatuses, isOverdue, nextStatus, plainAmountText, stageOf, type InvoiceStatus } from "./invoices";

describe("invoice states", () => {
  // The arrows follow the provider's invoice life as its documentation describes it ("Status transitions and
  // finalization", from memory; the stand-in's invoice-actions.ts enforces the same:
  // draft → open → paid | void | uncollectible; uncollectible → paid | void; paid and void are final).
  it("never leaves paid or void, whatever is reported after", () => {
    for (const reported of invoiceStatuses) {
      expect(nextStatus("paid", reported)).toBe("paid");
      expect(nextStatus("void", reported)).toBe("void");
    }
  });

  it("moves forward only, so late events change nothing", () => {
    const steps: [InvoiceStatus, InvoiceStatus, InvoiceStatus][] = [
      ["draft", "open", "open"],
      ["open", "draft", "open"],
      ["open", "paid", "paid"],
      ["uncollectible", "paid", "paid"],
      ["uncollectible", "open", "uncollectible"],
      ["open", "uncollectible", "uncollectible"],
      ["draft", "paid", "paid"],
    ];
    for (const [current, reported, next] of steps) expect(nextStatus(current, reported)).toBe(next);
  });

  it("names the stage of an open invoice by whether it was sent", () => {
    expect(stageOf({ status: "open", sentAt: null })).toBe("finalised");
    expect(stageOf({ status: "open", sentAt: "2027-03-01T10:00:00Z" })).toBe("sent");
    expect(stageOf({ status: "paid", sentAt: null })).toBe("paid");
  });

  it("is overdue only while open and past its due date", () => {
    expect(isOverdue({ status: "open", dueDate: "2027-03-01" }, "2027-03-02")).toBe(true);
    expect(isOverdue({ status: "open", dueDate: "2027-03-02" }, "2027-03-02")).toBe(false);
    expect(isOverdue({ status: "paid", dueDate: "2027-03-01" }, "2027-03-02")).toBe(false);
    expect(isOverdue({ status: "open", dueDate: null }, "2027-03-02")).toBe(false);
  });

  it("reads typed amounts to plain decimal text", () => {
    expect(plainAmountText("1,800.50")).toBe("1800.50");
    expect(plainAmountText("1.800,50")).toBe("1800.50");
    expect(plainAmountText("900.125")).toBe("900.125");
    expect(plainAmountText("1,800.125")).toBe("1800.125");
    expect(plainAmountText("0.0001")).toBe("0.0001");
    expect(plainAmountText("0.00015")).toBeNull();
    expect(plainAmountText("nine hundred")).toBeNull();
  });
});
