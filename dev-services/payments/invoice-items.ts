import { invalidParam, missingParam, noSuch, stateRefusal } from "./api-error";
import type { RequestContext } from "./context";
import { findCustomer } from "./customers";
import { newId, unixNow } from "./ids";
import { DEFAULT_CURRENCY, findInvoice } from "./invoices";
import { listPage, PAGING_PARAMS } from "./lists";
import { amountFromUnitDecimal, isDecimalString, isKnownCurrency } from "./money";
import type { AccountState, InvoiceItemRecord, InvoiceRecord } from "./records";
import { invoiceItemView } from "./views";

/**
 * /v1/invoiceitems: a line on a draft invoice, or pending for the customer's next invoice. Its
 * amount is `amount` (minor units) or `unit_amount_decimal` × `quantity`. Items change only while
 * their invoice is a draft.
 */
const NOT_EDITABLE = "Invalid invoice: This invoice is no longer editable";

function findItem(account: AccountState, id: string): InvoiceItemRecord {
  const item = account.invoiceItems[id];
  if (!item) throw noSuch("invoice item", id);
  return item;
}

function requireDraft(invoice: InvoiceRecord | undefined): void {
  if (invoice && invoice.status !== "draft") throw stateRefusal(NOT_EDITABLE, { code: "invoice_not_editable", param: "invoice" });
}

export function createInvoiceItem({ account, store, params, emit }: RequestContext) {
  params.only(["customer", "invoice", "amount", "unit_amount_decimal", "quantity", "currency", "description", "metadata"]);
  const customer = findCustomer(account, params.requiredString("customer"), "customer");
  const invoiceId = params.string("invoice");
  const invoice = invoiceId === undefined ? undefined : findInvoice(account, invoiceId, "invoice");
  requireDraft(invoice);
  if (invoice && invoice.customer !== customer.id) throw invalidParam("invoice", `The invoice ${invoice.id} belongs to another customer.`);
  const currency = itemCurrency(params.string("currency"), invoice, customer.currency);
  const { amount, unitAmountDecimal, quantity } = itemAmount(params);
  const item: InvoiceItemRecord = {
    id: newId("ii"),
    seq: store.nextSeq(),
    created: unixNow(),
    customer: customer.id,
    invoice: invoice?.id ?? null,
    lineId: newId("il"),
    amount,
    currency,
    description: params.nullableString("description") ?? null,
    metadata: params.metadata(),
    quantity,
    unitAmountDecimal,
  };
  account.invoiceItems[item.id] = item;
  invoice?.itemIds.push(item.id);
  const view = invoiceItemView(item);
  emit("invoiceitem.created", view);
  return view;
}

export function retrieveInvoiceItem({ account, params, id }: RequestContext) {
  params.only([]);
  return invoiceItemView(findItem(account, id));
}

export function listInvoiceItems({ account, params }: RequestContext) {
  params.only(["customer", "invoice", "pending", ...PAGING_PARAMS]);
  const customer = params.string("customer");
  const invoice = params.string("invoice");
  const pending = params.boolean("pending");
  const items = Object.values(account.invoiceItems).filter(
    (item) =>
      (customer === undefined || item.customer === customer) &&
      (invoice === undefined || item.invoice === invoice) &&
      (pending === undefined || (item.invoice === null) === pending),
  );
  return listPage(items, params, "/v1/invoiceitems", invoiceItemView);
}

export function deleteInvoiceItem({ account, params, id, emit }: RequestContext) {
  params.only([]);
  const item = findItem(account, id);
  const invoice = item.invoice === null ? undefined : account.invoices[item.invoice];
  requireDraft(invoice);
  if (invoice) invoice.itemIds = invoice.itemIds.filter((itemId) => itemId !== item.id);
  delete account.invoiceItems[item.id];
  emit("invoiceitem.deleted", invoiceItemView(item));
  return { id: item.id, object: "invoiceitem", deleted: true };
}

function itemCurrency(given: string | undefined, invoice: InvoiceRecord | undefined, customerCurrency: string | null): string {
  const currency = given?.toLowerCase();
  if (currency !== undefined && !isKnownCurrency(currency)) throw invalidParam("currency", `Invalid currency: ${currency}.`);
  if (invoice && currency !== undefined && currency !== invoice.currency) {
    throw invalidParam("currency", `The currency of an invoice item (${currency}) must match the currency of its invoice (${invoice.currency}).`);
  }
  return currency ?? invoice?.currency ?? customerCurrency ?? DEFAULT_CURRENCY;
}

function itemAmount(params: RequestContext["params"]): { amount: number; unitAmountDecimal: string; quantity: number } {
  const amount = params.integer("amount");
  const unit = params.string("unit_amount_decimal");
  if (amount !== undefined && unit !== undefined) {
    throw invalidParam("amount", "You may only specify one of these parameters: amount, unit_amount_decimal.", "parameters_exclusive");
  }
  if (amount !== undefined && params.has("quantity")) {
    throw invalidParam("amount", "You may only specify one of these parameters: amount, quantity.", "parameters_exclusive");
  }
  if (amount !== undefined) return { amount, unitAmountDecimal: String(amount), quantity: 1 };
  if (unit === undefined) throw missingParam("amount");
  if (!isDecimalString(unit)) throw invalidParam("unit_amount_decimal", `Invalid decimal: ${unit}`);
  const quantity = params.integer("quantity", { min: 0 }) ?? 1;
  return { amount: amountFromUnitDecimal(unit, quantity), unitAmountDecimal: unit, quantity };
}
