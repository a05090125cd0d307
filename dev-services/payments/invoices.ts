import { invalidParam, invalidRequest, noSuch, stateRefusal } from "./api-error";
import type { RequestContext } from "./context";
import { findCustomer } from "./customers";
import { newId, unixNow } from "./ids";
import { listPage, PAGING_PARAMS } from "./lists";
import { isKnownCurrency } from "./money";
import type { Params } from "./params";
import type { AccountState, CollectionMethod, InvoiceRecord, InvoiceStatus } from "./records";
import { invoiceItemsOf, invoiceView, lineItemView, previousAttributes } from "./views";

/**
 * /v1/invoices: create a draft, retrieve, update, list, delete a draft, list its lines. The state
 * changes (finalize, send, pay, void, mark uncollectible) are in invoice-actions.ts.
 */
export const DEFAULT_CURRENCY = "usd";
const DAY = 24 * 60 * 60;
const STATUSES: readonly InvoiceStatus[] = ["draft", "open", "void", "paid", "uncollectible"];
const COLLECTION_METHODS: readonly CollectionMethod[] = ["charge_automatically", "send_invoice"];
const NEEDS_DUE_TERMS = "If invoice collection method is 'send_invoice', you must specify 'due_date' or 'days_until_due'.";
const DRAFT_FIELDS = ["collection_method", "days_until_due", "due_date", "description", "footer", "number"] as const;

/**
 * The provider names the missing invoice `invoice` in the GET, DELETE and /send answers and `id`
 * in the other actions' (as recorded from its answers); the stand-in does the same.
 */
export function findInvoice(account: AccountState, id: string, param: "id" | "invoice"): InvoiceRecord {
  const invoice = account.invoices[id];
  if (!invoice) throw noSuch("invoice", id, param);
  return invoice;
}

export function createInvoice(context: RequestContext) {
  const { account, store, params, emit } = context;
  params.only(["customer", "currency", "auto_advance", "metadata", "pending_invoice_items_behavior", ...DRAFT_FIELDS]);
  const customer = findCustomer(account, params.requiredString("customer"), "customer");
  const created = unixNow();
  const collectionMethod = params.oneOf("collection_method", COLLECTION_METHODS) ?? "charge_automatically";
  const invoice: InvoiceRecord = {
    id: newId("in"),
    seq: store.nextSeq(),
    created,
    customer: customer.id,
    currency: currencyParam(params) ?? customer.currency ?? DEFAULT_CURRENCY,
    collectionMethod,
    ...dueTerms(params, collectionMethod, created),
    description: params.nullableString("description") ?? null,
    footer: params.nullableString("footer") ?? null,
    metadata: params.metadata(),
    number: params.nullableString("number") ?? null,
    // Manual invoices don't advance by themselves unless asked (the provider's default is false).
    autoAdvance: params.boolean("auto_advance") ?? false,
    status: "draft",
    itemIds: [],
    finalizedAt: null,
    paidAt: null,
    voidedAt: null,
    markedUncollectibleAt: null,
    amountPaid: 0,
    paidOutOfBand: false,
    attemptCount: 0,
    hostedToken: null,
  };
  // Pending items join only when asked; the provider's default for manual invoices is "exclude".
  if (params.oneOf("pending_invoice_items_behavior", ["include", "exclude"]) === "include") {
    const pending = Object.values(account.invoiceItems).filter((item) => item.customer === customer.id && item.invoice === null && item.currency === invoice.currency);
    for (const item of pending.sort((a, b) => a.seq - b.seq)) {
      item.invoice = invoice.id;
      invoice.itemIds.push(item.id);
    }
  }
  account.invoices[invoice.id] = invoice;
  const view = invoiceView(account, invoice, context.baseUrl);
  emit("invoice.created", view);
  return view;
}

export function retrieveInvoice({ account, params, id, baseUrl }: RequestContext) {
  params.only([]);
  return invoiceView(account, findInvoice(account, id, "invoice"), baseUrl);
}

