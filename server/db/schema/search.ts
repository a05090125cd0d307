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
    folded: text("folded")
      .notNull()
      .generatedAlwaysAs(sql`search_fold("title" || ' ' || "body")`),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.kind, t.recordId] }),
    index("search_documents_words_idx").using("gin", t.channelId, t.words),
    index("search_documents_folded_idx").using("gin", t.channelId, t.folded.op("gin_trgm_ops")),
  ],
);
