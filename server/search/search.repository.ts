import { sql } from "drizzle-orm";
import type { SearchArea, SearchKind, SearchPlace } from "../../shared/search/schemas";
import { queryWords } from "../../shared/search/highlight";
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
// How close a channel's word must come to a searched one (pg_trgm's word_similarity, 0 to 1):
// "shoulder" for "sholder" scores 0.75, "dovetail" for "dovet" 0.83; unrelated words stay under 0.4.
const WORD_SIMILARITY = "0.5";
// The nearest words of the channel tried for each searched word, and the searched words looked at.
const NEAR_WORDS = 4;
const ASKED_WORDS = 8;
// How many word matches are ranked at most. Ranking reads each match's whole word list, so a word in
// half of 100,000 entries cost a second under load; past this many, the best of the first ones found
// are shown (a rarer second word narrows them). Measured with `npm run bench:search`.
export const RANKED_MATCHES = 1500;

/**
 * The channel's entries that match the words (accent-blind full text, with English stems) or, when
 * those are few, the channel's nearest words to them (trigrams over its word list, search_words: typos
 * and partial words), only in the areas the caller's role reads: the role is a condition of the query
 * itself, word list included. Both indexes lead with the channel. A word match ranks above any match
 * of a near word (full-text rank + 1, title words weighing more, against under 1); the best
 * HITS_PER_KIND of each kind, their text read only for those. A word found in more than
 * RANKED_MATCHES entries (or a near word) is ranked among the first RANKED_MATCHES found.
 */
export async function findInChannel(db: Database, channelId: string, areas: SearchArea[], query: string): Promise<FoundRow[]> {
  const readable = (alias: string) =>
    sql`${sql.raw(alias)}.channel_id = ${channelId} and ${sql.raw(alias)}.area = any(string_to_array(${areas.join(",")}, ','))`;
  return db.transaction(async (tx) => {
    // Planned for each search's own words and channel (statements are prepared, server/db/prepared-statements.ts):
    // one plan for every search would guess how many entries each word and each channel holds.
    await tx.execute(sql`select set_config('pg_trgm.word_similarity_threshold', ${WORD_SIMILARITY}, true), set_config('plan_cache_mode', 'force_custom_plan', true)`);
    const result = await tx.execute<FoundRow>(sql`
      with q as (select websearch_to_tsquery('kerf_search', ${query}) as words),
      worded as materialized (
        select m.kind, m.record_id, 1 + ts_rank(m.words, q.words) as score
        from (select d.kind, d.record_id, d.words from search_documents d, q where ${readable("d")} and d.words @@ q.words limit ${RANKED_MATCHES}) as m, q
      ),
      asked as (
        select a.word, a.n from unnest(search_word_list(${queryWords(query).join(" ")})) with ordinality as a(word, n)
        where (select count(*) from worded) < ${HITS_PER_KIND} and length(to_tsvector('kerf_search', a.word)) > 0 and a.n <= ${ASKED_WORDS}
      ),
      near_words as (
        select n, word from (
          select a.n, v.word, row_number() over (partition by a.n order by word_similarity(a.word, v.word) desc, v.word) as place
          from asked a join search_words v on ${readable("v")} and a.word <% v.word
          group by a.n, a.word, v.word
        ) as ranked_words
        where place <= ${NEAR_WORDS}
      ),
      near_query as (
        select to_tsquery('kerf_search', string_agg(alternatives, ' & ')) as words
        from (select '(' || string_agg(word, ' | ') || ')' as alternatives from near_words group by n) as per_word
        having count(*) > 0 and count(*) = (select count(*) from asked)
      ),
      near as (
        select m.kind, m.record_id, ts_rank(m.words, nq.words) / (1 + ts_rank(m.words, nq.words)) as score
        from (
          select d.kind, d.record_id, d.words from search_documents d, near_query nq
          where ${readable("d")} and d.words @@ nq.words
            and not exists (select 1 from worded w where w.kind = d.kind and w.record_id = d.record_id)
          limit ${RANKED_MATCHES}
        ) as m, near_query nq
      ),
      ranked as (
        select *, row_number() over (partition by kind order by score desc, record_id) as n
        from (select * from worded union all select * from near) as found
      )
      select d.kind, d.record_id as "id", d.episode_id as "episodeId", e.title as "episodeTitle", d.place, d.title, d.body, r.score::float8 as score
      from ranked r
      join search_documents d on d.kind = r.kind and d.record_id = r.record_id
      left join episodes e on e.id = d.episode_id and e.channel_id = ${channelId}
      where r.n <= ${HITS_PER_KIND}
      order by r.score desc, d.kind, d.record_id`);
    return result.rows;
  });
}
