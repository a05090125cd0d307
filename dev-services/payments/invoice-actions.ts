import { invalidRequest, stateRefusal } from "./api-error";
import type { RequestContext } from "./context";
import { randomToken, unixNow } from "./ids";
import { findInvoice } from "./invoices";
import type { InvoiceRecord } from "./records";
import { invoiceAmounts, invoiceView } from "./views";

/**
 * The invoice's states and what moves it between them, as the provider's "Status transitions and
 * finalization" page (docs.stripe.com/invoicing/integration/workflow-transitions) lays them out:
 * draft → open (finalize) → paid (pay), open → void, open → uncollectible, uncollectible → paid or
 * void; a draft is deleted, never voided. Refusals carry the provider's wording; most of them have
 * no `code` at the provider either (a voided draft answers "You can only pass in open invoices.
 * This invoice isn't open." with code null, as shown in dev.classmethod.jp's article "Stripeの
 * いろんな状態のインボイスを「無効にする(API・SDK)」ときの応答を確認する").
 */
type Emitting = Pick<RequestContext, "account" | "baseUrl" | "emit">;
export type PaidBy = "out_of_band" | "hosted_page" | "nothing_due";

const NOT_OPEN = "You can only pass in open invoices. This invoice isn't open.";

// Finalizing can pay an invoice with nothing to pay, which the type checker can't see.
const stillOwed = (invoice: InvoiceRecord) => invoice.status !== "paid";

export function finalizeInvoice(context: RequestContext) {
  context.params.only(["auto_advance"]);
  const invoice = findInvoice(context.account, context.id, "id");
  if (invoice.status !== "draft") throw stateRefusal("This invoice is already finalized, you can't re-finalize a non-draft invoice.");
  invoice.autoAdvance = context.params.boolean("auto_advance") ?? invoice.autoAdvance;
  finalize(context, invoice);
  return invoiceView(context.account, invoice, context.baseUrl);
}

/** In test mode the provider sends no e-mail; it records invoice.sent, and so does the stand-in. */
export function sendInvoice(context: RequestContext) {
  context.params.only([]);
  const invoice = findInvoice(context.account, context.id, "invoice");
  // From memory of the provider's answer.
  if (invoice.collectionMethod !== "send_invoice") throw stateRefusal("You can only manually send an invoice if its collection method is 'send_invoice'.");
  if (invoice.status === "paid" || invoice.status === "void") throw stateRefusal("This invoice cannot be sent right now.");
  if (invoice.status === "draft") finalize(context, invoice);
  if (stillOwed(invoice)) context.emit("invoice.sent", invoiceView(context.account, invoice, context.baseUrl));
  return invoiceView(context.account, invoice, context.baseUrl);
}

/**
 * Pays an invoice. The stand-in holds no cards, so through the API only `paid_out_of_band` (money
 * received outside the provider) pays; the sponsor pays on the hosted page (hosted-page.ts).
 */
export function payInvoice(context: RequestContext) {
  context.params.only(["paid_out_of_band"]);
  const invoice = findInvoice(context.account, context.id, "id");
  if (invoice.status === "paid") throw stateRefusal("Invoice is already paid");
  // From memory of the provider's answer.
  if (invoice.status === "void") throw stateRefusal("You cannot pay a void invoice.");
  if (context.params.boolean("paid_out_of_band") !== true) {
    // The provider would charge the customer's default payment method; the stand-in's customers have none (from memory of its wording).
    throw invalidRequest("This customer has no attached payment source or default payment method.");
  }
  // Paying a draft finalizes it first, in the same call.
  if (invoice.status === "draft") finalize(context, invoice);
  if (stillOwed(invoice)) markPaid(context, invoice, "out_of_band");
  return invoiceView(context.account, invoice, context.baseUrl);
}

export function voidInvoice(context: RequestContext) {
  context.params.only([]);
  const invoice = findInvoice(context.account, context.id, "id");
  if (invoice.status === "paid") throw stateRefusal("Invoices with `paid` payments cannot be voided.");
  if (invoice.status !== "open" && invoice.status !== "uncollectible") throw stateRefusal(NOT_OPEN);
  invoice.status = "void";
  invoice.voidedAt = unixNow();
  const view = invoiceView(context.account, invoice, context.baseUrl);
  context.emit("invoice.voided", view);
  return view;
}

export function markInvoiceUncollectible(context: RequestContext) {
  context.params.only([]);
  const invoice = findInvoice(context.account, context.id, "id");
  if (invoice.status === "uncollectible") throw stateRefusal("This invoice has already been marked uncollectible.");
  if (invoice.status !== "open") throw stateRefusal(NOT_OPEN);
  invoice.status = "uncollectible";
  invoice.markedUncollectibleAt = unixNow();
  const view = invoiceView(context.account, invoice, context.baseUrl);
  context.emit("invoice.marked_uncollectible", view);
  return view;
}

/**
 * draft → open: the invoice gets its number (the one given, or the customer's prefix and next
 * sequence number, e.g. "7KQ2M9XA-0001"), its hosted page and its effective date. An invoice with
 * nothing to pay is paid at once, as at the provider.
 */
function finalize(context: Emitting, invoice: InvoiceRecord): void {
  const customer = context.account.customers[invoice.customer]!;
  invoice.status = "open";
  invoice.finalizedAt = unixNow();
  if (!invoice.number) {
    invoice.number = `${customer.invoicePrefix}-${String(customer.nextInvoiceSequence).padStart(4, "0")}`;
    customer.nextInvoiceSequence += 1;
  }
  invoice.hostedToken = randomToken(40);
  customer.currency ??= invoice.currency;
  context.emit("invoice.finalized", invoiceView(context.account, invoice, context.baseUrl));
  if (invoiceAmounts(context.account, invoice).amountDue === 0) markPaid(context, invoice, "nothing_due");
}

/**
 * → paid. A payment on the hosted page is an attempt that succeeded (invoice.payment_succeeded,
 * then invoice.paid); money received outside the provider only marks it paid (invoice.paid).
 */
export function markPaid(context: Emitting, invoice: InvoiceRecord, paidBy: PaidBy): void {
  invoice.status = "paid";
  invoice.paidAt = unixNow();
  invoice.amountPaid = invoiceAmounts(context.account, invoice).amountDue;
  invoice.paidOutOfBand = paidBy === "out_of_band";
  if (paidBy === "hosted_page") invoice.attemptCount += 1;
  const view = invoiceView(context.account, invoice, context.baseUrl);
  if (paidBy === "hosted_page") context.emit("invoice.payment_succeeded", view);
  context.emit("invoice.paid", view);
}
