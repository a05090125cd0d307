import type { AccountState, CustomerRecord, EventRecord, InvoiceItemRecord, InvoiceRecord, WebhookEndpointRecord } from "./records";

/**
 * The provider-shaped objects the API answers with, made from the stand-in's records. Field names
 * and types follow the SDK's own declarations (node_modules/stripe/esm/resources/*.d.ts); fields
 * for features the stand-in does not model (tax, discounts, shipping, PDFs) carry their empty values.
 */
const LINES_SHOWN = 10;

export function customerView(customer: CustomerRecord) {
  return {
    id: customer.id,
    object: "customer",
    address: null,
    balance: 0,
    created: customer.created,
    currency: customer.currency,
    default_source: null,
    delinquent: false,
    description: customer.description,
    discount: null,
    email: customer.email,
    invoice_prefix: customer.invoicePrefix,
    invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
    livemode: false,
    metadata: customer.metadata,
    name: customer.name,
    next_invoice_sequence: customer.nextInvoiceSequence,
    phone: customer.phone,
    preferred_locales: customer.preferredLocales,
    shipping: null,
    tax_exempt: "none",
    test_clock: null,
  };
}

export function invoiceItemView(item: InvoiceItemRecord) {
  return {
    id: item.id,
    object: "invoiceitem",
    amount: item.amount,
    currency: item.currency,
    customer: item.customer,
    customer_account: null,
    date: item.created,
    description: item.description,
    discountable: true,
    discounts: [],
    invoice: item.invoice,
    livemode: false,
    metadata: item.metadata,
    net_amount: item.amount,
    parent: null,
    period: { start: item.created, end: item.created },
    pricing: { type: "price_details", unit_amount_decimal: item.unitAmountDecimal },
    proration: false,
    proration_details: { credited_items: null, discount_amounts: [] },
    quantity: item.quantity,
    quantity_decimal: String(item.quantity),
    tax_rates: [],
    test_clock: null,
  };
}

export function lineItemView(item: InvoiceItemRecord, invoiceId: string) {
  return {
    id: item.lineId,
    object: "line_item",
    amount: item.amount,
    currency: item.currency,
    description: item.description,
    discount_amounts: [],
    discountable: true,
    discounts: [],
    invoice: invoiceId,
    livemode: false,
    metadata: item.metadata,
    parent: {
      type: "invoice_item_details",
      invoice_item_details: { invoice_item: item.id, proration: false, proration_details: { credited_items: null }, subscription: null },
      subscription_item_details: null,
    },
    period: { start: item.created, end: item.created },
    pretax_credit_amounts: [],
    pricing: { type: "price_details", unit_amount_decimal: item.unitAmountDecimal },
    quantity: item.quantity,
    quantity_decimal: String(item.quantity),
    subscription: null,
    subtotal: item.amount,
    taxes: [],
  };
}

export function invoiceItemsOf(account: AccountState, invoice: InvoiceRecord): InvoiceItemRecord[] {
  return invoice.itemIds.map((id) => account.invoiceItems[id]).filter((item): item is InvoiceItemRecord => item !== undefined);
}

export function invoiceAmounts(account: AccountState, invoice: InvoiceRecord) {
  const subtotal = invoiceItemsOf(account, invoice).reduce((sum, item) => sum + item.amount, 0);
  const amountDue = Math.max(subtotal, 0);
  return { subtotal, total: subtotal, amountDue, amountRemaining: amountDue - invoice.amountPaid };
}

export function hostedInvoiceUrl(baseUrl: string, invoice: InvoiceRecord): string | null {
  return invoice.hostedToken ? `${baseUrl}/i/${invoice.hostedToken}` : null;
}

