import { sql } from "drizzle-orm";
import { bigserial, boolean, index, integer, jsonb, pgEnum, pgTable, primaryKey, smallint, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { ideaStatuses, type ColumnMapping } from "../../../shared/intake/schemas";
import { channelRef, channels, users } from "./accounts";
import { createdAt, id, updatedAt } from "./columns";
import { episodes } from "./slate";

/**
 * Bytes of the trigram signature in the nearest-key index's inner pages (pg_trgm's siglen, default 12):
 * larger tells branches apart better, so a nearest-key search reads fewer pages (npm run bench:intake).
 */
const KEY_SIGNATURE_BYTES = 1024;

export const ideaStatusEnum = pgEnum("intake_idea_status", ideaStatuses);
export const suggestionSourceEnum = pgEnum("intake_source", ["page", "import", "hand"]);

/** The channel's public suggestion page (closed until a member opens it) and its CSV column mapping. */
export const intakePages = pgTable("intake_pages", {
  channelId: uuid("channel_id")
    .primaryKey()
    .references(() => channels.id, { onDelete: "cascade" }),
  open: boolean("open").notNull().default(false),
  prompt: text("prompt").notNull().default(""),
  mapping: jsonb("mapping").$type<ColumnMapping>(),
  updatedAt: updatedAt(),
});

/** One ask, however many viewers made it: the suggestions grouped under it. */
export const intakeIdeas = pgTable(
  "intake_ideas",
  {
    id: id(),
    channelId: channelRef(),
    wording: text("wording").notNull(),
    status: ideaStatusEnum("status").notNull().default("open"),
    declineReason: text("decline_reason"),
    episodeId: uuid("episode_id").references(() => episodes.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (table) => [index("intake_ideas_channel_status_idx").on(table.channelId, table.status)],
);

/** An address a viewer gave with consent; nothing is sent to it but its confirmation until it is confirmed. */
export const intakeContacts = pgTable(
  "intake_contacts",
  {
    id: id(),
    channelId: channelRef(),
    email: text("email").notNull(),
    confirmHash: text("confirm_hash"),
    confirmedAt: timestamp("confirmed_at", { withTimezone: true }),
    unsubscribedAt: timestamp("unsubscribed_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [uniqueIndex("intake_contacts_channel_email_idx").on(table.channelId, table.email), index("intake_contacts_confirm_idx").on(table.confirmHash)],
);

/**
 * One viewer's words. `key` is what grouping compares (migration intake_suggestions: the stemmed
 * words of the text with Kerf's search configuration, asking words left out, in alphabetical order);
 * `fingerprint` makes a re-imported row a no-op.
 */
export const intakeSuggestions = pgTable(
  "intake_suggestions",
  {
    id: id(),
    channelId: channelRef(),
    ideaId: uuid("idea_id")
      .notNull()
      .references(() => intakeIdeas.id, { onDelete: "cascade" }),
    text: text("text").notNull(),
    key: text("key")
      .notNull()
      .generatedAlwaysAs(sql`intake_key("text")`),
    source: suggestionSourceEnum("source").notNull(),
    personKey: text("person_key").notNull(),
    author: text("author"),
    link: text("link"),
    askedAt: timestamp("asked_at", { withTimezone: true }).notNull().defaultNow(),
    contactId: uuid("contact_id").references(() => intakeContacts.id, { onDelete: "set null" }),
    fingerprint: text("fingerprint"),
    createdAt: createdAt(),
  },
  (table) => [
    index("intake_suggestions_idea_idx").on(table.ideaId, table.askedAt),
    // Fingerprint first: a btree led by the channel would tempt the planner away from the trigram index while grouping.
    uniqueIndex("intake_suggestions_fingerprint_idx").on(table.fingerprint, table.channelId),
  ],
);

/**
 * What grouping compares a new suggestion with: each distinct key once per idea, however many
 * suggestions share it, with their count. Kept by triggers on intake_suggestions (migration
 * intake_idea_keys), so a merge, a split or a deletion keeps it in step. A GiST trigram index led by
 * the channel (btree_gist) finds the nearest key (`<->`, KNN) without reading every close one.
 */
export const intakeIdeaKeys = pgTable(
  "intake_idea_keys",
  {
    ideaId: uuid("idea_id")
      .notNull()
      .references(() => intakeIdeas.id, { onDelete: "cascade" }),
    key: text("key").notNull(),
    channelId: channelRef(),
    suggestions: integer("suggestions").notNull(),
  },
  (table) => [
    primaryKey({ columns: [table.ideaId, table.key] }),
    // An import looks up all of a file's keys at once: those an open idea already holds need no nearest-key search.
    index("intake_idea_keys_exact_idx").on(table.channelId, table.key),
    index("intake_idea_keys_nearest_idx").using("gist", table.channelId, sql`${table.key} gist_trgm_ops(siglen=${sql.raw(String(KEY_SIGNATURE_BYTES))})`),
  ],
);

/** A member's own quick judgement of an idea, 1–3 on each of shared/intake/weighing.ts's dimensions. */
export const intakeJudgements = pgTable(
  "intake_judgements",
  {
    ideaId: uuid("idea_id")
      .notNull()
      .references(() => intakeIdeas.id, { onDelete: "cascade" }),
    personId: uuid("person_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    channelId: channelRef(),
    draw: smallint("draw").notNull(),
    reach: smallint("reach").notNull(),
    spend: smallint("spend").notNull(),
    danger: smallint("danger").notNull(),
    updatedAt: updatedAt(),
  },
  (table) => [primaryKey({ columns: [table.ideaId, table.personId] })],
);

/** "Your idea is out": one row per viewer per episode, so a second go-live mails nobody twice. */
export const intakeNews = pgTable(
  "intake_news",
  {
    episodeId: uuid("episode_id")
      .notNull()
      .references(() => episodes.id, { onDelete: "cascade" }),
    contactId: uuid("contact_id")
      .notNull()
      .references(() => intakeContacts.id, { onDelete: "cascade" }),
    channelId: channelRef(),
    videoUrl: text("video_url").notNull(),
    createdAt: createdAt(),
  },
  (table) => [primaryKey({ columns: [table.episodeId, table.contactId] })],
);

/** Submissions to public pages, by hashed address, counted over a sliding window (server/intake/page-limits.ts). */
export const intakePageHits = pgTable(
  "intake_page_hits",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    scope: text("scope").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("intake_page_hits_scope_idx").on(table.scope, table.at)],
);
