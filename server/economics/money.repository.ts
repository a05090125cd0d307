import { and, asc, eq, inArray, isNotNull, notInArray, sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { nextVersion } from "../db/versions";
import { memberships, users } from "../db/schema/accounts";
import { benchParts } from "../db/schema/bench";
import { dealFeeRates, moneyEntries, moneySettings } from "../db/schema/economics";
import { episodes } from "../db/schema/slate";
import { dealInvoices, deals, sponsors } from "../db/schema/sponsors";

// Every query is scoped by channel: an id from another channel finds nothing.

type Db = Queryable;
export type EntryRow = typeof moneyEntries.$inferSelect & { memberName: string | null };
export type SettingsRow = typeof moneySettings.$inferSelect;

export async function findSettings(db: Db, channelId: string): Promise<SettingsRow | null> {
  const [row] = await db.select().from(moneySettings).where(eq(moneySettings.channelId, channelId));
  return row ?? null;
}

/** The first save makes the row (version 0 names "never saved"); later ones move the version on. */
export async function saveSettings(db: Db, channelId: string, version: number, values: { currency: string; hourRateMinor: number | null }) {
  if (version === 0) {
    const [row] = await db.insert(moneySettings).values({ channelId, ...values }).onConflictDoNothing().returning();
    return row ?? null;
  }
  const [row] = await db
    .update(moneySettings)
    .set({ ...values, version: nextVersion(moneySettings.version), updatedAt: new Date() })
    .where(and(eq(moneySettings.channelId, channelId), eq(moneySettings.version, version)))
    .returning();
  return row ?? null;
}

export async function hasMoneyRecorded(db: Db, channelId: string): Promise<boolean> {
  const result = await db.execute(sql`select exists(select 1 from ${moneyEntries} where ${moneyEntries.channelId} = ${channelId}) or exists(select 1 from ${dealFeeRates} where ${dealFeeRates.channelId} = ${channelId}) as found`);
  return (result.rows[0] as { found: boolean }).found;
}

const entryColumns = { entry: moneyEntries, memberName: users.name };
const toEntry = ({ entry, memberName }: { entry: typeof moneyEntries.$inferSelect; memberName: string | null }): EntryRow => ({ ...entry, memberName });

export async function listEntries(db: Db, channelId: string, episodeId: string): Promise<EntryRow[]> {
  const rows = await db
    .select(entryColumns)
    .from(moneyEntries)
    .leftJoin(users, eq(users.id, moneyEntries.memberId))
    .where(and(eq(moneyEntries.channelId, channelId), eq(moneyEntries.episodeId, episodeId)))
    .orderBy(asc(moneyEntries.occurredOn), asc(moneyEntries.createdAt));
  return rows.map(toEntry);
}

/** Every line of the channel, for its months and its export. */
export async function listChannelEntries(db: Db, channelId: string) {
  const rows = await db
    .select({ ...entryColumns, episodeTitle: episodes.title })
    .from(moneyEntries)
    .innerJoin(episodes, eq(episodes.id, moneyEntries.episodeId))
    .leftJoin(users, eq(users.id, moneyEntries.memberId))
    .where(eq(moneyEntries.channelId, channelId))
    .orderBy(asc(moneyEntries.occurredOn), asc(moneyEntries.createdAt));
  return rows.map((row) => ({ ...toEntry(row), episodeTitle: row.episodeTitle }));
}

export async function insertEntry(db: Db, values: typeof moneyEntries.$inferInsert) {
  const [row] = await db.insert(moneyEntries).values(values).returning();
  return row!;
}

export async function findEntry(db: Db, channelId: string, episodeId: string, entryId: string) {
  const [row] = await db
    .select()
    .from(moneyEntries)
    .where(and(eq(moneyEntries.id, entryId), eq(moneyEntries.channelId, channelId), eq(moneyEntries.episodeId, episodeId)))
    .for("update");
  return row ?? null;
}

export async function deleteEntry(db: Db, channelId: string, episodeId: string, entryId: string) {
  const [row] = await db
    .delete(moneyEntries)
    .where(and(eq(moneyEntries.id, entryId), eq(moneyEntries.channelId, channelId), eq(moneyEntries.episodeId, episodeId)))
    .returning();
  return row ?? null;
}

export async function setReceipt(db: Db, entryId: string, receipt: { receiptKey: string; receiptName: string; receiptType: string; receiptBytes: number }) {
  await db.update(moneyEntries).set({ ...receipt, updatedAt: new Date() }).where(eq(moneyEntries.id, entryId));
}

export async function findShelfPart(db: Db, channelId: string, partId: string) {
  const [row] = await db
    .select({ name: benchParts.name, priceAmount: benchParts.priceAmount, priceCurrency: benchParts.priceCurrency, supplier: benchParts.supplier })
    .from(benchParts)
    .where(and(eq(benchParts.id, partId), eq(benchParts.channelId, channelId)));
  return row ?? null;
}

/** The shelf's parts with a price: what a part line may be. */
export async function listPricedParts(db: Db, channelId: string) {
  return db
    .select({ id: benchParts.id, name: benchParts.name, priceAmount: benchParts.priceAmount, priceCurrency: benchParts.priceCurrency, supplier: benchParts.supplier })
    .from(benchParts)
    .where(and(eq(benchParts.channelId, channelId), isNotNull(benchParts.priceAmount), isNotNull(benchParts.priceCurrency)))
    .orderBy(asc(benchParts.name));
}

export async function listMembers(db: Db, channelId: string) {
  return db
    .select({ id: users.id, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(users.name));
}

export async function findEpisodeBudget(db: Db, channelId: string, episodeId: string) {
  const [row] = await db
    .select({ budgetAmount: episodes.budgetAmount, budgetCurrency: episodes.budgetCurrency })
    .from(episodes)
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)));
  return row ?? null;
}

