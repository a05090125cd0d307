import { type AnyPgColumn, bigint, boolean, date, index, integer, jsonb, numeric, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { createdAt, id, timestamps, updatedAt, version } from "./columns";
import { anchors, deliverableKinds, deliverableStatuses } from "../../../shared/sponsors/deliverables";
import { invoiceStatuses } from "../../../shared/sponsors/invoices";
import { dealStates, paymentTermsFrom, placements, reviewDecisions, type DealTemplate } from "../../../shared/sponsors/schemas";
import { channelRef, channels, personRef, users } from "./accounts";
import { episodes } from "./slate";

export const dealStateEnum = pgEnum("deal_state", dealStates);
export const placementEnum = pgEnum("deal_placement", placements);
export const paymentTermsFromEnum = pgEnum("payment_terms_from", paymentTermsFrom);
export const deliverableKindEnum = pgEnum("deliverable_kind", deliverableKinds);
export const deliverableStatusEnum = pgEnum("deliverable_status", deliverableStatuses);
export const deliverableAnchorEnum = pgEnum("deliverable_anchor", anchors);
export const reviewDecisionEnum = pgEnum("review_decision", reviewDecisions);
export const invoiceStatusEnum = pgEnum("invoice_status", invoiceStatuses);

export const sponsors = pgTable(
  "sponsors",
  {
    id: id(),
    channelId: channelRef(),
    company: text("company").notNull(),
    website: text("website"),
    notes: text("notes"),
    // The sponsor as a customer of the payments provider: made with the first invoice, then kept.
    paymentsCustomerId: text("payments_customer_id"),
    version: version(),
    ...timestamps(),
  },
  (table) => [index("sponsors_channel_idx").on(table.channelId)],
);

export const sponsorContacts = pgTable(
  "sponsor_contacts",
  {
    id: id(),
    channelId: channelRef(),
    sponsorId: uuid("sponsor_id")
      .notNull()
      .references(() => sponsors.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    email: text("email").notNull(),
    role: text("role"),
    version: version(),
    createdAt: createdAt(),
  },
  (table) => [index("sponsor_contacts_sponsor_idx").on(table.sponsorId)],
);

export const dealTemplates = pgTable(
  "deal_templates",
  {
    id: id(),
    channelId: channelRef(),
    name: text("name").notNull(),
    // Checked by templateInputSchema on the way in; read whole, never queried inside.
    items: jsonb("items").$type<DealTemplate["items"]>().notNull(),
    version: version(),
    ...timestamps(),
  },
  (table) => [index("deal_templates_channel_idx").on(table.channelId)],
);

export const deals = pgTable(
  "deals",
  {
    id: id(),
    channelId: channelRef(),
    // Null while a signed deal waits for its episode: recorded against the sponsor, tied later.
    episodeId: uuid("episode_id").references(() => episodes.id, { onDelete: "cascade" }),
    sponsorId: uuid("sponsor_id")
      .notNull()
      .references(() => sponsors.id, { onDelete: "restrict" }),
    contactId: uuid("contact_id").references(() => sponsorContacts.id, { onDelete: "set null" }),
    hostId: personRef("host_id"),
    state: dealStateEnum("state").notNull().default("negotiating"),
    placement: placementEnum("placement").notNull(),
    segmentSeconds: integer("segment_seconds").notNull(),
    talkingPoints: jsonb("talking_points").$type<string[]>().notNull().default([]),
    link: text("link"),
    promoCode: text("promo_code"),
    disclosureText: text("disclosure_text"),
    exclusivityNotes: text("exclusivity_notes"),
    descriptionCopy: text("description_copy"),
    script: text("script").notNull().default(""),
    goLiveDate: date("go_live_date"),
    // The episode's publish date the open items were last dated from: lets a missed move be caught up.
    publishBasis: date("publish_basis"),
    // Money: only roles with the "fees" area ever receive these columns.
    // Four decimals: as many as any currency has (ISO 4217's minor unit); each fee keeps to its own currency's.
    feeAmount: numeric("fee_amount", { precision: 16, scale: 4 }).notNull(),
    currency: text("currency").notNull(),
    paymentTermsDays: integer("payment_terms_days").notNull(),
    paymentTermsFrom: paymentTermsFromEnum("payment_terms_from").notNull(),
    invoiceNumber: text("invoice_number"),
    invoicedOn: date("invoiced_on"),
    paidOn: date("paid_on"),
    // The cut sent for review: a clip of the episode's footage (rushes), linked by id only.
    cutClipId: uuid("cut_clip_id"),
    // The segment as measured in the cut (out exclusive), at the cut's frame rate.
    cutIn: text("cut_in"),
    cutOut: text("cut_out"),
    cutFrameRate: text("cut_frame_rate"),
    cutDropFrame: boolean("cut_drop_frame"),
    createdBy: personRef("created_by"),
    // Raised by every save of the deal's own fields (segment, script, money, cut), not by re-dating.
    version: version(),
    ...timestamps(),
  },
  (table) => [index("deals_channel_episode_idx").on(table.channelId, table.episodeId), index("deals_sponsor_idx").on(table.sponsorId)],
);

export const deliverables = pgTable(
  "deliverables",
  {
    id: id(),
    channelId: channelRef(),
    dealId: uuid("deal_id")
      .notNull()
      .references(() => deals.id, { onDelete: "cascade" }),
    kind: deliverableKindEnum("kind").notNull(),
    title: text("title").notNull(),
    anchor: deliverableAnchorEnum("anchor").notNull(),
    offsetDays: integer("offset_days").notNull().default(0),
    dueDate: date("due_date"),
    status: deliverableStatusEnum("status").notNull().default("not_started"),
    ownerId: personRef("owner_id"),
    position: integer("position").notNull().default(0),
    version: version(),
    // The item of the same deal this one is the sponsor's approval of (from the template's pairing):
    // when the sponsor approves that item through a review link, this one is approved with it.
    approvesId: uuid("approves_id").references((): AnyPgColumn => deliverables.id, { onDelete: "set null" }),
    ...timestamps(),
  },
  (table) => [
    index("deliverables_deal_idx").on(table.dealId),
    index("deliverables_channel_due_idx").on(table.channelId, table.dueDate),
    index("deliverables_approves_idx").on(table.approvesId),
  ],
);

export const deliverableEvents = pgTable(
  "deliverable_events",
  {
    id: id(),
    channelId: channelRef(),
    deliverableId: uuid("deliverable_id")
      .notNull()
      .references(() => deliverables.id, { onDelete: "cascade" }),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    actorId: personRef("actor_id"),
    // Kept as written: a sponsor's contact has no account, and a member may later leave.
    actorName: text("actor_name").notNull(),
    actorKind: text("actor_kind").$type<"member" | "sponsor" | "system">().notNull(),
    what: text("what")
      .$type<"created" | "status" | "due_moved" | "owner" | "edited" | "note" | "review_sent" | "review_decision" | "reminder">()
      .notNull(),
    fromStatus: text("from_status"),
    toStatus: text("to_status"),
    fromDate: date("from_date"),
    toDate: date("to_date"),
    note: text("note"),
  },
  (table) => [index("deliverable_events_item_idx").on(table.deliverableId, table.at)],
);

export const reviewLinks = pgTable(
  "review_links",
  {
    id: id(),
    channelId: channelRef(),
    dealId: uuid("deal_id")
      .notNull()
      .references(() => deals.id, { onDelete: "cascade" }),
    // Kept when the item or the contact is removed (null), so the link can say why it closed.
    deliverableId: uuid("deliverable_id").references(() => deliverables.id, { onDelete: "set null" }),
    contactId: uuid("contact_id").references(() => sponsorContacts.id, { onDelete: "set null" }),
    // Copied at sending: the decision is recorded under the name the link was sent to.
    contactName: text("contact_name").notNull(),
    contactEmail: text("contact_email").notNull(),
    sentBy: personRef("sent_by"),
    sentByName: text("sent_by_name").notNull(),
    sentByEmail: text("sent_by_email").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    decision: reviewDecisionEnum("decision"),
    comment: text("comment"),
    createdAt: createdAt(),
  },
  (table) => [index("review_links_deal_idx").on(table.dealId)],
);

/**
 * A sponsor's comment pinned to a moment of the segment under review, left through a review link:
 * seconds into the segment (from its in point, in milliseconds), under the contact's name as the link
 * was sent to them. Kept with the deal; the item is kept as it was when pinned (null once removed).
 */
export const reviewPins = pgTable(
  "review_pins",
  {
    id: id(),
    channelId: channelRef(),
    dealId: uuid("deal_id")
      .notNull()
      .references(() => deals.id, { onDelete: "cascade" }),
    linkId: uuid("link_id")
      .notNull()
      .references(() => reviewLinks.id, { onDelete: "cascade" }),
    deliverableId: uuid("deliverable_id").references(() => deliverables.id, { onDelete: "set null" }),
    offsetMs: integer("offset_ms").notNull(),
    note: text("note").notNull(),
    contactName: text("contact_name").notNull(),
    createdAt: createdAt(),
  },
  (table) => [index("review_pins_deal_idx").on(table.dealId, table.offsetMs), index("review_pins_link_idx").on(table.linkId, table.createdAt)],
);

/**
 * One row per reminder ever sent: the unique key is what makes a reminder go out once, however many
 * app instances scan at the same moment. A moved due date is a new key, so it earns fresh reminders.
 */
export const remindersSent = pgTable(
  "reminders_sent",
  {
    deliverableId: uuid("deliverable_id")
      .notNull()
      .references(() => deliverables.id, { onDelete: "cascade" }),
    kind: text("kind").$type<"before" | "late">().notNull(),
    dueDate: date("due_date").notNull(),
    sentTo: text("sent_to").notNull(),
    sentAt: timestamp("sent_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.deliverableId, table.kind, table.dueDate] })],
);

export const sponsorSettings = pgTable("sponsor_settings", {
  channelId: uuid("channel_id")
    .primaryKey()
    .references(() => channels.id, { onDelete: "cascade" }),
  reminderDaysBefore: integer("reminder_days_before").notNull().default(2),
  updatedAt: updatedAt(),
});

export const speakingRates = pgTable(
  "speaking_rates",
  {
    channelId: channelRef(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    wordsPerMinute: integer("words_per_minute").notNull(),
  },
  (table) => [primaryKey({ columns: [table.channelId, table.userId] })],
);

/**
 * An invoice of a deal at the payments provider: the whole fee, or one instalment of it ("half on
 * signing"). Amounts are integers in the currency's minor unit (ISO 4217 exponent). The status is
 * the provider's, moved only forward (shared/sponsors/invoices.ts); "paid" comes only from its webhook.
 */
export const dealInvoices = pgTable(
  "deal_invoices",
  {
    id: id(),
    channelId: channelRef(),
    dealId: uuid("deal_id")
      .notNull()
      .references(() => deals.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    label: text("label").notNull(),
    amountMinor: bigint("amount_minor", { mode: "number" }).notNull(),
    currency: text("currency").notNull(),
    daysUntilDue: integer("days_until_due").notNull(),
    providerId: text("provider_id").notNull(),
    number: text("number"),
    status: invoiceStatusEnum("status").notNull().default("draft"),
    hostedUrl: text("hosted_url"),
    dueDate: date("due_date"),
    finalisedAt: timestamp("finalised_at", { withTimezone: true }),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    paidAt: timestamp("paid_at", { withTimezone: true }),
    // When the producer was told it is overdue (once per invoice, by the reminder job).
    overdueRemindedAt: timestamp("overdue_reminded_at", { withTimezone: true }),
    createdBy: personRef("created_by"),
    version: version(),
    ...timestamps(),
  },
  (table) => [index("deal_invoices_deal_idx").on(table.dealId, table.position), uniqueIndex("deal_invoices_provider_idx").on(table.providerId), index("deal_invoices_channel_due_idx").on(table.channelId, table.status, table.dueDate)],
);

/**
 * Every event the payments provider sent, recorded once by its id: a redelivered event finds its row
 * and changes nothing. Events about objects Kerf doesn't hold are recorded too (channel null).
 */
export const paymentEvents = pgTable(
  "payment_events",
  {
    eventId: text("event_id").primaryKey(),
    type: text("type").notNull(),
    objectId: text("object_id"),
    channelId: uuid("channel_id").references(() => channels.id, { onDelete: "cascade" }),
    invoiceId: uuid("invoice_id").references(() => dealInvoices.id, { onDelete: "set null" }),
    /** What Kerf did with it: "applied", "unchanged" (a late or repeated state), "ignored" (nothing of Kerf's). */
    outcome: text("outcome").$type<"applied" | "unchanged" | "ignored">().notNull(),
    providerCreatedAt: timestamp("provider_created_at", { withTimezone: true }).notNull(),
    receivedAt: createdAt(),
  },
  (table) => [index("payment_events_invoice_idx").on(table.invoiceId)],
);

/**
 * A deal's report to the sponsor: one per deal, its PDF made again on request (in a job), and the
 * signed link last mailed to the contact (the token is never stored: its expiry here is what it must carry).
 */
export const sponsorReports = pgTable(
  "sponsor_reports",
  {
    id: id(),
    channelId: channelRef(),
    dealId: uuid("deal_id")
      .notNull()
      .references(() => deals.id, { onDelete: "cascade" }),
    state: text("state", { enum: ["queued", "ready", "failed"] }).notNull(),
    objectKey: text("object_key"),
    pages: integer("pages"),
    sizeBytes: bigint("size_bytes", { mode: "number" }),
    failure: text("failure"),
    requestedBy: personRef("requested_by"),
    madeAt: timestamp("made_at", { withTimezone: true }),
    sentTo: text("sent_to"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    linkExpiresAt: timestamp("link_expires_at", { withTimezone: true }),
    ...timestamps(),
  },
  (table) => [uniqueIndex("sponsor_reports_deal_idx").on(table.dealId)],
);
