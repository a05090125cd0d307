import { bigint, index, integer, jsonb, numeric, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { FigureColumns } from "../../../shared/publish/figures";
import { channelRef, personRef } from "./accounts";
import { createdAt, id, timestamps, updatedAt, version } from "./columns";
import { episodeRef } from "./slate";

/** An episode's publish package: one row per episode, made on its first save. */
export const publishPackages = pgTable(
  "publish_packages",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    titles: jsonb("titles").$type<string[]>().notNull().default([]),
    chosenTitle: integer("chosen_title"),
    description: text("description").notNull().default(""),
    chapters: text("chapters").notNull().default(""),
    timeZone: text("time_zone").notNull(),
    publishAt: timestamp("publish_at", { withTimezone: true }),
    // No foreign key: choosing is checked by the service, and removing a picture clears the choice.
    thumbnailId: uuid("thumbnail_id"),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    videoUrl: text("video_url"),
    // Why the video went live past missing essentials, with what was missing.
    goLiveReason: text("go_live_reason"),
    goLiveSkipped: jsonb("go_live_skipped").$type<{ code: string; message: string }[]>(),
    publishedBy: personRef("published_by"),
    version: version(),
    ...timestamps(),
  },
  (table) => [uniqueIndex("publish_packages_episode_idx").on(table.channelId, table.episodeId)],
);

/** Candidate thumbnails, streamed into storage; their size is read from the file's own header. */
export const publishThumbnails = pgTable(
  "publish_thumbnails",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    objectKey: text("object_key").notNull().unique(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    width: integer("width"),
    height: integer("height"),
    uploadedBy: personRef("uploaded_by"),
    createdAt: createdAt(),
  },
  (table) => [index("publish_thumbnails_episode_idx").on(table.channelId, table.episodeId, table.createdAt)],
);

/** The video's figures on one day after go-live (entered by hand or read from an analytics export). */
export const publishFigures = pgTable(
  "publish_figures",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    day: integer("day").notNull(),
    views: bigint("views", { mode: "number" }),
    watchHours: numeric("watch_hours", { precision: 14, scale: 1, mode: "number" }),
    linkClicks: bigint("link_clicks", { mode: "number" }),
    codeUses: bigint("code_uses", { mode: "number" }),
    source: text("source", { enum: ["hand", "export"] }).notNull(),
    enteredBy: personRef("entered_by"),
    version: version(),
    ...timestamps(),
  },
  (table) => [uniqueIndex("publish_figures_day_idx").on(table.channelId, table.episodeId, table.day)],
);

/** Which columns of the channel's analytics export hold which figure: set once per channel. */
export const publishFigureColumns = pgTable("publish_figure_columns", {
  channelId: channelRef().primaryKey(),
  columns: jsonb("columns").$type<FigureColumns>().notNull(),
  updatedAt: updatedAt(),
});
