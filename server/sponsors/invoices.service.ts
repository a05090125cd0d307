import { randomUUID } from "node:crypto";
import type Stripe from "stripe";
import type { z } from "zod";
import { dateInZone } from "../../shared/sponsors/dates";
import { fromMinorUnits, toMinorUnits, tooManyDecimals } from "../../shared/money/minor-units";
import { isOverdue, nextStatus, plainAmountText, stageOf, type InvoiceAction, type InvoiceStatus, type InvoiceView, type newInvoiceSchema } from "../../shared/sponsors/invoices";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import type { Jobs } from "../jobs/queue";
import { channelShare } from "../mail/mail-jobs";
import { takeMailQuota } from "../mail/quotas";
import { requireConfirmedAddress } from "../mail/senders";
import { findDeal, listContactsOf } from "./deals.repository";
import { eventBy } from "./deals.service";
import { invoiceMail } from "./invoice-mail";
import {
  findInvoiceOfDeal,
  findSponsorCustomer,
  insertInvoice,
  invoicedMinor,
  keepSponsorCustomer,
  listDealInvoices,
  lockInvoice,
  nextInvoicePosition,
  updateInvoiceRow,
  type InvoiceRow,
} from "./invoices.repository";
import { requirePayments, utcDateOf, viaProvider, type Payments } from "./payments";
import { itemsFollowInvoice } from "./invoice-items";

export interface InvoiceDeps {
  db: Database;
  payments: Payments | null;
  jobs: Pick<Jobs, "enqueueMail">;
}

const fieldError = (field: string, message: string) => new AppError("validation_failed", "Some fields need attention.", { [field]: message });

export function invoiceViewOf(row: InvoiceRow, today: string): InvoiceView {
  const sentAt = row.sentAt?.toISOString() ?? null;
  return {
    id: row.id,
    dealId: row.dealId,
    position: row.position,
    label: row.label,
    amountMinor: row.amountMinor,
    currency: row.currency,
    daysUntilDue: row.daysUntilDue,
    number: row.number,
    status: row.status,
    stage: stageOf({ status: row.status, sentAt }),
    hostedUrl: row.hostedUrl,
    dueDate: row.dueDate,
    finalisedAt: row.finalisedAt?.toISOString() ?? null,
    sentAt,
    paidAt: row.paidAt?.toISOString() ?? null,
    overdue: isOverdue(row, today),
    version: row.version,
  };
}

export async function listInvoices(db: Database, caller: Caller, dealId: string, now = new Date()): Promise<InvoiceView[]> {
  const today = dateInZone(now, caller.timeZone);
  return (await listDealInvoices(db, caller.channelId, dealId)).map((row) => invoiceViewOf(row, today));
}

/**
 * The sponsor as the provider's customer: the one kept, or one made now. A new one is kept by the
 * transaction that records the invoice; its idempotency key gives back the same customer if that fails.
 */
async function customerOf(deps: InvoiceDeps, stripe: Stripe, caller: Caller, sponsorId: string, email: string | null): Promise<{ id: string; isNew: boolean }> {
  const sponsor = await findSponsorCustomer(deps.db, caller.channelId, sponsorId);
  if (!sponsor) throw notFound("Sponsor");
  if (sponsor.customerId) return { id: sponsor.customerId, isNew: false };
  const customer = await viaProvider(() =>
    stripe.customers.create(
      { name: sponsor.company, ...(email ? { email } : {}), metadata: { kerf_channel: caller.channelId, kerf_sponsor: sponsor.id } },
      { idempotencyKey: `kerf-sponsor-${sponsor.id}` },
    ),
  );
  return { id: customer.id, isNew: true };
}

/** How much this invoice asks, in minor units: what was typed, or all of the fee still to invoice. */
async function amountToInvoice(db: Database, caller: Caller, deal: { id: string; feeAmount: string; currency: string }, typed: string | null): Promise<number> {
  const fee = toMinorUnits(deal.feeAmount, deal.currency);
  if (fee === null) throw fieldError("amount", `The deal's fee has more decimals than ${deal.currency} allows: correct the fee first.`);
  const left = fee - (await invoicedMinor(db, caller.channelId, deal.id));
  if (left <= 0) throw fieldError("amount", "The whole fee is already invoiced.");
  if (typed === null) return left;
  const text = plainAmountText(typed);
  const amount = text === null ? null : toMinorUnits(text, deal.currency);
  if (amount === null) throw fieldError("amount", tooManyDecimals(deal.currency));
  if (amount <= 0) throw fieldError("amount", "An invoice asks for more than nothing.");
  if (amount > left) throw fieldError("amount", `That is more than the ${fromMinorUnits(left, deal.currency)} ${deal.currency} of the fee not yet invoiced.`);
  return amount;
}

