import { safeText, toCsv } from "../csv/csv";
import { fromMinorUnits } from "../money/minor-units";

/** One line of the channel's money as the export writes it; amounts in minor units. */
export interface MoneyCsvLine {
  on: string;
  episode: string;
  side: "cost" | "income";
  kind: string;
  description: string;
  /** Where it was bought, or who worked the hours, or which sponsor paid. */
  party: string;
  quantity: number | null;
  amountMinor: number | null;
  currency: string;
  rate: string | null;
  channelMinor: number | null;
}

/**
 * The channel's money as CSV (RFC 4180): one record per line, amounts as plain decimals with the
 * currency's minor-unit digits (ISO 4217), so a spreadsheet reads them as numbers; people's text is
 * made formula-safe. An amount that counts nothing yet (hours with no rate) is left empty.
 */
export function moneyCsv(lines: readonly MoneyCsvLine[], channelCurrency: string): string {
  const header = ["date", "episode", "cost or income", "kind", "description", "where bought, who or from whom", "quantity", "amount", "currency", "rate used", `amount in ${channelCurrency}`];
  const rows = lines.map((line) => [
    line.on,
    safeText(line.episode),
    line.side,
    line.kind,
    safeText(line.description),
    safeText(line.party),
    line.quantity === null ? "" : String(line.quantity),
    line.amountMinor === null ? "" : fromMinorUnits(line.amountMinor, line.currency),
    line.currency,
    line.rate ?? "",
    line.channelMinor === null ? "" : fromMinorUnits(line.channelMinor, channelCurrency),
  ]);
  return toCsv([header, ...rows]);
}
