import Stripe from "stripe";
import type { Database } from "../db/client";
import { AppError } from "../http/app-error";
import { itemsFollowInvoice } from "./invoice-items";
import { lockInvoiceByProviderId, recordPaymentEvent, updateInvoiceRow } from "./invoices.repository";
import { providerFields } from "./invoices.service";
import { requirePayments, WEBHOOK_TOLERANCE_SECONDS, type Payments } from "./payments";

export interface PaymentEventDeps {
  db: Database;
  payments: Payments | null;
}

export type EventOutcome = "applied" | "unchanged" | "ignored" | "repeated";

/** The event, if its signature is the provider's over exactly these bytes and no older than the tolerance. */
function verified(payments: Payments, rawBody: Buffer, signature: string | undefined): Stripe.Event {
  if (!signature) throw new AppError("validation_failed", "The event carries no signature.");
  try {
    return payments.stripe.webhooks.constructEvent(rawBody, signature, payments.webhookSecret, WEBHOOK_TOLERANCE_SECONDS);
  } catch (error) {
    if (error instanceof Stripe.errors.StripeSignatureVerificationError || error instanceof SyntaxError) {
      throw new AppError("validation_failed", "The event's signature doesn't match its body, or it is too old.");
    }
    throw error;
  }
}

const isInvoice = (object: unknown): object is Stripe.Invoice => typeof object === "object" && object !== null && (object as { object?: unknown }).object === "invoice";

/**
 * One event from the payments provider, signed. Recorded once by its id in the same transaction as
 * what it changes: a redelivered event finds its row and changes nothing, and one whose processing
 * failed left no row, so its redelivery is processed in full. States only move forward, so events
 * out of order leave the latest state; an event about an object Kerf doesn't hold is recorded and ignored.
 */
export async function receivePaymentEvent(deps: PaymentEventDeps, rawBody: Buffer, signature: string | undefined): Promise<EventOutcome> {
  const event = verified(requirePayments(deps.payments), rawBody, signature);
  const object = event.data.object as { id?: string };
  return deps.db.transaction(async (tx) => {
    const invoice = isInvoice(object) && object.id ? await lockInvoiceByProviderId(tx, object.id) : null;
    let outcome: "applied" | "unchanged" | "ignored" = "ignored";
    if (invoice && isInvoice(object)) {
      const fields = providerFields(invoice, object, { paidAllowed: true });
      const changed = Object.entries(fields).some(([key, value]) => String(value) !== String(invoice[key as keyof typeof invoice]));
      outcome = changed ? "applied" : "unchanged";
      if (changed) {
        const saved = await updateInvoiceRow(tx, invoice.id, fields);
        if (saved.status === "paid" && invoice.status !== "paid") {
          const system = (itemId: string) => ({ channelId: saved.channelId, deliverableId: itemId, actorId: null, actorName: "Kerf", actorKind: "system" as const });
          await itemsFollowInvoice(tx, saved, "payment", system, `Paid in full, as the payments provider reported (invoice ${saved.number ?? saved.providerId})`);
        }
      }
    }
    const first = await recordPaymentEvent(tx, {
      eventId: event.id,
      type: event.type,
      objectId: object.id ?? null,
      channelId: invoice?.channelId ?? null,
      invoiceId: invoice?.id ?? null,
      outcome,
      providerCreatedAt: new Date(event.created * 1000),
    });
    // Seen before: roll back whatever this pass did (nothing, as states only move forward, but be exact).
    if (!first) throw new RepeatedEvent();
    return outcome as EventOutcome;
  }).catch((error: unknown) => {
    if (error instanceof RepeatedEvent) return "repeated" as const;
    throw error;
  });
}

class RepeatedEvent extends Error {}