/** A draft invoice at the provider for the whole fee left or one instalment of it, with its one line. */
export async function createInvoice(deps: InvoiceDeps, caller: Caller, dealId: string, input: z.output<typeof newInvoiceSchema>, now = new Date()): Promise<InvoiceView> {
  const { stripe } = requirePayments(deps.payments);
  const found = await findDeal(deps.db, caller.channelId, dealId);
  if (!found) throw notFound("Deal");
  const { deal } = found;
  if (deal.state === "cancelled") throw new AppError("conflict", "This deal is cancelled: there is nothing to invoice.");
  const amountMinor = await amountToInvoice(deps.db, caller, deal, input.amount);
  const contact = (await listContactsOf(deps.db, caller.channelId, deal.sponsorId)).find((c) => c.id === deal.contactId) ?? null;
  const { id: customer, isNew } = await customerOf(deps, stripe, caller, deal.sponsorId, contact?.email ?? null);
  const id = randomUUID();
  const currency = deal.currency.toLowerCase();
  const metadata = { kerf_channel: caller.channelId, kerf_deal: deal.id, kerf_invoice: id };
  const draft = await viaProvider(async () => {
    const created = await stripe.invoices.create(
      {
        customer,
        currency,
        collection_method: "send_invoice",
        days_until_due: deal.paymentTermsDays,
        auto_advance: false,
        pending_invoice_items_behavior: "exclude",
        description: `${found.company}: sponsored segment in "${found.episodeTitle}"`,
        metadata,
      },
      { idempotencyKey: `kerf-invoice-${id}` },
    );
    await stripe.invoiceItems.create({ customer, invoice: created.id, amount: amountMinor, currency, description: input.label, metadata }, { idempotencyKey: `kerf-invoice-${id}-line` });
    return created;
  });
  return deps.db.transaction(async (tx) => {
    if (isNew) await keepSponsorCustomer(tx, caller.channelId, deal.sponsorId, customer);
    const row = await insertInvoice(tx, {
      id,
      channelId: caller.channelId,
      dealId: deal.id,
      position: await nextInvoicePosition(tx, caller.channelId, deal.id),
      label: input.label,
      amountMinor,
      currency: deal.currency,
      daysUntilDue: deal.paymentTermsDays,
      providerId: draft.id!,
      createdBy: caller.userId,
    });
    return invoiceViewOf(row, dateInZone(now, caller.timeZone));
  });
}

/** The provider's invoice as Kerf keeps it; its status moves only forward, and "paid" only from the webhook. */
export function providerFields(row: InvoiceRow, invoice: Stripe.Invoice, options: { paidAllowed: boolean }): Partial<InvoiceRow> {
  const reported = invoice.status as InvoiceStatus;
  const status = reported === "paid" && !options.paidAllowed ? row.status : nextStatus(row.status, reported);
  const paidSeconds = invoice.status_transitions?.paid_at;
  return {
    status,
    number: row.number ?? invoice.number ?? null,
    hostedUrl: row.hostedUrl ?? invoice.hosted_invoice_url ?? null,
    dueDate: row.dueDate ?? utcDateOf(invoice.due_date),
    finalisedAt: row.finalisedAt ?? (invoice.status_transitions?.finalized_at ? new Date(invoice.status_transitions.finalized_at * 1000) : null),
    paidAt: status === "paid" ? (row.paidAt ?? (paidSeconds ? new Date(paidSeconds * 1000) : new Date())) : row.paidAt,
  };
}

const providerCalls: Record<InvoiceAction, (stripe: Stripe, id: string, key: string) => Promise<Stripe.Invoice>> = {
  finalise: (stripe, id, key) => stripe.invoices.finalizeInvoice(id, { auto_advance: false }, { idempotencyKey: key }),
  send: (stripe, id, key) => stripe.invoices.sendInvoice(id, {}, { idempotencyKey: key }),
  void: (stripe, id, key) => stripe.invoices.voidInvoice(id, {}, { idempotencyKey: key }),
  "write-off": (stripe, id, key) => stripe.invoices.markUncollectible(id, {}, { idempotencyKey: key }),
};

/** What each action needs of the invoice as Kerf holds it, said before the provider is asked. */
function refusalOf(row: InvoiceRow, action: InvoiceAction): string | null {
  if (row.status === "paid" || row.status === "void") return `This invoice is ${row.status === "paid" ? "paid" : "cancelled"}: it can't change any more.`;
  if (action === "finalise" && row.status !== "draft") return "This invoice is already finalised.";
  if ((action === "send" || action === "write-off") && row.status === "draft") return "Finalise the invoice first.";
  if (action === "send" && row.status !== "open") return "Only an invoice waiting for payment can be sent.";
  return null;
}

/** Finalise, send, cancel (void) or write off an invoice at the provider, then keep what it answers. */
export async function actOnInvoice(deps: InvoiceDeps, caller: Caller, dealId: string, invoiceId: string, action: InvoiceAction, now = new Date()): Promise<InvoiceView> {
  const { stripe } = requirePayments(deps.payments);
  const row = await findInvoiceOfDeal(deps.db, caller.channelId, dealId, invoiceId);
  if (!row) throw notFound("Invoice");
  const refusal = refusalOf(row, action);
  if (refusal) throw new AppError("conflict", refusal);
  if (action === "send") requireConfirmedAddress(caller);
  // One key per action and version: a double click sends one request's worth, a later resend is new.
  const key = `kerf-${action}-${row.id}-${row.version}`;
  // The provider voids only finalised invoices; a draft is deleted there, and Kerf keeps it as cancelled.
  const draftGone = action === "void" && row.status === "draft";
  const answer = draftGone ? await viaProvider(() => stripe.invoices.del(row.providerId)).then(() => null) : await viaProvider(() => providerCalls[action](stripe, row.providerId, key));
  return inTransaction(deps.db, async (tx, sql) => {
    const locked = (await lockInvoice(tx, caller.channelId, invoiceId))!;
    const fields = answer ? providerFields(locked, answer, { paidAllowed: false }) : { status: "void" as const };
    if (action === "send") {
      await takeMailQuota(tx, "invoice", caller);
      fields.sentAt = new Date();
    }
    const saved = await updateInvoiceRow(tx, locked.id, fields);
    if (action === "send") {
      await itemsFollowInvoice(tx, saved, "invoice", (itemId) => eventBy(caller, itemId), `Invoice ${saved.number ?? ""} sent to the sponsor`.replace("  ", " "));
      await deps.jobs.enqueueMail(invoiceMail.job({ invoiceId: saved.id }, channelShare(caller.channelId)), { db: sql });
    }
    return invoiceViewOf(saved, dateInZone(now, caller.timeZone));
  });
}
