import type { Pool, PoolClient } from "pg";
import { connectDatabase } from "../../server/db/client";

/**
 * The other channels a benchmark's own channel lives among, as on a hosted Kerf: by default 10,000
 * channels with 200 episodes and 500 clips each (2 million episodes and 5 million clips in all), each
 * episode and clip with its search entry. Made with set-based SQL (generate_series), never row by row:
 * the secondary indexes are dropped first and built again once the rows are in, and triggers are off
 * (the rows are consistent by construction), so the whole crowd takes minutes, not hours.
 * BENCH_CROWD_CHANNELS sets the number of channels (0: no crowd).
 */
export interface CrowdSize {
  channels: number;
  episodesPerChannel: number;
  clipsPerEpisode: number;
}

export function crowdSizeFromEnv(): CrowdSize {
  return {
    channels: Number(process.env.BENCH_CROWD_CHANNELS ?? 10_000),
    episodesPerChannel: Number(process.env.BENCH_CROWD_EPISODES ?? 200),
    clipsPerEpisode: Number(process.env.BENCH_CROWD_CLIPS_PER_EPISODE ?? 2.5),
  };
}

const CROWDED_TABLES = ["episodes", "clips", "search_documents", "search_words"];

export interface CrowdFigures {
  channels: number;
  episodes: number;
  clips: number;
  seconds: number;
}

/** How many connections share the work: one per core (PostgreSQL runs each statement on one). */
const WORKERS = 2;

/** Seeds the crowd into an empty, migrated database; its own channel is added afterwards by the bench. */
export async function seedCrowd(pool: Pool, size: CrowdSize = crowdSizeFromEnv()): Promise<CrowdFigures> {
  const started = performance.now();
  if (size.channels <= 0) return { channels: 0, episodes: 0, clips: 0, seconds: 0 };
  const clients = await Promise.all(Array.from({ length: WORKERS }, () => bulkClient(pool)));
  try {
    const [first] = clients as [PoolClient];
    const rebuild = await dropSecondaryIndexes(first);
    await timed("channels", () => insertChannels(first, size));
    // Each connection fills its share of the channels: episodes, then their clips, then both's search entries.
    await timed("episodes, clips and search entries", () =>
      Promise.all(
        clients.map(async (client, share) => {
          await insertEpisodes(client, size, share);
          await insertClips(client, size, share);
          await insertSearchEntries(client, share);
        }),
      ),
    );
    await timed("indexes", () => Promise.all(clients.map(async (client, share) => {
      for (const definition of rebuild.filter((_, index) => index % WORKERS === share)) await client.query(definition);
    })));
    await first.query("set session_replication_role = origin");
    // Vacuumed as well as analysed: otherwise autovacuum takes up millions of new rows while a benchmark is timing.
    await timed("vacuum and analyze", () => first.query(`vacuum (analyze) ${CROWDED_TABLES.join(", ")}, channels, memberships, users`));
    const [{ episodes, clips }] = (await first.query(`select (select count(*) from episodes)::int as episodes, (select count(*) from clips)::int as clips`)).rows;
    return { channels: size.channels, episodes, clips, seconds: (performance.now() - started) / 1000 };
  } finally {
    for (const client of clients) client.release();
  }
}

/** A connection set for bulk work: no triggers (no search or board-revision rows per statement), room to sort. */
async function bulkClient(pool: Pool): Promise<PoolClient> {
  const client = await pool.connect();
  await client.query("set session_replication_role = replica");
  await client.query("set maintenance_work_mem = '1GB'");
  await client.query("set synchronous_commit = off");
  return client;
}

/** The channels one connection fills: `share` of WORKERS, by the channel's hash. */
const ofShare = (column: string, shareParam: string) => `(abs(hashtext(${column}::text)) % ${WORKERS}) = ${shareParam}`;

async function timed(step: string, work: () => Promise<unknown>) {
  const started = performance.now();
  await work();
  if (process.env.BENCH_CROWD_VERBOSE) console.log(`  crowd: ${step} in ${((performance.now() - started) / 1000).toFixed(1)} s`);
}

/** Drops the crowded tables' indexes that no constraint owns; answers the statements that make them again. */
async function dropSecondaryIndexes(client: PoolClient): Promise<string[]> {
  const { rows } = await client.query<{ name: string; definition: string }>(
    `select i.indexname as name, i.indexdef as definition from pg_indexes i
     where i.schemaname = 'public' and i.tablename = any($1)
       and not exists (select 1 from pg_constraint c where c.conname = i.indexname)`,
    [CROWDED_TABLES],
  );
  for (const { name } of rows) await client.query(`drop index "${name}"`);
  return rows.map((row) => row.definition);
}

