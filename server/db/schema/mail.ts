import { bigserial, index, integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Outbound mail counted against a sender's allowance: one row per send (a comment mentioning three
 * people is one row of three mails), by scope ("account:<id>:invitation", "channel:<id>:mention").
 * Kept in PostgreSQL so every app instance draws on the same allowance; server/mail/quotas.ts has
 * the limits, and the hourly housekeeping job forgets rows older than the longest window.
 */
export const mailQuotaUses = pgTable(
  "mail_quota_uses",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    scope: text("scope").notNull(),
    mails: integer("mails").notNull(),
    sentAt: timestamp("sent_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("mail_quota_uses_scope_idx").on(table.scope, table.sentAt)],
);
