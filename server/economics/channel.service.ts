import type { z } from "zod";
import { convertMinor } from "../../shared/economics/conversion";
import { moneyCsv, type MoneyCsvLine } from "../../shared/economics/money-csv";
import { type ChannelMoneyView, type EntryView, entryKindLabels, type EpisodeMarginView, type moneySettingsSchema, type SettingsView } from "../../shared/economics/schemas";
import { type DatedAmount, monthlyMargins } from "../../shared/economics/totals";
import { toMinorUnits, tooManyDecimals } from "../../shared/money/minor-units";
import { plainAmountText } from "../../shared/sponsors/invoices";
import type { Database, Queryable } from "../db/client";
import { AppError, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import * as repo from "./money.repository";
import { entryView, settingsOf } from "./views";

async function currentSettings(db: Queryable, channelId: string): Promise<SettingsView> {
  return settingsOf(await repo.findSettings(db, channelId), !(await repo.hasMoneyRecorded(db, channelId)));
}

export const moneySettings = (db: Database, channelId: string) => currentSettings(db, channelId);

/** The currency totals are in can change only while no money is recorded; the hourly rate any time. */
export async function changeSettings(db: Database, caller: Caller, input: z.output<typeof moneySettingsSchema>): Promise<SettingsView> {
  const { channelId } = caller;
  return db.transaction(async (tx) => {
    const before = await currentSettings(tx, channelId);
    if (input.currency !== before.currency && !before.currencyChangeable) {
      throw new AppError("validation_failed", "Some fields need attention.", { currency: `Money is recorded in ${before.currency} already; the channel's currency stays.` });
    }
    const text = input.hourRate === null ? null : plainAmountText(input.hourRate);
    const hourRateMinor = text === null ? null : toMinorUnits(text, input.currency);
    if (input.hourRate !== null && hourRateMinor === null) throw new AppError("validation_failed", "Some fields need attention.", { hourRate: tooManyDecimals(input.currency) });
    const saved = await repo.saveSettings(tx, channelId, input.version, { currency: input.currency, hourRateMinor });
    if (!saved) throw staleSave("money setting", before);
    return settingsOf(saved, before.currencyChangeable);
  });
}

/** Every amount of the channel in its currency: the lines, and each paid invoice on the day it was paid. */
async function channelLines(db: Database, channelId: string) {
  const settings = await currentSettings(db, channelId);
  const [entries, paid] = await Promise.all([repo.listChannelEntries(db, channelId), repo.listPaidInvoices(db, channelId)]);
  const lines = entries.map((row) => ({ row, view: entryView(row, settings, null) }));
  const payments = paid.map((row) => {
    const same = row.currency === settings.currency;
    const channelMinor = same ? row.amountMinor : row.rate ? convertMinor(row.amountMinor, row.currency, settings.currency, row.rate) : null;
    // Paid on the UTC day the provider reported it.
    return { ...row, on: (row.paidAt ?? new Date(0)).toISOString().slice(0, 10), rate: same ? null : row.rate, channelMinor };
  });
  return { settings, lines, payments };
}

const sideOf = (view: EntryView): "cost" | "income" => (view.kind === "income" ? "income" : "cost");

export async function channelMoney(db: Database, channelId: string): Promise<ChannelMoneyView> {
  const { settings, lines, payments } = await channelLines(db, channelId);
  const dated: DatedAmount[] = [
    ...lines.flatMap(({ view }) => (view.channelMinor === null ? [] : [{ on: view.occurredOn, side: sideOf(view), channelMinor: view.channelMinor }])),
    ...payments.flatMap((p) => (p.channelMinor === null ? [] : [{ on: p.on, side: "income" as const, channelMinor: p.channelMinor }])),
  ];
  const episodes = new Map<string, EpisodeMarginView>();
  const add = (episodeId: string, title: string, side: "cost" | "income", minor: number) => {
    const figures = episodes.get(episodeId) ?? { episodeId, title, costsMinor: 0, receivedMinor: 0, marginMinor: 0 };
    if (side === "cost") figures.costsMinor += minor;
    else figures.receivedMinor += minor;
    figures.marginMinor = figures.receivedMinor - figures.costsMinor;
    episodes.set(episodeId, figures);
  };
  for (const { row, view } of lines) add(row.episodeId, row.episodeTitle, sideOf(view), view.channelMinor ?? 0);
  for (const p of payments) if (p.episodeId) add(p.episodeId, p.episodeTitle, "income", p.channelMinor ?? 0);
  return { settings, months: monthlyMargins(dated), episodes: [...episodes.values()].sort((a, b) => a.title.localeCompare(b.title)) };
}

export async function channelMoneyCsv(db: Database, channelId: string): Promise<string> {
  const { settings, lines, payments } = await channelLines(db, channelId);
  const rows: MoneyCsvLine[] = [
    ...lines.map(({ row, view }) => ({
      on: view.occurredOn,
      episode: row.episodeTitle,
      side: sideOf(view),
      kind: entryKindLabels[view.kind],
      description: view.label,
      party: view.kind === "hours" ? (view.memberName ?? "") : view.source,
      quantity: view.quantity,
      amountMinor: view.amountMinor,
      currency: view.currency,
      rate: view.rate,
      channelMinor: view.channelMinor,
    })),
    ...payments.map((p) => ({
      on: p.on,
      episode: p.episodeTitle,
      side: "income" as const,
      kind: "Sponsor payment",
      description: p.number ? `${p.label} (${p.number})` : p.label,
      party: p.company,
      quantity: null,
      amountMinor: p.amountMinor,
      currency: p.currency,
      rate: p.rate,
      channelMinor: p.channelMinor,
    })),
  ].sort((a, b) => a.on.localeCompare(b.on));
  return moneyCsv(rows, settings.currency);
}
