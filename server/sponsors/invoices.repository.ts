import { and, asc, eq, lt, ne, sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { nextNumber } from "../db/counters";
import { nextVersion } from "../db/versions";
import { channels } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";
import { dealInvoices, deals, deliverables, paymentEvents, sponsors } from "../db/schema/sponsors";

// Every query a member's request makes is scoped by channel; the webhook's find an invoice by the
// provider's id, which is unique across channels, and then work in that invoice's channel.

export type InvoiceRow = typeof dealInvoices.$inferSelect;
type Db = Queryable;

export async function listDealInvoices(db: Db, channelId: string, dealId: string) {
  return db
    .select()
    .from(dealInvoices)
    .where(and(eq(dealInvoices.channelId, channelId), eq(dealInvoices.dealId, dealId)))
    .orderBy(asc(dealInvoices.position));
}

export async function findInvoiceOfDeal(db: Db, channelId: string, dealId: string, invoiceId: string) {
  const [row] = await db
    .select()
    .from(dealInvoices)
    .where(and(eq(dealInvoices.id, invoiceId), eq(dealInvoices.channelId, channelId), eq(dealInvoices.dealId, dealId)));
  return row ?? null;
}

/** The invoice the provider's object is, locked until the transaction ends: events about it take turns. */
export async function lockInvoiceByProviderId(db: Db, providerId: string) {
  const [row] = await db.select().from(dealInvoices).where(eq(dealInvoices.providerId, providerId)).for("update");
  return row ?? null;
}

export async function lockInvoice(db: Db, channelId: string, invoiceId: string) {
  const [row] = await db
    .select()
    .from(dealInvoices)
    .where(and(eq(dealInvoices.id, invoiceId), eq(dealInvoices.channelId, channelId)))
    .for("update");
  return row ?? null;
}

export async function nextInvoicePosition(db: Db, channelId: string, dealId: string): Promise<number> {
  const atLeast = sql`select coalesce(max(${dealInvoices.position}), 0) + 1 from ${dealInvoices} where ${dealInvoices.dealId} = ${dealId}`;
  return nextNumber(db, { scope: "invoice_position", ownerId: dealId, channelId, atLeast });
}

export async function insertInvoice(db: Db, values: typeof dealInvoices.$inferInsert) {
  const [row] = await db.insert(dealInvoices).values(values).returning();
  return row!;
}

export async function updateInvoiceRow(db: Db, invoiceId: string, values: Partial<typeof dealInvoices.$inferInsert>) {
  const [row] = await db
    .update(dealInvoices)
    .set({ ...values, version: nextVersion(dealInvoices.version), updatedAt: new Date() })
    .where(eq(dealInvoices.id, invoiceId))
    .returning();
  return row!;
}

/** The sum of a deal's invoices that still count (not cancelled), in minor units. */
export async function invoicedMinor(db: Db, channelId: string, dealId: string): Promise<number> {
  const [row] = await db
    .select({ total: sql<string>`coalesce(sum(${dealInvoices.amountMinor}), 0)` })
    .from(dealInvoices)
    .where(and(eq(dealInvoices.channelId, channelId), eq(dealInvoices.dealId, dealId), ne(dealInvoices.status, "void")));
  return Number(row?.total ?? 0);
}

export async function findSponsorCustomer(db: Db, channelId: string, sponsorId: string) {
  const [row] = await db
    .select({ id: sponsors.id, company: sponsors.company, customerId: sponsors.paymentsCustomerId })
    .from(sponsors)
    .where(and(eq(sponsors.id, sponsorId), eq(sponsors.channelId, channelId)));
  return row ?? null;
}

/** Keeps the sponsor's customer id; a sponsor that has one already keeps it (two first invoices at once). */
export async function keepSponsorCustomer(db: Db, channelId: string, sponsorId: string, customerId: string) {
  await db
    .update(sponsors)
    .set({ paymentsCustomerId: customerId })
    .where(and(eq(sponsors.id, sponsorId), eq(sponsors.channelId, channelId), sql`${sponsors.paymentsCustomerId} is null`));
}

/** Records a provider's event once: false when it was recorded before (a redelivery). */
export async function recordPaymentEvent(db: Db, values: typeof paymentEvents.$inferInsert): Promise<boolean> {
  const inserted = await db.insert(paymentEvents).values(values).onConflictDoNothing().returning({ id: paymentEvents.eventId });
  return inserted.length > 0;
}

/** The deal's items of one kind (its invoice or payment items) that are not done yet. */
export async function openItemsOfKind(db: Db, channelId: string, dealId: string, kind: "invoice" | "payment") {
  return db
    .select()
    .from(deliverables)
    .where(and(eq(deliverables.channelId, channelId), eq(deliverables.dealId, dealId), eq(deliverables.kind, kind), ne(deliverables.status, "done")));
}

/** Invoices waiting for payment past their due date, oldest first, with their deal's episode and sponsor. */
export async function overdueInvoices(db: Db, channelId: string | null, today: string) {
  return db
    .select({ invoice: dealInvoices, episodeId: episodes.id, episodeTitle: episodes.title, company: sponsors.company })
    .from(dealInvoices)
    .innerJoin(deals, eq(deals.id, dealInvoices.dealId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .where(and(channelId === null ? undefined : eq(dealInvoices.channelId, channelId), eq(dealInvoices.status, "open"), lt(dealInvoices.dueDate, today)))
    .orderBy(asc(dealInvoices.dueDate));
}

/** What the sponsor's mail about an invoice needs, read when the mail is sent. */
export async function findInvoiceForMail(db: Db, invoiceId: string) {
  const [row] = await db
    .select({ invoice: dealInvoices, episodeTitle: episodes.title, company: sponsors.company, sponsorId: deals.sponsorId, contactId: deals.contactId, channelId: deals.channelId, channelName: channels.name })
    .from(dealInvoices)
    .innerJoin(deals, eq(deals.id, dealInvoices.dealId))
    .innerJoin(channels, eq(channels.id, deals.channelId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .where(eq(dealInvoices.id, invoiceId));
  return row ?? null;
}

/** Marks an overdue invoice reminded; false when another scan did it first. */
export async function claimOverdueReminder(db: Db, invoiceId: string, at: Date): Promise<boolean> {
  const claimed = await db
    .update(dealInvoices)
    .set({ overdueRemindedAt: at })
    .where(and(eq(dealInvoices.id, invoiceId), sql`${dealInvoices.overdueRemindedAt} is null`))
    .returning({ id: dealInvoices.id });
  return claimed.length > 0;
}
