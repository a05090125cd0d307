import { integer, pgTable, primaryKey, text, uuid } from "drizzle-orm/pg-core";
import { channelRef } from "./accounts";

/**
 * The last number handed out in each numbering (a scope such as "bench_run", per owner row such as an
 * episode). Taking a number updates this one row, so concurrent takers queue on its lock until the
 * taker's transaction ends: no two get the same number, and a deleted row's number is never reused.
 */
export const counters = pgTable(
  "counters",
  {
    scope: text("scope").notNull(),
    ownerId: uuid("owner_id").notNull(),
    channelId: channelRef(),
    last: integer("last").notNull(),
  },
  (table) => [primaryKey({ columns: [table.scope, table.ownerId] })],
);
