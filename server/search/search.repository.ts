import { sql } from "drizzle-orm";
import type { SearchArea, SearchKind, SearchPlace } from "../../shared/search/schemas";
import type { Database } from "../db/client";

export type FoundRow = {
  kind: SearchKind;
  id: string;
  episodeId: string | null;
  episodeTitle: string | null;
  place: SearchPlace;
  title: string;
  body: string;
  score: number;
};

/** Hits kept per kind: a group shows its best few. */
export const HITS_PER_KIND = 6;
// How close a misspelt word must come to a word of the text (pg_trgm's word_similarity, 0 to 1):
// "sholder" in "…at the shoulder" scores 0.75; unrelated words of the same length stay under 0.4.
const WORD_SIMILARITY = "0.5";

/**
 * The channel's entries that match the words (accent-blind full text, with English stems) or come
 * close to them (trigrams, for typos and partial words), only in the areas the caller's role reads:
 * the role is a condition of the query itself. Both indexes lead with the channel. Ranked by full-text
 * rank (title words weigh more) plus closeness; the best HITS_PER_KIND of each kind.
 */
export async function findInChannel(db: Database, channelId: string, areas: SearchArea[], query: string): Promise<FoundRow[]> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select set_config('pg_trgm.word_similarity_threshold', ${WORD_SIMILARITY}, true)`);
    const result = await tx.execute<FoundRow>(sql`
      with q as (select websearch_to_tsquery('kerf_search', ${query}) as words, search_fold(${query}) as folded),
      found as (
        select d.kind, d.record_id, d.episode_id, d.place, d.title, d.body,
               ts_rank(d.words, q.words) + word_similarity(q.folded, d.folded) as score
        from search_documents d, q
        where d.channel_id = ${channelId}
          and d.area = any(string_to_array(${areas.join(",")}, ','))
          and (d.words @@ q.words or q.folded <% d.folded)
      ),
      ranked as (select *, row_number() over (partition by kind order by score desc, record_id) as n from found)
      select r.kind, r.record_id as "id", r.episode_id as "episodeId", e.title as "episodeTitle", r.place, r.title, r.body, r.score::float8 as score
      from ranked r left join episodes e on e.id = r.episode_id and e.channel_id = ${channelId}
      where r.n <= ${HITS_PER_KIND}
      order by r.score desc`);
    return result.rows;
  });
}
