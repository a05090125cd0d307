
import { sql } from "drizzle-orm";
import { boolean, index, json, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uuid, varchar } from "drizzle-orm/pg-core";
import { createdAt, id, version } from "./columns";
import { roles } from "../../../shared/access/roles";
import type { CardColours } from "../../../shared/bench/card-colours";

export const roleEnum = pgEnum("role", roles);

export const users = pgTable("users", {
  id: id(),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  passwordHash: text("password_hash").notNull(),
  timeZone: text("time_zone").notNull().default("UTC"),
  // Set when the person opened the link mailed to this address: until then Kerf sends nothing to others on their behalf.
  emailVerifiedAt: timestamp("email_verified_at", { withTimezone: true }),
  // The mail topics the person turned off (shared/auth/account.ts); mail about their own account is always sent.
  mailOptOuts: text("mail_opt_outs").array().notNull().default(sql`'{}'::text[]`),
  version: version(),
  createdAt: createdAt(),
});

export const channels = pgTable("channels", {
  id: id(),
  name: text("name").notNull(),
  /** The results card's colours; null keeps Kerf's own (shared/bench/card-colours.ts). */
  cardColours: jsonb("card_colours").$type<CardColours>(),
  createdAt: createdAt(),
});

/** The channel a row belongs to: deleting the channel deletes the row. */
export const channelRef = () =>
  uuid("channel_id")
    .notNull()
    .references(() => channels.id, { onDelete: "cascade" });

/** A person a row names (who made, moved or owns it): the row stays, without them, when the account goes. */
export const personRef = (name: string) => uuid(name).references(() => users.id, { onDelete: "set null" });

export const memberships = pgTable(
  "memberships",
  {
    channelId: channelRef(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    joinedAt: timestamp("joined_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.channelId, table.userId] }), index("memberships_user_idx").on(table.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: id(),
    channelId: channelRef(),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    // Only the SHA-256 of the link's token is kept: a leaked table opens no channel.
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: uuid("invited_by")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedBy: personRef("accepted_by"),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    // Closed without use because its addressee joined the channel another way (another invitation).
    closedAt: timestamp("closed_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("invitations_channel_idx").on(table.channelId), index("invitations_channel_email_idx").on(table.channelId, table.email)],
);

/**
 * Links that confirm an account's address. Only the SHA-256 of a link's token is kept, and the token is
 * made when the mail is sent (never stored in the mail queue); each link works once and expires.
 */
export const emailVerifications = pgTable(
  "email_verifications",
  {
    id: id(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    // The address the link was mailed to: a link confirms that address and no other.
    email: text("email").notNull(),
    // Set when the link moves the account to `email` (a change of address) rather than confirming its current one.
    changesAddress: boolean("changes_address").notNull().default(false),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("email_verifications_user_idx").on(table.userId)],
);

/**
 * Links that set a new password ("forgot password"). Only the SHA-256 of a link's token is kept, the token
 * is made when the mail is sent, each link works once and expires; a new link or a new password ends the others.
 */
export const passwordResets = pgTable(
  "password_resets",
  {
    id: id(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("password_resets_user_idx").on(table.userId)],
);

/**
 * The table connect-pg-simple expects, owned by our migrations rather than created at run time.
 * `user_id` is computed by PostgreSQL from the session's data (passport keeps the account's id there),
 * so the store writes rows as it always does and an account's sessions are found through an index.
 */
export const sessions = pgTable(
  "session",
  {
    sid: varchar("sid").primaryKey(),
    sess: json("sess").notNull(),
    expire: timestamp("expire", { precision: 6 }).notNull(),
    userId: uuid("user_id").generatedAlwaysAs(sql`((sess -> 'passport' ->> 'user')::uuid)`),
  },
  (table) => [index("IDX_session_expire").on(table.expire), index("session_user_idx").on(table.userId)],
);