async function insertChannels(client: PoolClient, size: CrowdSize) {
  await client.query(
    `insert into channels (name) select 'Crowd channel ' || i from generate_series(1, $1) as i`,
    [size.channels],
  );
  // One owner per channel: enough for every episode to have an owner, as real ones do.
  await client.query(
    `insert into users (email, name, password_hash)
     select 'owner-' || c.id || '@crowd.test', 'Crowd owner', 'not-a-password-hash' from channels c`,
  );
  await client.query(
    `insert into memberships (channel_id, user_id, role)
     select c.id, u.id, 'owner' from channels c join users u on u.email = 'owner-' || c.id || '@crowd.test'`,
  );
}

async function insertEpisodes(client: PoolClient, size: CrowdSize, share: number) {
  await client.query(
    `insert into episodes (channel_id, title, question, stage, rank, owner_id, tags, target_publish_date, created_at, stage_entered_at)
     select m.channel_id, 'Crowd episode ' || i || ' of ' || left(m.channel_id::text, 8),
       'Will build ' || i || ' carry ' || (i % 40) || ' kg?',
       (enum_range(null::stage))[1 + i % 7], 'a' || lpad(i::text, 6, '0'), m.user_id,
       case when i % 3 = 0 then array['batteries'] else '{}'::text[] end,
       current_date + (i % 120) - 20, now() - ((10 + i % 60) || ' days')::interval, now() - ((i % 25) || ' days')::interval
     from memberships m cross join generate_series(1, $1) as i
     where ${ofShare("m.channel_id", "$2")}`,
    [size.episodesPerChannel, share],
  );
}

/** Each episode gets floor or ceil of the clips-per-episode average, alternating, so the total comes out right. */
async function insertClips(client: PoolClient, size: CrowdSize, share: number) {
  const low = Math.floor(size.clipsPerEpisode);
  const everyOther = size.clipsPerEpisode - low >= 0.5 ? 1 : 0;
  await client.query(
    `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, recorded_at, camera, tags, duration_ms)
     select e.channel_id, e.id, 'crowd/' || e.id || '/' || s.i, 'A' || lpad(s.i::text, 3, '0') || '_take_' || (hashtext(e.id::text) & 255) || '.mov',
       'video/quicktime', 50000000 + s.i, e.created_at + (s.i || ' hours')::interval, 'A', '{}'::text[], 60000
     from episodes e cross join lateral generate_series(1, $1 + case when $2 = 1 and hashtext(e.id::text) % 2 = 0 then 1 else 0 end) as s(i)
     where ${ofShare("e.channel_id", "$3")}`,
    [low, everyOther, share],
  );
}

/** The entries and channel words the search triggers would have written (search_put in drizzle/), in three statements. */
async function insertSearchEntries(client: PoolClient, share: number) {
  await client.query(
    `insert into search_documents (kind, record_id, channel_id, episode_id, area, title, body, place)
     select 'episode', e.id, e.channel_id, e.id, 'episodes', e.title, search_lines(e.question, e.why_worth_it, array_to_string(e.tags, ' ')), '{}'::jsonb
     from episodes e where ${ofShare("e.channel_id", "$1")}`,
    [share],
  );
  await client.query(
    `insert into search_documents (kind, record_id, channel_id, episode_id, area, title, body, place)
     select 'clip', c.id, c.channel_id, c.episode_id, 'footage', c.file_name,
       search_lines(search_words_of(c.file_name), array_to_string(c.tags, ' '), c.camera, c.notes), '{}'::jsonb
     from clips c where ${ofShare("c.channel_id", "$1")}`,
    [share],
  );
  await client.query(
    `insert into search_words (channel_id, area, word)
     select distinct d.channel_id, d.area, w from search_documents d, unnest(search_word_list(d.title || ' ' || d.body)) as w
     where ${ofShare("d.channel_id", "$1")}`,
    [share],
  );
}

export const describeCrowd = (crowd: CrowdFigures) =>
  crowd.channels === 0
    ? "no other channels"
    : `${crowd.channels.toLocaleString("en-GB")} other channels, ${crowd.episodes.toLocaleString("en-GB")} episodes, ${crowd.clips.toLocaleString("en-GB")} clips (seeded in ${crowd.seconds.toFixed(0)} s)`;

/** Seeds the crowd into a migrated database through a connection of its own, saying what it made. */
export async function seedCrowdInto(databaseUrl: string): Promise<CrowdFigures> {
  console.log("Seeding the other channels…");
  const handle = connectDatabase(databaseUrl);
  try {
    const crowd = await seedCrowd(handle.pool);
    console.log(`  ${describeCrowd(crowd)}`);
    return crowd;
  } finally {
    await handle.close();
  }
}
