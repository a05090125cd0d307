import { bigint, date, index, integer, pgEnum, pgTable, text, uuid } from "drizzle-orm/pg-core";
import { entryKinds, purchaseCategories } from "../../../shared/economics/schemas";
import { benchParts } from "./bench";
import { createdAt, id, timestamps, updatedAt, version } from "./columns";
import { episodeRef } from "./slate";
import { deals } from "./sponsors";
import { channelRef, channels, personRef, users } from "./accounts";

export const moneyEntryKindEnum = pgEnum("money_entry_kind", entryKinds);
export const purchaseCategoryEnum = pgEnum("purchase_category", purchaseCategories);

/** The channel's currency, which every total is in, and the hourly rate members' hours cost. */
export const moneySettings = pgTable("money_settings", {
  channelId: uuid("channel_id")
    .primaryKey()
    .references(() => channels.id, { onDelete: "cascade" }),
  currency: text("currency").notNull(),
  hourRateMinor: bigint("hour_rate_minor", { mode: "number" }),
  version: version(),
  updatedAt: updatedAt(),
});

/**
 * A line of an episode's money: a part from the shelf (quantity × its price then, where bought), another
 * purchase (with a receipt), a member's hours, or income other than sponsor fees. Amounts are integers
 * in the line's currency's minor unit; one in another currency than the channel's keeps the rate the
 * member entered for the day (`rate`, decimal text) and the converted amount (`channel_minor`). Hours
 * keep minutes only: they are costed at the channel's hourly rate.
 */
export const moneyEntries = pgTable(
  "money_entries",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    kind: moneyEntryKindEnum("kind").notNull(),
    category: purchaseCategoryEnum("category"),
    label: text("label").notNull().default(""),
    source: text("source").notNull().default(""),
    partId: uuid("part_id").references(() => benchParts.id, { onDelete: "set null" }),
    // The part's name as it was, so the line still reads when the shelf forgets the part.
    partName: text("part_name"),
    quantity: integer("quantity"),
    unitMinor: bigint("unit_minor", { mode: "number" }),
    memberId: uuid("member_id").references(() => users.id, { onDelete: "set null" }),
    minutes: integer("minutes"),
    amountMinor: bigint("amount_minor", { mode: "number" }),
    currency: text("currency").notNull(),
    rate: text("rate"),
    channelMinor: bigint("channel_minor", { mode: "number" }),
    occurredOn: date("occurred_on").notNull(),
    receiptKey: text("receipt_key").unique(),
    receiptName: text("receipt_name"),
    receiptType: text("receipt_type"),
    receiptBytes: bigint("receipt_bytes", { mode: "number" }),
    createdBy: personRef("created_by"),
    ...timestamps(),
  },
  (table) => [index("money_entries_episode_idx").on(table.channelId, table.episodeId, table.occurredOn), index("money_entries_channel_month_idx").on(table.channelId, table.occurredOn)],
);

/** The rate a member entered for a deal whose fee is in another currency than the channel's. */
export const dealFeeRates = pgTable(
  "deal_fee_rates",
  {
    dealId: uuid("deal_id")
      .primaryKey()
      .references(() => deals.id, { onDelete: "cascade" }),
    channelId: channelRef(),
    rate: text("rate").notNull(),
    recordedBy: personRef("recorded_by"),
    recordedAt: createdAt(),
  },
  (table) => [index("deal_fee_rates_channel_idx").on(table.channelId)],
);