// A fee counts once the deal is agreed: neither still being negotiated nor called off.
const notAgreed = ["negotiating", "cancelled"] as const;
const invoicedStatuses = ["open", "paid", "uncollectible"] as const;

/** The episode's deals with what has been invoiced and paid of each, in the deal's currency. */
export async function listEpisodeDealMoney(db: Db, channelId: string, episodeId: string) {
  return db
    .select({
      dealId: deals.id,
      company: sponsors.company,
      state: deals.state,
      feeAmount: deals.feeAmount,
      currency: deals.currency,
      rate: dealFeeRates.rate,
      invoicedMinor: sql<string>`coalesce((select sum(${dealInvoices.amountMinor}) from ${dealInvoices} where ${dealInvoices.dealId} = ${deals.id} and ${inArray(dealInvoices.status, [...invoicedStatuses])}), 0)`,
      paidMinor: sql<string>`coalesce((select sum(${dealInvoices.amountMinor}) from ${dealInvoices} where ${dealInvoices.dealId} = ${deals.id} and ${dealInvoices.status} = 'paid'), 0)`,
    })
    .from(deals)
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .leftJoin(dealFeeRates, eq(dealFeeRates.dealId, deals.id))
    .where(and(eq(deals.channelId, channelId), eq(deals.episodeId, episodeId), notInArray(deals.state, [...notAgreed])))
    .orderBy(asc(sponsors.company), asc(deals.createdAt));
}

export async function findEpisodeDeal(db: Db, channelId: string, episodeId: string, dealId: string) {
  const [row] = await db
    .select({ currency: deals.currency })
    .from(deals)
    .where(and(eq(deals.id, dealId), eq(deals.channelId, channelId), eq(deals.episodeId, episodeId)));
  return row ?? null;
}

export async function saveDealRate(db: Db, values: typeof dealFeeRates.$inferInsert) {
  await db
    .insert(dealFeeRates)
    .values(values)
    .onConflictDoUpdate({ target: dealFeeRates.dealId, set: { rate: values.rate, recordedBy: values.recordedBy, recordedAt: new Date() } });
}

/** Every paid invoice of the channel, with its episode and the rate of its deal. */
export async function listPaidInvoices(db: Db, channelId: string) {
  return db
    .select({
      episodeId: deals.episodeId,
      episodeTitle: episodes.title,
      company: sponsors.company,
      label: dealInvoices.label,
      number: dealInvoices.number,
      amountMinor: dealInvoices.amountMinor,
      currency: dealInvoices.currency,
      paidAt: dealInvoices.paidAt,
      rate: dealFeeRates.rate,
    })
    .from(dealInvoices)
    .innerJoin(deals, eq(deals.id, dealInvoices.dealId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .leftJoin(dealFeeRates, eq(dealFeeRates.dealId, deals.id))
    .where(and(eq(dealInvoices.channelId, channelId), eq(dealInvoices.status, "paid")))
    .orderBy(asc(dealInvoices.paidAt));
}
