import { sql } from "drizzle-orm";
import { customType, index, jsonb, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { SearchArea, SearchKind, SearchPlace } from "../../../shared/search/schemas";
import { channelRef } from "./accounts";

const tsvector = customType<{ data: string }>({ dataType: () => "tsvector" });

/**
 * One row per searchable record, written by triggers on the records' own tables (migration
 * search_triggers) in the transaction that writes the record: the index is never behind.
 * `area` is the role table's area a member needs to read it; the search query filters on it.
 */
export const searchDocuments = pgTable(
  "search_documents",
  {
    kind: text("kind").$type<SearchKind>().notNull(),
    recordId: uuid("record_id").notNull(),
    channelId: channelRef(),
    episodeId: uuid("episode_id"),
    area: text("area").$type<SearchArea>().notNull(),
    title: text("title").notNull(),
    body: text("body").notNull().default(""),
    place: jsonb("place").$type<SearchPlace>().notNull(),
    words: tsvector("words")
      .notNull()
      .generatedAlwaysAs(sql`setweight(to_tsvector('kerf_search'::regconfig, "title"), 'A') || setweight(to_tsvector('kerf_search'::regconfig, "body"), 'B')`),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.kind, t.recordId] }),
    index("search_documents_words_idx").using("gin", t.channelId, t.words),
  ],
);

/**
 * The words a channel's entries have used, per area (lower case, no accents, three letters or more),
 * written by the same triggers. A misspelt or partial word is looked up here by trigrams, and the
 * entries are then searched for the words found: a few thousand short words per channel instead of
 * every entry's whole text. Words stay when their entries change or go; a word no entry holds any
 * longer finds nothing.
 */
export const searchWords = pgTable(
  "search_words",
  {
    channelId: channelRef(),
    area: text("area").$type<SearchArea>().notNull(),
    word: text("word").notNull(),
  },
  (t) => [primaryKey({ columns: [t.channelId, t.area, t.word] }), index("search_words_near_idx").using("gin", t.channelId, t.word.op("gin_trgm_ops"))],
);
