import { sql, type Column, type SQL } from "drizzle-orm";
import type { BoardFlag } from "../../shared/slate/flags";
import type { Database } from "../db/client";

/**
 * The board seam: flags other features put on board cards ("Sponsor item due"), beside the slate's
 * own (at risk, essentials skipped, no publish date), and board filters other features own. A
 * feature exports them from its `<feature>.flags.ts`; server/app.ts hands them to the slate.
 * A source answers for every card of a board load in one query: never one query per card. The board
 * answer is kept until the board revision changes, so the tables a source reads carry the
 * `slate_bump_board_revision` trigger (drizzle/0004_sponsors_board_revision.sql for the sponsors').
 * After a change to one episode the board reads only that episode's flags again, so an episode's
 * flags may depend on its own rows and on tables with that trigger (a change there reads the board
 * whole), never on another episode's rows.
 */
export interface BoardFlagSource {
  name: string;
  /** `viewer` gives the viewer's time zone and today's date there, for sources that count days. */
  flagsFor(db: Database, channelId: string, episodeIds: string[], viewer?: FlagViewer): Promise<Map<string, BoardFlag[]>>;
}

export interface FlagViewer {
  timeZone: string;
  /** YYYY-MM-DD in that zone. */
  today: string;
}

/**
 * A board filter another feature owns (the sponsor filter): the choices it offers and the episodes a
 * choice keeps. Without one, the board accepts the URL parameter and ignores it.
 */
export interface BoardFilter {
  options(db: Database, channelId: string): Promise<{ value: string; label: string }[]>;
  episodeIds(db: Database, channelId: string, value: string): Promise<Set<string>>;
}

/** The board's filters that other features fill in, by URL parameter. */
export interface BoardFilters {
  sponsor: BoardFilter | null;
}

/**
 * `column = any($ids)`: one array parameter however long the board. drizzle's inArray writes one
 * parameter per id, which for a 2,000-card board measured about 13 ms a query against about 3 ms
 * for this (dev-services/bench/slate.ts prints the sources' share of a board load).
 */
export const episodeIdIn = (column: Column, episodeIds: string[]): SQL => sql`${column} = any(${sql.param(episodeIds)}::uuid[])`;

/** All sources' flags for these episodes, by episode id; episodes without flags are left out. */
export async function collectFlags(
  sources: readonly BoardFlagSource[],
  db: Database,
  channelId: string,
  episodeIds: string[],
  viewer?: FlagViewer,
): Promise<Record<string, BoardFlag[]>> {
  const out: Record<string, BoardFlag[]> = {};
  if (episodeIds.length === 0 || sources.length === 0) return out;
  const results = await Promise.all(sources.map((source) => source.flagsFor(db, channelId, episodeIds, viewer)));
  for (const result of results) {
    for (const [episodeId, flags] of result) {
      if (flags.length > 0) (out[episodeId] ??= []).push(...flags);
    }
  }
  return out;
}
