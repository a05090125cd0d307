import { z } from "zod";
import { calendarDateSchema } from "../fields/dates";
import { oneLine } from "../fields/text";
import { versionSchema } from "../http/version";
import { plainAmountText } from "../sponsors/invoices";
import type { IsoDate } from "../sponsors/dates";
import { rateMillionths, readMinutes } from "./conversion";
import type { EpisodeTotals, MonthFigures } from "./totals";

/** What a line of an episode's money is: three kinds of cost, and income other than sponsor fees. */
export const entryKinds = ["part", "purchase", "hours", "income"] as const;
export type EntryKind = (typeof entryKinds)[number];
export const entryKindLabels: Record<EntryKind, string> = { part: "Part from the shelf", purchase: "Other purchase", hours: "Hours", income: "Other income" };

export const purchaseCategories = ["materials", "travel", "rental", "other"] as const;
export type PurchaseCategory = (typeof purchaseCategories)[number];
export const purchaseCategoryLabels: Record<PurchaseCategory, string> = { materials: "Materials", travel: "Travel", rental: "Rental", other: "Other" };

const currencySchema = z.string({ error: "Pick a currency." }).regex(/^[A-Z]{3}$/, "Pick a currency (a three-letter code such as EUR).");

/** A rate typed by the member for the day; blank when the amount is in the channel's currency. */
export const rateSchema = z
  .string({ error: "Enter the rate." })
  .trim()
  .refine((v) => v === "" || rateMillionths(v) !== null, { message: "Write the rate as a number above zero with at most six decimals, e.g. 0.92." })
  .transform((v) => (v === "" ? null : v));

const amountSchema = z
  .string({ error: "Enter the amount." })
  .trim()
  .refine((v) => v !== "", { message: "Enter the amount." })
  .refine((v) => v === "" || plainAmountText(v) !== null, { message: "Write the amount as a number, e.g. 42 or 42.50." });

const label = (blank: string) => oneLine(120, { blank, tooLong: "Keep it under 120 characters." });

const common = { occurredOn: calendarDateSchema, rate: rateSchema };

export const newEntrySchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("part"), partId: z.uuid({ error: "Pick a part from the shelf." }), quantity: z.number({ error: "Enter how many were used." }).int("Use whole parts.").min(1, "Use at least one.").max(100_000, "That is more than 100,000 parts."), ...common }),
    z.strictObject({
      kind: z.literal("purchase"),
      category: z.enum(purchaseCategories, { error: "Pick what kind of purchase it was." }),
      label: label("Say what was bought."),
      source: oneLine(120, { tooLong: "Keep it under 120 characters." }),
      amount: amountSchema,
      currency: currencySchema,
      ...common,
    }),
    z.strictObject({
      kind: z.literal("hours"),
      memberId: z.uuid({ error: "Pick the member." }),
      label: oneLine(120, { tooLong: "Keep it under 120 characters." }),
      hours: z
        .string({ error: "Enter the hours." })
        .trim()
        .refine((v) => readMinutes(v) !== null, { message: "Write the hours as 2.5 or 2:30." })
        .refine((v) => (readMinutes(v) ?? 0) <= 24 * 60 * 31, { message: "Record at most a month of hours at once." }),
      occurredOn: calendarDateSchema,
    }),
    z.strictObject({ kind: z.literal("income"), label: label("Say where the income is from."), amount: amountSchema, currency: currencySchema, ...common }),
  ],
  { error: "Pick what kind of line this is." },
);
export type NewEntryInput = z.input<typeof newEntrySchema>;
export type NewEntry = z.output<typeof newEntrySchema>;

/** The channel's currency (every total is in it) and the hourly rate members' hours are costed at. */
export const moneySettingsSchema = z.strictObject({
  currency: currencySchema,
  hourRate: z
    .string({ error: "Enter the rate or leave it blank." })
    .trim()
    .refine((v) => v === "" || plainAmountText(v) !== null, { message: "Write the rate as a number, e.g. 40 or 42.50." })
    .transform((v) => (v === "" ? null : v)),
  version: versionSchema,
});
export type MoneySettingsInput = z.input<typeof moneySettingsSchema>;

export const dealRateSchema = z.strictObject({ rate: rateSchema.refine((v) => v !== null, { message: "Enter the rate." }) });

export interface ReceiptView {
  fileName: string;
  contentType: string;
  url: string;
}

export interface EntryView {
  id: string;
  kind: EntryKind;
  category: PurchaseCategory | null;
  label: string;
  /** Where it was bought. */
  source: string;
  partId: string | null;
  partName: string | null;
  quantity: number | null;
  unitMinor: number | null;
  memberId: string | null;
  memberName: string | null;
  minutes: number | null;
  /** In the line's own currency; null for hours while the channel has no hourly rate. */
  amountMinor: number | null;
  currency: string;
  rate: string | null;
  /** In the channel's currency; null when the line counts nothing yet. */
  channelMinor: number | null;
  occurredOn: IsoDate;
  receipt: ReceiptView | null;
}

export interface DealMoneyView {
  dealId: string;
  company: string;
  state: string;
  currency: string;
  feeMinor: number;
  invoicedMinor: number;
  paidMinor: number;
  /** The rate the member entered for a fee in another currency; null in the channel's own. */
  rate: string | null;
  /** Figures in the channel's currency; null while a fee in another currency waits for its rate. */
  channel: { feeMinor: number; invoicedMinor: number; paidMinor: number } | null;
}

export interface BudgetView {
  amountMinor: number;
  currency: string;
  /** False when the budget is in another currency than the channel's totals. */
  comparable: boolean;
  leftMinor: number | null;
}

export interface SettingsView {
  currency: string;
  hourRateMinor: number | null;
  /** False once money is recorded: totals would change meaning. */
  currencyChangeable: boolean;
  version: number;
}

export interface EpisodeMoneyView {
  settings: SettingsView;
  entries: EntryView[];
  deals: DealMoneyView[];
  members: { id: string; name: string }[];
  /** The shelf's parts that have a price, for a part line. */
  parts: { id: string; name: string; priceMinor: number; currency: string; supplier: string }[];
  totals: EpisodeTotals;
  budget: BudgetView | null;
}

export interface EpisodeMarginView {
  episodeId: string;
  title: string;
  costsMinor: number;
  receivedMinor: number;
  marginMinor: number;
}

export interface ChannelMoneyView {
  settings: SettingsView;
  months: MonthFigures[];
  episodes: EpisodeMarginView[];
}
