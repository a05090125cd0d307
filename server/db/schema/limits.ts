import { integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Rate-limit counters (server/http/rate-counters.ts), one row per limit and key, shared by every
 * server process: the key is a SHA-256 of the limit's name and the caller's key (an address, an
 * account's e-mail), so no address or e-mail is stored and any length fits the index.
 */
export const rateLimitCounters = pgTable("rate_limit_counters", {
  key: text("key").primaryKey(),
  hits: integer("hits").notNull(),
  resetsAt: timestamp("resets_at", { withTimezone: true }).notNull(),
});
