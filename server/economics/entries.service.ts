import { randomUUID } from "node:crypto";
import type { Request, Response } from "express";
import { convertMinor, lineMinor, readMinutes } from "../../shared/economics/conversion";
import type { EntryView, EpisodeMoneyView, NewEntry } from "../../shared/economics/schemas";
import { episodeTotals } from "../../shared/economics/totals";
import { toMinorUnits, tooManyDecimals } from "../../shared/money/minor-units";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import { plainAmountText } from "../../shared/sponsors/invoices";
import type { Database, Queryable } from "../db/client";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { receiveStill } from "../storage/photo-stream";
import { type Storage, viaStorage } from "../storage/storage";
import * as repo from "./money.repository";
import { dealView, entryView, settingsOf } from "./views";

const fieldError = (field: string, message: string) => new AppError("validation_failed", "Some fields need attention.", { [field]: message });

async function currentSettings(db: Queryable, channelId: string) {
  const row = await repo.findSettings(db, channelId);
  return settingsOf(row, !(await repo.hasMoneyRecorded(db, channelId)));
}

async function receiptUrl(storage: Storage, row: repo.EntryRow): Promise<string | null> {
  if (!row.receiptKey) return null;
  return viaStorage(() => storage.presignGet(row.receiptKey!, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: row.receiptType ?? undefined }));
}

/** An episode's costs and income, its deals' fees, its totals and its budget, in the channel's currency. */
export async function episodeMoney(db: Database, storage: Storage, channelId: string, episodeId: string): Promise<EpisodeMoneyView> {
  const settings = await currentSettings(db, channelId);
  const [rows, dealRows, members, budgetRow, partRows] = await Promise.all([
    repo.listEntries(db, channelId, episodeId),
    repo.listEpisodeDealMoney(db, channelId, episodeId),
    repo.listMembers(db, channelId),
    repo.findEpisodeBudget(db, channelId, episodeId),
    repo.listPricedParts(db, channelId),
  ]);
  const entries = await Promise.all(rows.map(async (row) => entryView(row, settings, await receiptUrl(storage, row))));
  const deals = dealRows.map((row) => dealView(row, settings.currency));
  const totals = episodeTotals(entries, deals);
  const parts = partRows.flatMap(({ id, name, priceAmount, priceCurrency, supplier }) => {
    const priceMinor = priceAmount && priceCurrency ? toMinorUnits(priceAmount, priceCurrency) : null;
    return priceMinor === null || !priceCurrency ? [] : [{ id, name, priceMinor, currency: priceCurrency, supplier }];
  });
  return { settings, entries, deals, members, parts, totals, budget: budgetOf(budgetRow, settings.currency, totals.costsMinor) };
}

function budgetOf(row: { budgetAmount: string | null; budgetCurrency: string | null } | null, currency: string, costsMinor: number) {
  if (!row?.budgetAmount || !row.budgetCurrency) return null;
  const amountMinor = toMinorUnits(row.budgetAmount, row.budgetCurrency);
  if (amountMinor === null) return null;
  const comparable = row.budgetCurrency === currency;
  return { amountMinor, currency: row.budgetCurrency, comparable, leftMinor: comparable ? amountMinor - costsMinor : null };
}

/** The amount in the line's currency and in the channel's, with the rate of the day when they differ. */
function converted(amountMinor: number, currency: string, channelCurrency: string, rate: string | null) {
  if (currency === channelCurrency) return { amountMinor, currency, rate: null, channelMinor: amountMinor };
  if (!rate) throw fieldError("rate", `Enter what one ${currency} was worth in ${channelCurrency} that day.`);
  return { amountMinor, currency, rate, channelMinor: convertMinor(amountMinor, currency, channelCurrency, rate) };
}

function typedAmount(typed: string, currency: string): number {
  const text = plainAmountText(typed);
  const minor = text === null ? null : toMinorUnits(text, currency);
  if (minor === null) throw fieldError("amount", tooManyDecimals(currency));
  if (minor <= 0) throw fieldError("amount", "Enter an amount above zero.");
  return minor;
}