export function invoiceView(account: AccountState, invoice: InvoiceRecord, baseUrl: string) {
  const customer = account.customers[invoice.customer];
  const amounts = invoiceAmounts(account, invoice);
  const lines = invoiceItemsOf(account, invoice).map((item) => lineItemView(item, invoice.id));
  return {
    id: invoice.id,
    object: "invoice",
    account_country: null,
    account_name: account.name,
    account_tax_ids: null,
    amount_due: amounts.amountDue,
    amount_overpaid: 0,
    amount_paid: invoice.amountPaid,
    amount_paid_off_stripe: invoice.paidOutOfBand ? invoice.amountPaid : 0,
    amount_remaining: amounts.amountRemaining,
    amount_shipping: 0,
    application: null,
    attempt_count: invoice.attemptCount,
    attempted: invoice.attemptCount > 0,
    auto_advance: invoice.autoAdvance,
    automatic_tax: { disabled_reason: null, enabled: false, liability: null, provider: null, status: null },
    automatically_finalizes_at: null,
    billing_reason: "manual",
    collection_method: invoice.collectionMethod,
    created: invoice.created,
    currency: invoice.currency,
    custom_fields: null,
    customer: invoice.customer,
    customer_account: null,
    customer_address: null,
    customer_email: customer?.email ?? null,
    customer_name: customer?.name ?? null,
    customer_phone: customer?.phone ?? null,
    customer_shipping: null,
    customer_tax_exempt: "none",
    customer_tax_ids: [],
    default_payment_method: null,
    default_source: null,
    default_tax_rates: [],
    description: invoice.description,
    discounts: [],
    due_date: invoice.dueDate,
    effective_at: invoice.finalizedAt,
    ending_balance: invoice.finalizedAt === null ? null : 0,
    footer: invoice.footer,
    from_invoice: null,
    hosted_invoice_url: hostedInvoiceUrl(baseUrl, invoice),
    invoice_pdf: null,
    issuer: { type: "self" },
    last_finalization_error: null,
    latest_revision: null,
    lines: {
      object: "list",
      data: lines.slice(0, LINES_SHOWN),
      has_more: lines.length > LINES_SHOWN,
      total_count: lines.length,
      url: `/v1/invoices/${invoice.id}/lines`,
    },
    livemode: false,
    metadata: invoice.metadata,
    next_payment_attempt: null,
    number: invoice.number,
    on_behalf_of: null,
    parent: null,
    payment_settings: { default_mandate: null, payment_method_options: null, payment_method_types: null },
    period_end: invoice.created,
    period_start: invoice.created,
    post_payment_credit_notes_amount: 0,
    pre_payment_credit_notes_amount: 0,
    receipt_number: null,
    rendering: null,
    shipping_cost: null,
    shipping_details: null,
    starting_balance: 0,
    statement_descriptor: null,
    status: invoice.status,
    status_transitions: {
      finalized_at: invoice.finalizedAt,
      marked_uncollectible_at: invoice.markedUncollectibleAt,
      paid_at: invoice.paidAt,
      voided_at: invoice.voidedAt,
    },
    subtotal: amounts.subtotal,
    subtotal_excluding_tax: amounts.subtotal,
    test_clock: null,
    total: amounts.total,
    total_discount_amounts: [],
    total_excluding_tax: amounts.total,
    total_pretax_credit_amounts: [],
    total_taxes: [],
    webhooks_delivered_at: null,
  };
}

export function eventView(event: EventRecord, pendingWebhooks: number) {
  return {
    id: event.id,
    object: "event",
    api_version: event.apiVersion,
    created: event.created,
    data: { object: event.object, ...(event.previousAttributes ? { previous_attributes: event.previousAttributes } : {}) },
    livemode: false,
    pending_webhooks: pendingWebhooks,
    request: event.request,
    type: event.type,
  };
}

export function webhookEndpointView(endpoint: WebhookEndpointRecord) {
  return {
    id: endpoint.id,
    object: "webhook_endpoint",
    api_version: null,
    application: null,
    created: endpoint.created,
    description: endpoint.description,
    enabled_events: endpoint.enabledEvents,
    livemode: false,
    metadata: endpoint.metadata,
    status: endpoint.status,
    url: endpoint.url,
  };
}

/** The fields whose values changed, with their values before: an *.updated event's previous_attributes. */
export function previousAttributes(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, unknown> {
  const changed: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(before)) {
    if (JSON.stringify(value) !== JSON.stringify(after[key])) changed[key] = value;
  }
  return changed;
}
