import { roleMay, type Role } from "../../shared/access/roles";
import { highlight, queryWords } from "../../shared/search/highlight";
import { searchKindLabels, type SearchAnswer, type SearchArea, type SearchGroup } from "../../shared/search/schemas";
import type { Database } from "../db/client";
import { findInChannel, type FoundRow } from "./search.repository";

const searchAreas: SearchArea[] = ["episodes", "testPlan", "bench", "shoot", "footage", "comments", "sponsors", "fees"];
/** About how many characters of a record's text a hit shows around its first match. */
const SNIPPET_LENGTH = 160;

/** The areas of the role table a role reads: what its searches may find. */
export const searchableAreas = (role: Role) => searchAreas.filter((area) => roleMay(role, area, "R"));

/** The channel's records matching the query, grouped by kind (best group first), matches marked. */
export async function search(db: Database, caller: { channelId: string; role: Role }, query: string): Promise<SearchAnswer> {
  const rows = await findInChannel(db, caller.channelId, searchableAreas(caller.role), query);
  const words = queryWords(query);
  const groups = new Map<string, SearchGroup>();
  for (const row of rows) {
    const group = groups.get(row.kind) ?? { kind: row.kind, label: searchKindLabels[row.kind], hits: [] };
    group.hits.push(hitOf(row, words));
    groups.set(row.kind, group);
  }
  // Rows come best first, so groups are met in the order of their best hit.
  return { query, groups: [...groups.values()] };
}

function hitOf(row: FoundRow, words: string[]) {
  return {
    kind: row.kind,
    id: row.id,
    episodeId: row.episodeId,
    episodeTitle: row.episodeTitle,
    place: row.place,
    title: highlight(row.title, words),
    snippet: highlight(row.body, words, SNIPPET_LENGTH),
    score: row.score,
  };
}