async function lineValues(tx: Queryable, channelId: string, channelCurrency: string, input: NewEntry) {
  switch (input.kind) {
    case "part": {
      const part = await repo.findShelfPart(tx, channelId, input.partId);
      if (!part) throw fieldError("partId", "That part is not on the channel's shelf.");
      const unitMinor = part.priceAmount && part.priceCurrency ? toMinorUnits(part.priceAmount, part.priceCurrency) : null;
      if (unitMinor === null || !part.priceCurrency) throw fieldError("partId", "That part has no price on the shelf: add its price there, or record it as another purchase.");
      const money = converted(lineMinor(input.quantity, unitMinor), part.priceCurrency, channelCurrency, input.rate);
      return { partId: input.partId, partName: part.name, label: part.name, source: part.supplier, quantity: input.quantity, unitMinor, ...money };
    }
    case "purchase":
      return { category: input.category, label: input.label, source: input.source, ...converted(typedAmount(input.amount, input.currency), input.currency, channelCurrency, input.rate) };
    case "income":
      return { label: input.label, ...converted(typedAmount(input.amount, input.currency), input.currency, channelCurrency, input.rate) };
    case "hours": {
      const members = await repo.listMembers(tx, channelId);
      if (!members.some((member) => member.id === input.memberId)) throw fieldError("memberId", "Pick a member of this channel.");
      return { memberId: input.memberId, label: input.label, minutes: readMinutes(input.hours), currency: channelCurrency };
    }
  }
}

export async function addEntry(db: Database, caller: Caller, episodeId: string, input: NewEntry): Promise<EntryView> {
  const { channelId } = caller;
  return db.transaction(async (tx) => {
    const settings = await currentSettings(tx, channelId);
    const values = await lineValues(tx, channelId, settings.currency, input);
    const row = await repo.insertEntry(tx, { channelId, episodeId, kind: input.kind, occurredOn: input.occurredOn, createdBy: caller.userId, ...values });
    return entryView({ ...row, memberName: null }, settings, null);
  });
}

/** Removes the line and its receipt together: a store that is down leaves both as they were (503). */
export async function removeEntry(db: Database, storage: Storage, channelId: string, episodeId: string, entryId: string) {
  await db.transaction(async (tx) => {
    const row = await repo.deleteEntry(tx, channelId, episodeId, entryId);
    if (!row) throw notFound("Line");
    if (row.receiptKey) await viaStorage(() => storage.remove(row.receiptKey!));
  });
}

const receiptKey = (channelId: string, episodeId: string) => `${channelId}/${episodeId}/${randomUUID()}`;

/** A still of the purchase's receipt, streamed into storage; a new one replaces the old. */
export async function addReceipt(db: Database, storage: Storage, caller: Caller, episodeId: string, entryId: string, req: Request, res: Response) {
  const { channelId } = caller;
  const before = await repo.findEntry(db, channelId, episodeId, entryId);
  if (!before) throw notFound("Line");
  if (before.kind !== "purchase") throw new AppError("conflict", "Receipts go with purchases.");
  const { file } = await receiveStill(req, res, storage, () => receiptKey(channelId, episodeId));
  try {
    const old = await db.transaction(async (tx) => {
      const locked = await repo.findEntry(tx, channelId, episodeId, entryId);
      if (!locked) throw notFound("Line");
      await repo.setReceipt(tx, entryId, { receiptKey: file.key, receiptName: file.fileName, receiptType: file.contentType, receiptBytes: file.size });
      return locked.receiptKey;
    });
    if (old) await storage.remove(old).catch(() => undefined);
  } catch (error) {
    // Nothing of a refused receipt stays in storage.
    await storage.remove(file.key).catch(() => undefined);
    throw error;
  }
  const url = await viaStorage(() => storage.presignGet(file.key, { expiresInSeconds: PREVIEW_URL_SECONDS, contentType: file.contentType }));
  return { fileName: file.fileName, contentType: file.contentType, url };
}

/** The rate of the day for a fee in another currency than the channel's. */
export async function setDealRate(db: Database, caller: Caller, episodeId: string, dealId: string, rate: string) {
  const { channelId } = caller;
  await db.transaction(async (tx) => {
    const deal = await repo.findEpisodeDeal(tx, channelId, episodeId, dealId);
    if (!deal) throw notFound("Deal");
    const settings = await currentSettings(tx, channelId);
    if (deal.currency === settings.currency) throw new AppError("conflict", `The fee is in ${settings.currency} already: it needs no rate.`);
    await repo.saveDealRate(tx, { dealId, channelId, rate, recordedBy: caller.userId });
  });
}
