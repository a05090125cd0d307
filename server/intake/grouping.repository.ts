import { sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { intakeIdeaKeys, intakeIdeas, intakeSuggestions } from "../db/schema/intake";

/**
 * How alike two grouping keys must be (pg_trgm's similarity: shared trigrams over all trigrams of the
 * two) for a suggestion to join an idea. Chosen with `npm run bench:intake`, whose generated asks
 * are reworded, misspelt and reordered: below it distinct asks that share one part start to merge,
 * above it misspelt copies start to split off.
 */
export const SAME_ASK = 0.6;

export interface NewSuggestion {
  text: string;
  source: "page" | "import" | "hand";
  personKey: string;
  author?: string | null;
  link?: string | null;
  askedAt?: Date;
  contactId?: string | null;
  fingerprint?: string | null;
}

/**
 * New suggestions of one channel are grouped one at a time: two people asking the same thing at once
 * must not open two ideas. A transaction-level lock per channel, so other channels never wait.
 */
export async function lockChannelGrouping(tx: Queryable, channelId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`intake:${channelId}`}, 0)), set_config('pg_trgm.similarity_threshold', ${String(SAME_ASK)}, true)`);
}

/** Grouping keys of `texts`, in order (intake_key in the migration intake_tables; '' when only asking words). */
export async function keysOf(tx: Queryable, texts: string[]): Promise<string[]> {
  const found = await tx.execute<{ key: string }>(sql`select intake_key(t) as key from unnest(${sql.param(texts)}::text[]) with ordinality as u(t, n) order by n`);
  return found.rows.map((r) => r.key);
}

const column = <T>(rows: NewSuggestion[], pick: (s: NewSuggestion) => T, type: string) => sql`${sql.param(rows.map(pick))}::${sql.raw(type)}`;

/** The suggestions as rows of one `unnest` (alias r), to insert in one statement. */
const suggestionRows = (rows: NewSuggestion[]) => sql`unnest(
  ${column(rows, (s) => s.text, "text[]")}, ${column(rows, (s) => s.source, "text[]")}, ${column(rows, (s) => s.personKey, "text[]")},
  ${column(rows, (s) => s.author ?? null, "text[]")}, ${column(rows, (s) => s.link ?? null, "text[]")}, ${column(rows, (s) => s.askedAt?.toISOString() ?? null, "timestamptz[]")},
  ${column(rows, (s) => s.contactId ?? null, "uuid[]")}, ${column(rows, (s) => s.fingerprint ?? null, "text[]")}
) with ordinality as r(text, source, person_key, author, link, asked_at, contact_id, fingerprint, n)`;

const insertColumns = sql`insert into ${intakeSuggestions} (channel_id, idea_id, text, source, person_key, author, link, asked_at, contact_id, fingerprint)`;
const rowValues = sql`r.text, r.source::intake_source, r.person_key, r.author, r.link, coalesce(r.asked_at, now()), r.contact_id, r.fingerprint`;

/** For each of `keys` an open idea holds exactly, that idea (any one, when two do). */
export async function ideasHoldingKeys(tx: Queryable, channelId: string, keys: string[]): Promise<Map<string, string>> {
  if (keys.length === 0) return new Map();
  const found = await tx.execute<{ key: string; idea_id: string }>(sql`
    select distinct on (k.key) k.key, k.idea_id from ${intakeIdeaKeys} k join ${intakeIdeas} i on i.id = k.idea_id
    where k.channel_id = ${channelId} and k.key = any(${sql.param(keys)}::text[]) and i.status = 'open'
    order by k.key`);
  return new Map(found.rows.map((r) => [r.key, r.idea_id]));
}

/**
 * The idea each of `keys` goes to, compared one at a time in order, each with the ideas' keys and the
 * keys before it (intake_ideas_for_keys in the migration intake_idea_keys: one call, not a round trip
 * per key); a new idea, worded wordings[i], where none is near. Then write the suggestions with
 * fileUnder: until then the keys are held with no suggestions, and any left so are dropped.
 */
export async function ideasForKeys(tx: Queryable, channelId: string, keys: string[], wordings: string[]): Promise<string[]> {
  if (keys.length === 0) return [];
  const found = await tx.execute<{ ideas: string[] }>(sql`select intake_ideas_for_keys(${channelId}, ${sql.param(keys)}::text[], ${sql.param(wordings)}::text[]) as ideas`);
  return found.rows[0]!.ideas;
}

/** Keys held with no suggestions (a row of theirs was skipped) are let go. */
export async function dropEmptyKeys(tx: Queryable, channelId: string, keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  await tx.execute(sql`delete from ${intakeIdeaKeys} where channel_id = ${channelId} and key = any(${sql.param(keys)}::text[]) and suggestions = 0`);
}

/** Files suggestions under ideas already chosen (ideaIds[i] for rows[i]), in one statement; returns how many were written. */
export async function fileUnder(tx: Queryable, channelId: string, ideaIds: string[], rows: NewSuggestion[]): Promise<number> {
  if (rows.length === 0) return 0;
  const found = await tx.execute(sql`
    ${insertColumns}
    select ${channelId}, (${sql.param(ideaIds)}::uuid[])[r.n], ${rowValues} from ${suggestionRows(rows)}
    on conflict do nothing`);
  return found.rowCount ?? 0;
}

/**
 * Files suggestions that share one grouping key, in one statement: the open idea holding the nearest
 * key (pg_trgm distance `<->`, KNN on intake_idea_keys' GiST index, no further than SAME_ASK allows)
 * takes them all, else a new idea worded after the first. An idea holding the very key is nearest, so
 * it is looked up first (btree) and the nearest-key search runs only when none does. intake_key is immutable, so the planner works
 * the probe's key out once, before planning; an empty key (asking words only) matches nothing. Rows
 * whose fingerprint the channel already holds are left out (the caller filters them first, under the
 * grouping lock, so an idea is never opened for nothing). The statement's trigger adds the key to the
 * idea's keys, so the next group is compared with it too.
 */
export async function fileGroup(tx: Queryable, channelId: string, wording: string, rows: NewSuggestion[]): Promise<{ ideaId: string; joined: boolean; suggestionIds: string[] }> {
  const probe = sql`intake_key(${rows[0]!.text})`;
  const found = await tx.execute<{ idea_id: string; joined: boolean; ids: string[] | null }>(sql`
    with nearest as (
      (select k.idea_id from ${intakeIdeaKeys} k join ${intakeIdeas} i on i.id = k.idea_id
      where k.channel_id = ${channelId} and ${probe} <> '' and k.key = ${probe} and i.status = 'open'
      limit 1)
      union all
      (select k.idea_id from ${intakeIdeaKeys} k join ${intakeIdeas} i on i.id = k.idea_id
      where k.channel_id = ${channelId} and ${probe} <> '' and k.key % ${probe} and i.status = 'open'
      order by k.key <-> ${probe}
      limit 1)
      limit 1),
    opened as (
      insert into ${intakeIdeas} (channel_id, wording) select ${channelId}, ${wording} where not exists (select from nearest) returning id),
    chosen as (select idea_id, true as joined from nearest union all select id, false from opened),
    filed as (
      ${insertColumns}
      select ${channelId}, chosen.idea_id, ${rowValues} from chosen, ${suggestionRows(rows)}
      on conflict do nothing
      returning id)
    select chosen.idea_id, chosen.joined, (select array_agg(id) from filed) as ids from chosen`);
  const row = found.rows[0]!;
  return { ideaId: row.idea_id, joined: row.joined, suggestionIds: row.ids ?? [] };
}

export async function insertIdea(tx: Queryable, channelId: string, wording: string): Promise<string> {
  const [row] = await tx.insert(intakeIdeas).values({ channelId, wording }).returning({ id: intakeIdeas.id });
  return row!.id;
}

export async function fingerprintsTaken(tx: Queryable, channelId: string, fingerprints: string[]): Promise<Set<string>> {
  if (fingerprints.length === 0) return new Set();
  const found = await tx.execute<{ fingerprint: string }>(
    sql`select fingerprint from ${intakeSuggestions} where channel_id = ${channelId} and fingerprint = any(${sql.param(fingerprints)}::text[])`,
  );
  return new Set(found.rows.map((r) => r.fingerprint));
}
