import { sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { intakeIdeas, intakeSuggestions } from "../db/schema/intake";

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

/**
 * The open idea whose suggestions come closest to `text`, if any comes close enough. intake_key is
 * immutable, so the planner works the probe's key out once, before planning, and the trigram index
 * (channel, key) finds the candidates; a text of asking words only (an empty key) matches nothing.
 */
export async function closestOpenIdea(tx: Queryable, channelId: string, text: string): Promise<{ ideaId: string; score: number } | null> {
  const found = await tx.execute<{ idea_id: string; score: number }>(sql`
    select s.idea_id, similarity(s.key, intake_key(${text})) as score
    from ${intakeSuggestions} s join ${intakeIdeas} i on i.id = s.idea_id
    where s.channel_id = ${channelId} and intake_key(${text}) <> '' and s.key % intake_key(${text}) and i.status = 'open'
    order by score desc
    limit 1`);
  const row = found.rows[0];
  return row ? { ideaId: row.idea_id, score: Number(row.score) } : null;
}

export async function insertIdea(tx: Queryable, channelId: string, wording: string): Promise<string> {
  const [row] = await tx.insert(intakeIdeas).values({ channelId, wording }).returning({ id: intakeIdeas.id });
  return row!.id;
}

/** Inserts the suggestion under `ideaId`; null when its fingerprint is already the channel's (a re-import). */
export async function insertSuggestion(tx: Queryable, channelId: string, ideaId: string, s: NewSuggestion): Promise<string | null> {
  const rows = await tx
    .insert(intakeSuggestions)
    .values({ channelId, ideaId, text: s.text, source: s.source, personKey: s.personKey, author: s.author ?? null, link: s.link ?? null, askedAt: s.askedAt ?? new Date(), contactId: s.contactId ?? null, fingerprint: s.fingerprint ?? null })
    .onConflictDoNothing()
    .returning({ id: intakeSuggestions.id });
  return rows[0]?.id ?? null;
}

export async function fingerprintsTaken(tx: Queryable, channelId: string, fingerprints: string[]): Promise<Set<string>> {
  if (fingerprints.length === 0) return new Set();
  const found = await tx.execute<{ fingerprint: string }>(
    sql`select fingerprint from ${intakeSuggestions} where channel_id = ${channelId} and fingerprint = any(${sql.param(fingerprints)}::text[])`,
  );
  return new Set(found.rows.map((r) => r.fingerprint));
}
