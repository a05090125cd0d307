import { date, index, integer, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { stages } from "../../../shared/slate/stages";
import { channels, users } from "./accounts";

export const stageEnum = pgEnum("stage", stages);

export const episodes = pgTable(
  "episodes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    channelId: uuid("channel_id")
      .notNull()
      .references(() => channels.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    question: text("question").notNull().default(""),
    stage: stageEnum("stage").notNull().default("challenge"),
    // Fractional index: a move rewrites one row, never the column (see shared/slate ordering).
    rank: text("rank").notNull(),
    version: integer("version").notNull().default(1),
    ownerId: uuid("owner_id").references(() => users.id, { onDelete: "set null" }),
    targetPublishDate: date("target_publish_date"),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("episodes_channel_stage_rank_idx").on(table.channelId, table.stage, table.rank)],
);
