import { convertMinor, hoursMinor } from "../../shared/economics/conversion";
import type { DealMoneyView, EntryView, SettingsView } from "../../shared/economics/schemas";
import { toMinorUnits } from "../../shared/money/minor-units";
import type { IsoDate } from "../../shared/sponsors/dates";
import type { EntryRow, SettingsRow, listEpisodeDealMoney } from "./money.repository";

/** The channel's settings, or where a channel starts: euros, no hourly rate, never saved (version 0). */
export function settingsOf(row: SettingsRow | null, currencyChangeable: boolean): SettingsView {
  return { currency: row?.currency ?? "EUR", hourRateMinor: row?.hourRateMinor ?? null, currencyChangeable, version: row?.version ?? 0 };
}

/** A line as the page shows it; hours are costed at the channel's hourly rate now, when it has one. */
export function entryView(row: EntryRow, settings: SettingsView, receiptUrl: string | null): EntryView {
  const hours = row.kind === "hours";
  const costed = hours && row.minutes !== null && settings.hourRateMinor !== null ? hoursMinor(row.minutes, settings.hourRateMinor) : null;
  return {
    id: row.id,
    kind: row.kind,
    category: row.category,
    label: row.label,
    source: row.source,
    partId: row.partId,
    partName: row.partName,
    quantity: row.quantity,
    unitMinor: row.unitMinor,
    memberId: row.memberId,
    memberName: row.memberName,
    minutes: row.minutes,
    amountMinor: hours ? costed : row.amountMinor,
    currency: hours ? settings.currency : row.currency,
    rate: row.rate,
    channelMinor: hours ? costed : row.channelMinor,
    occurredOn: row.occurredOn as IsoDate,
    receipt: row.receiptKey && receiptUrl ? { fileName: row.receiptName ?? "receipt", contentType: row.receiptType ?? "", url: receiptUrl } : null,
  };
}

type DealMoneyRow = Awaited<ReturnType<typeof listEpisodeDealMoney>>[number];

/** A deal's fee, invoiced and paid, and the same in the channel's currency once its rate is known. */
export function dealView(row: DealMoneyRow, channelCurrency: string): DealMoneyView {
  const feeMinor = toMinorUnits(row.feeAmount, row.currency) ?? 0;
  const invoicedMinor = Number(row.invoicedMinor);
  const paidMinor = Number(row.paidMinor);
  const same = row.currency === channelCurrency;
  const rate = same ? null : row.rate;
  const inChannel = (minor: number) => convertMinor(minor, row.currency, channelCurrency, rate ?? "1");
  return {
    dealId: row.dealId,
    company: row.company,
    state: row.state,
    currency: row.currency,
    feeMinor,
    invoicedMinor,
    paidMinor,
    rate,
    channel: same || rate ? { feeMinor: inChannel(feeMinor), invoicedMinor: inChannel(invoicedMinor), paidMinor: inChannel(paidMinor) } : null,
  };
}