export function updateInvoice({ account, params, id, baseUrl, emit }: RequestContext) {
  params.only(["auto_advance", "metadata", ...DRAFT_FIELDS]);
  const invoice = findInvoice(account, id, "id");
  const locked = DRAFT_FIELDS.find((field) => params.has(field));
  if (invoice.status !== "draft" && locked) {
    throw stateRefusal("Finalized invoices can't be updated in this way", { param: locked });
  }
  const before = invoiceView(account, invoice, baseUrl);
  // Every parameter is read (and checked) before anything changes: a refused update changes nothing.
  const collectionMethod = params.oneOf("collection_method", COLLECTION_METHODS) ?? invoice.collectionMethod;
  const termsGiven = params.has("days_until_due") || params.has("due_date");
  const changes = {
    metadata: params.metadata(invoice.metadata),
    autoAdvance: params.boolean("auto_advance"),
    description: params.nullableString("description"),
    footer: params.nullableString("footer"),
    number: params.nullableString("number"),
    collectionMethod,
    ...(termsGiven ? dueTerms(params, collectionMethod, invoice.created) : keptTerms(invoice, collectionMethod)),
  };
  for (const [field, value] of Object.entries(changes)) {
    if (value !== undefined) Object.assign(invoice, { [field]: value });
  }
  const after = invoiceView(account, invoice, baseUrl);
  const changed = previousAttributes(before, after);
  if (Object.keys(changed).length > 0) emit("invoice.updated", after, changed);
  return after;
}

export function listInvoices({ account, params, baseUrl }: RequestContext) {
  params.only(["customer", "status", "collection_method", ...PAGING_PARAMS]);
  const customer = params.string("customer");
  const status = params.oneOf("status", STATUSES);
  const collectionMethod = params.oneOf("collection_method", COLLECTION_METHODS);
  const invoices = Object.values(account.invoices).filter(
    (invoice) =>
      (customer === undefined || invoice.customer === customer) &&
      (status === undefined || invoice.status === status) &&
      (collectionMethod === undefined || invoice.collectionMethod === collectionMethod),
  );
  return listPage(invoices, params, "/v1/invoices", (invoice) => invoiceView(account, invoice, baseUrl));
}

export function deleteInvoice({ account, params, id, baseUrl, emit }: RequestContext) {
  params.only([]);
  const invoice = findInvoice(account, id, "invoice");
  if (invoice.status !== "draft") throw stateRefusal("You can only delete draft invoices.");
  const view = invoiceView(account, invoice, baseUrl);
  delete account.invoices[invoice.id];
  emit("invoice.deleted", view);
  return { id: invoice.id, object: "invoice", deleted: true };
}

export function listInvoiceLines({ account, params, id }: RequestContext) {
  params.only([...PAGING_PARAMS]);
  const invoice = findInvoice(account, id, "invoice");
  const lines = invoiceItemsOf(account, invoice).map((item) => ({ id: item.lineId, seq: item.seq, item }));
  return listPage(lines, params, `/v1/invoices/${invoice.id}/lines`, ({ item }) => lineItemView(item, invoice.id), "as given");
}

function currencyParam(params: Params): string | undefined {
  const currency = params.string("currency")?.toLowerCase();
  if (currency !== undefined && !isKnownCurrency(currency)) throw invalidParam("currency", `Invalid currency: ${currency}.`);
  return currency;
}

/**
 * The payment terms. An invoice sent to be paid by the customer needs a due date or a number of
 * days (due_date = created + days × 86400, as the provider computes it); one charged
 * automatically takes neither. Refusals worded as the provider words them.
 */
function dueTerms(params: Params, collectionMethod: CollectionMethod, created: number): { daysUntilDue: number | null; dueDate: number | null } {
  const daysUntilDue = params.integer("days_until_due", { min: 0 });
  const dueDate = params.integer("due_date", { min: 0 });
  if (daysUntilDue !== undefined && dueDate !== undefined) {
    throw invalidParam("days_until_due", "You may only specify one of these parameters: days_until_due, due_date.", "parameters_exclusive");
  }
  if (collectionMethod === "send_invoice" && daysUntilDue === undefined && dueDate === undefined) {
    throw invalidRequest(NEEDS_DUE_TERMS);
  }
  if (collectionMethod === "charge_automatically" && (daysUntilDue !== undefined || dueDate !== undefined)) {
    throw invalidRequest("You can only specify 'due_date' or 'days_until_due' if invoice collection method is 'send_invoice'.");
  }
  if (daysUntilDue !== undefined) return { daysUntilDue, dueDate: created + daysUntilDue * DAY };
  return { daysUntilDue: null, dueDate: dueDate ?? null };
}

function keptTerms(invoice: InvoiceRecord, collectionMethod: CollectionMethod) {
  if (collectionMethod === "charge_automatically") return { daysUntilDue: null, dueDate: null };
  if (invoice.daysUntilDue === null && invoice.dueDate === null) throw invalidRequest(NEEDS_DUE_TERMS);
  return { daysUntilDue: invoice.daysUntilDue, dueDate: invoice.dueDate };
}
