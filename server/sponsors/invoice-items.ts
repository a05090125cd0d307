import { and, eq, ne, sql } from "drizzle-orm";
import { toMinorUnits } from "../../shared/money/minor-units";
import type { Queryable } from "../db/client";
import { dealInvoices, deals } from "../db/schema/sponsors";
import { insertEvents, updateDeliverableRow, type NewEvent } from "./deals.repository";
import { openItemsOfKind, type InvoiceRow } from "./invoices.repository";

type EventStart = (itemId: string) => Omit<NewEvent, "what">;

/** Whether the deal's whole fee is invoiced and every invoice that counts is paid. */
async function dealFullyPaid(db: Queryable, invoice: InvoiceRow): Promise<boolean> {
  const [deal] = await db.select({ fee: deals.feeAmount, currency: deals.currency }).from(deals).where(eq(deals.id, invoice.dealId));
  const [sums] = await db
    .select({ paid: sql<string>`coalesce(sum(${dealInvoices.amountMinor}) filter (where ${dealInvoices.status} = 'paid'), 0)`, unpaid: sql<number>`count(*) filter (where ${dealInvoices.status} <> 'paid')::int` })
    .from(dealInvoices)
    .where(and(eq(dealInvoices.dealId, invoice.dealId), ne(dealInvoices.status, "void")));
  const fee = deal ? toMinorUnits(deal.fee, deal.currency) : null;
  return fee !== null && sums !== undefined && sums.unpaid === 0 && Number(sums.paid) >= fee;
}

/**
 * The deal's invoice item is done once an invoice is sent; its payment item once the whole fee is
 * invoiced and paid. Each change is written to the item's history under who (or what) caused it.
 */
export async function itemsFollowInvoice(db: Queryable, invoice: InvoiceRow, kind: "invoice" | "payment", start: EventStart, note: string): Promise<void> {
  if (kind === "payment" && !(await dealFullyPaid(db, invoice))) return;
  for (const item of await openItemsOfKind(db, invoice.channelId, invoice.dealId, kind)) {
    await updateDeliverableRow(db, invoice.channelId, item.id, { status: "done" });
    await insertEvents(db, [{ ...start(item.id), what: "status", fromStatus: item.status, toStatus: "done", note }]);
  }
}
