import { invalidParam, noSuch } from "./api-error";
import type { RequestContext } from "./context";
import { newId, randomToken, unixNow } from "./ids";
import { listPage, PAGING_PARAMS } from "./lists";
import type { Params } from "./params";
import type { CustomerRecord, AccountState } from "./records";
import { customerView, previousAttributes } from "./views";

/** /v1/customers: create, retrieve, update, list (filter by email). A customer is a sponsor. */
const EDITABLE = ["name", "email", "description", "phone", "metadata", "preferred_locales", "invoice_prefix"] as const;
const INVOICE_PREFIX_ALPHABET = "ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789";

/** Prefixes of 3 to 12 capital letters or digits, as the provider asks (from memory). */
function invoicePrefixParam(params: Params): string | undefined {
  const prefix = params.string("invoice_prefix");
  if (prefix !== undefined && !/^[A-Z0-9]{3,12}$/.test(prefix)) {
    throw invalidParam("invoice_prefix", "Invalid invoice_prefix: use 3 to 12 capital letters or digits.");
  }
  return prefix;
}

export function findCustomer(account: AccountState, id: string, param = "id"): CustomerRecord {
  const customer = account.customers[id];
  if (!customer) throw noSuch("customer", id, param, param === "id" ? 404 : 400);
  return customer;
}

export function createCustomer({ account, store, params, emit }: RequestContext) {
  params.only(EDITABLE);
  const customer: CustomerRecord = {
    id: newId("cus"),
    seq: store.nextSeq(),
    created: unixNow(),
    name: params.nullableString("name") ?? null,
    email: params.nullableString("email") ?? null,
    description: params.nullableString("description") ?? null,
    phone: params.nullableString("phone") ?? null,
    metadata: params.metadata(),
    preferredLocales: params.stringList("preferred_locales") ?? [],
    // The provider gives each customer a prefix of capital letters and digits for invoice numbers.
    invoicePrefix: invoicePrefixParam(params) ?? randomToken(8, INVOICE_PREFIX_ALPHABET),
    nextInvoiceSequence: 1,
    currency: null,
  };
  account.customers[customer.id] = customer;
  const view = customerView(customer);
  emit("customer.created", view);
  return view;
}

export function retrieveCustomer({ account, params, id }: RequestContext) {
  params.only([]);
  return customerView(findCustomer(account, id));
}

export function updateCustomer({ account, params, id, emit }: RequestContext) {
  params.only(EDITABLE);
  const customer = findCustomer(account, id);
  const before = customerView(customer);
  // Every parameter is read (and checked) before anything changes: a refused update changes nothing.
  const changes = {
    name: params.nullableString("name"),
    email: params.nullableString("email"),
    description: params.nullableString("description"),
    phone: params.nullableString("phone"),
    metadata: params.metadata(customer.metadata),
    preferredLocales: params.stringList("preferred_locales"),
    invoicePrefix: invoicePrefixParam(params),
  };
  for (const [field, value] of Object.entries(changes)) {
    if (value !== undefined) Object.assign(customer, { [field]: value });
  }
  const after = customerView(customer);
  const changed = previousAttributes(before, after);
  if (Object.keys(changed).length > 0) emit("customer.updated", after, changed);
  return after;
}

export function listCustomers({ account, params }: RequestContext) {
  params.only(["email", ...PAGING_PARAMS]);
  const email = params.string("email");
  const customers = Object.values(account.customers).filter((customer) => email === undefined || customer.email === email);
  return listPage(customers, params, "/v1/customers", customerView);
}
