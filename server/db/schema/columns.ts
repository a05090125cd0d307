import { integer, timestamp, uuid } from "drizzle-orm/pg-core";

// The columns most tables repeat, written once. Each is a function: drizzle needs a fresh column per table.
// The references to a channel, an episode and a person live beside their tables (accounts.ts, slate.ts).

/** A random UUID primary key. */
export const id = () => uuid("id").primaryKey().defaultRandom();

export const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
export const updatedAt = () => timestamp("updated_at", { withTimezone: true }).notNull().defaultNow();

/** created_at and updated_at, both set on insert. */
export const timestamps = () => ({ createdAt: createdAt(), updatedAt: updatedAt() });

/** The record's version: raised by every save, which names the version it was made against (nextVersion). */
export const version = () => integer("version").notNull().default(1);
