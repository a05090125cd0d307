import { sql } from "drizzle-orm";
import { bigint, date, index, jsonb, numeric, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { createdAt, id, updatedAt, version } from "./columns";
import { origins } from "../../../shared/slate/schemas";
import type { GateProblem } from "../../../shared/slate/gates";
import type { StageLengths } from "../../../shared/slate/schedule";
import { stages } from "../../../shared/slate/stages";
import { channelRef, channels, personRef } from "./accounts";

export const stageEnum = pgEnum("stage", stages);
export const originEnum = pgEnum("episode_origin", origins);

export const episodes = pgTable(
  "episodes",
  {
    id: id(),
    channelId: channelRef(),
    title: text("title").notNull(),
    question: text("question").notNull().default(""),
    origin: originEnum("origin").notNull().default("idea"),
    originLink: text("origin_link"),
    whyWorthIt: text("why_worth_it").notNull().default(""),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    budgetAmount: numeric("budget_amount", { precision: 11, scale: 2 }),
    budgetCurrency: text("budget_currency"),
    stage: stageEnum("stage").notNull().default("challenge"),
    // Fractional index, compared byte by byte (the column is COLLATE "C", set in the migration
    // slate_board_revision): a move rewrites one row, never the column.
    rank: text("rank").notNull(),
    version: version(),
    ownerId: personRef("owner_id"),
    targetPublishDate: date("target_publish_date"),
    // When the current stage began; the history holds every stay, this is the board's shortcut.
    stageEnteredAt: timestamp("stage_entered_at", { withTimezone: true }).notNull().defaultNow(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (table) => [index("episodes_channel_stage_rank_idx").on(table.channelId, table.stage, table.rank)],
);

/** The episode a row belongs to: deleting the episode deletes the row. */
export const episodeRef = () =>
  uuid("episode_id")
    .notNull()
    .references(() => episodes.id, { onDelete: "cascade" });

/** Every stage move: who, when, from, to, and the reason when it went past missing essentials. */
export const stageMoves = pgTable(
  "stage_moves",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    // Null for the entry that opens the episode in its first stage.
    fromStage: stageEnum("from_stage"),
    toStage: stageEnum("to_stage").notNull(),
    movedBy: personRef("moved_by"),
    movedAt: timestamp("moved_at", { withTimezone: true }).notNull().defaultNow(),
    reason: text("reason"),
    skipped: jsonb("skipped").$type<GateProblem[]>().notNull().default([]),
  },
  (table) => [
    index("stage_moves_episode_idx").on(table.episodeId, table.movedAt),
    // The board reads a channel's moves that went past missing essentials: few, so a partial index.
    index("stage_moves_channel_skipped_idx")
      .on(table.channelId, table.episodeId)
      .where(sql`jsonb_array_length(${table.skipped}) > 0`),
  ],
);

/** A due date set by hand for one stage of one episode, in place of the counted one. */
export const dueOverrides = pgTable(
  "due_overrides",
  {
    channelId: channelRef(),
    episodeId: episodeRef(),
    stage: stageEnum("stage").notNull(),
    dueDate: date("due_date").notNull(),
    setBy: personRef("set_by"),
    setAt: timestamp("set_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.episodeId, table.stage] }), index("due_overrides_channel_idx").on(table.channelId)],
);

/**
 * The slate's per-channel row: stage lengths (null: Kerf's defaults) and the board's revision, which
 * a trigger on episodes raises on every change (migration slate_board_revision), so a cached board
 * is known stale without reading the episodes.
 */
export const slateChannels = pgTable("slate_channels", {
  channelId: uuid("channel_id")
    .primaryKey()
    .references(() => channels.id, { onDelete: "cascade" }),
  stageLengths: jsonb("stage_lengths").$type<StageLengths>(),
  boardRevision: bigint("board_revision", { mode: "number" }).notNull().default(0),
  updatedAt: updatedAt(),
});

export const episodeComments = pgTable(
  "episode_comments",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    authorId: personRef("author_id"),
    body: text("body").notNull(),
    mentions: uuid("mentions").array().notNull().default(sql`'{}'::uuid[]`),
    createdAt: createdAt(),
  },
  (table) => [index("episode_comments_episode_idx").on(table.episodeId, table.createdAt)],
);

/**
 * What each board revision changed: the episode whose row (or due date) changed, or null when
 * something else on the board did (sponsor rows behind its flags and filter). Written by the
 * revision trigger in the same transaction as the change, and pruned by it to the last few hundred
 * revisions of each channel: a process that keeps a board a few revisions behind re-reads only those
 * episodes (server/slate/board.service.ts); one further behind, or past a null, builds it whole.
 */
export const slateBoardChanges = pgTable(
  "slate_board_changes",
  {
    channelId: uuid("channel_id").notNull(),
    revision: bigint("revision", { mode: "number" }).notNull(),
    episodeId: uuid("episode_id"),
  },
  (table) => [primaryKey({ columns: [table.channelId, table.revision] })],
);
