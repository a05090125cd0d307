import type { Metadata } from "./params";

/**
 * What the stand-in keeps, per account, in its JSON file. These are its own records; the
 * provider-shaped objects the API answers with are made from them in views.ts.
 */
export type InvoiceStatus = "draft" | "open" | "paid" | "void" | "uncollectible";
export type CollectionMethod = "send_invoice" | "charge_automatically";

interface Stored {
  id: string;
  /** Creation order across the whole stand-in: lists are newest first, ties broken by this. */
  seq: number;
  created: number;
}

export interface CustomerRecord extends Stored {
  name: string | null;
  email: string | null;
  description: string | null;
  phone: string | null;
  metadata: Metadata;
  preferredLocales: string[];
  invoicePrefix: string;
  nextInvoiceSequence: number;
  /** Set by the customer's first finalized invoice, as the provider does. */
  currency: string | null;
}

export interface InvoiceItemRecord extends Stored {
  customer: string;
  /** null while pending: it joins the customer's next invoice that includes pending items. */
  invoice: string | null;
  lineId: string;
  amount: number;
  currency: string;
  description: string | null;
  metadata: Metadata;
  quantity: number;
  unitAmountDecimal: string;
}

export interface InvoiceRecord extends Stored {
  customer: string;
  currency: string;
  collectionMethod: CollectionMethod;
  daysUntilDue: number | null;
  dueDate: number | null;
  description: string | null;
  footer: string | null;
  metadata: Metadata;
  /** A number given by the caller, or the customer's next one at finalization. */
  number: string | null;
  autoAdvance: boolean;
  status: InvoiceStatus;
  itemIds: string[];
  finalizedAt: number | null;
  paidAt: number | null;
  voidedAt: number | null;
  markedUncollectibleAt: number | null;
  amountPaid: number;
  paidOutOfBand: boolean;
  attemptCount: number;
  /** The unguessable part of hosted_invoice_url, made at finalization. */
  hostedToken: string | null;
}

export interface EventRecord extends Stored {
  type: string;
  apiVersion: string | null;
  object: Record<string, unknown>;
  previousAttributes: Record<string, unknown> | null;
  request: { id: string | null; idempotency_key: string | null };
  /** pending_webhooks as first delivered: fixed, so every delivery of the event sends the same bytes. */
  pendingAtCreation: number;
}

export interface WebhookEndpointRecord extends Stored {
  url: string;
  enabledEvents: string[];
  description: string | null;
  metadata: Metadata;
  status: "enabled" | "disabled";
}

export type DeliveryKind = "automatic" | "resend" | "replay";

export interface DeliveryAttempt {
  kind: DeliveryKind;
  /** When it was sent, in milliseconds. */
  at: number;
  /** The `t` of its Stripe-Signature header, in unix seconds. */
  signedAt: number;
  status: number | null;
  error: string | null;
}

export interface DeliveryRecord {
  id: string;
  eventId: string;
  endpointId: string;
  kind: DeliveryKind;
  /** held: waiting for a test to release it (to send events out of order). */
  state: "pending" | "held" | "delivered" | "failed";
  attempts: DeliveryAttempt[];
  nextAttemptAt: number;
  /** The header of the first attempt, kept so a test can replay the captured request as it was. */
  firstSignature: string | null;
}

export interface IdempotencyRecord {
  fingerprint: string;
  status: number;
  body: unknown;
  requestId: string;
  created: number;
}

export interface AccountState {
  id: string;
  name: string;
  secretKey: string;
  webhookSecret: string;
  holdDeliveries: boolean;
  customers: Record<string, CustomerRecord>;
  invoices: Record<string, InvoiceRecord>;
  invoiceItems: Record<string, InvoiceItemRecord>;
  events: Record<string, EventRecord>;
  webhookEndpoints: Record<string, WebhookEndpointRecord>;
  deliveries: Record<string, DeliveryRecord>;
  idempotency: Record<string, IdempotencyRecord>;
}
