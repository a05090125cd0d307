import { z } from "zod";
import { oneLine } from "../fields/text";
import { readAmount } from "../fields/amounts";
import { MOST_MINOR_DIGITS } from "../money/minor-units";
import type { IsoDate } from "./dates";

/**
 * An invoice's state as the payments provider keeps it ("open" is a finalised invoice waiting for
 * payment). "Sent" is not a state of its own there: it is an open invoice with a sending recorded.
 */
export const invoiceStatuses = ["draft", "open", "paid", "void", "uncollectible"] as const;
export type InvoiceStatus = (typeof invoiceStatuses)[number];

/** Kerf's words for where an invoice stands. */
export const invoiceStageLabels = {
  draft: "Being written",
  finalised: "Ready to send",
  sent: "With the sponsor",
  paid: "Paid",
  void: "Cancelled",
  uncollectible: "Written off",
} as const;
export type InvoiceStage = keyof typeof invoiceStageLabels;

export function stageOf(invoice: { status: InvoiceStatus; sentAt: string | null }): InvoiceStage {
  if (invoice.status === "open") return invoice.sentAt ? "sent" : "finalised";
  return invoice.status;
}

/**
 * Where a state may go next, as the provider's invoice life allows: a draft is finalised (open) or
 * deleted; an open invoice is paid, voided or written off; one written off can still be paid or
 * voided; paid and void are final. Events can arrive late and out of order, so a state only moves
 * along these arrows: a late "finalized" never moves a paid invoice back to open.
 */
const onwards: Record<InvoiceStatus, readonly InvoiceStatus[]> = {
  draft: ["open", "paid", "void", "uncollectible"],
  open: ["paid", "void", "uncollectible"],
  uncollectible: ["paid", "void"],
  paid: [],
  void: [],
};

export function nextStatus(current: InvoiceStatus, reported: InvoiceStatus): InvoiceStatus {
  return onwards[current].includes(reported) ? reported : current;
}

/** Overdue: waiting for payment past the day it was due by. */
export function isOverdue(invoice: { status: InvoiceStatus; dueDate: IsoDate | null }, today: IsoDate): boolean {
  return invoice.status === "open" && invoice.dueDate !== null && invoice.dueDate < today;
}

/**
 * A new invoice: the whole fee still to invoice, or an instalment of it ("Half on signing") with its
 * own amount, written as people type amounts; the server turns it into minor units of the deal's currency.
 */
export const newInvoiceSchema = z.strictObject({
  label: oneLine(120, { blank: "Say what this invoice is for.", tooLong: "Keep the line under 120 characters." }),
  amount: z
    .string({ error: "Enter the amount." })
    .trim()
    .refine((v) => v === "" || readAmount(v, MOST_MINOR_DIGITS).ok, { message: "Write the amount as a number, e.g. 900 or 900.25." })
    .nullable()
    .transform((v) => (v === "" ? null : v)),
});
export type NewInvoiceInput = z.input<typeof newInvoiceSchema>;

/** The amount's plain decimal text ("1,800.50" → "1800.50", "1,800.505" → "1800.505"), up to any currency's decimals. */
export function plainAmountText(typed: string): string | null {
  const reading = readAmount(typed, MOST_MINOR_DIGITS);
  return reading.ok ? reading.text : null;
}

export const invoiceActions = ["finalise", "send", "void", "write-off"] as const;
export type InvoiceAction = (typeof invoiceActions)[number];

export interface InvoiceView {
  id: string;
  dealId: string;
  /** The instalment's place on the deal: 1, 2, … */
  position: number;
  label: string;
  /** Integer minor units of the currency (ISO 4217 exponent). */
  amountMinor: number;
  currency: string;
  daysUntilDue: number;
  /** The provider's invoice number, given when it is finalised. */
  number: string | null;
  status: InvoiceStatus;
  stage: InvoiceStage;
  /** Where the sponsor pays: the provider's page, once finalised. */
  hostedUrl: string | null;
  dueDate: IsoDate | null;
  finalisedAt: string | null;
  sentAt: string | null;
  paidAt: string | null;
  overdue: boolean;
  version: number;
}

export interface OverdueInvoice {
  id: string;
  dealId: string;
  episodeId: string;
  episodeTitle: string;
  company: string;
  label: string;
  number: string | null;
  amountMinor: number;
  currency: string;
  dueDate: IsoDate;
  daysLate: number;
  hostedUrl: string | null;
}
