import { rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawn } from "node:child_process";
import type pg from "pg";
import { connectDatabase } from "../../server/db/client";
import { findInChannel } from "../../server/search/search.repository";
import { searchableAreas } from "../../server/search/search.service";
import { createCrewedChannel } from "../../tests/factories/accounts";
import { repoRoot, stateDir } from "../paths";
import { crowdedCluster } from "./kept-crowd";
import { freePort, stopChild, waitForHttp } from "../processes";
import { offlineServerEnv, percentile, runBench, signIn } from "./measure";

/**
 * `npm run bench:search`: a throwaway cluster holding the crowd (crowd.ts: BENCH_CROWD_CHANNELS,
 * 10,000 by default, each episode and clip with its entry) and 1,000 channels more; one of them has
 * 100,000 searchable records (episodes, bench runs, clips, marks, comments, shots), the others a few
 * hundred each, written with set-based SQL through the real triggers. A Kerf server of its own, then
 * - searches as the owner through the HTTP route, one at a time (common and rare words, two words,
 *   a misspelling, a partial word, an accent-free spelling), for p50 and p95.
 *   The misspelling, the partial word and the absent word go the near way: the channel's word list
 *   (search_words) by trigrams, then the entries by the words found;
 * - an episode save (PATCH, a new title and question each time) with the update trigger
 *   `episodes_search` on and off, alternating in rounds, for the extra cost of keeping the index
 *   (entry, its words, the channel's new words); and the same for the bare UPDATE statement.
 * The last line is one JSON object.
 */
const RECORDS = Number(process.env.BENCH_RECORDS ?? 100_000);
const CHANNELS = Number(process.env.BENCH_CHANNELS ?? 1000);
const PER_OTHER_CHANNEL = Number(process.env.BENCH_PER_CHANNEL ?? 100);
const SEARCHES = 300;
const SAVE_ROUNDS = 10;
const SAVES_PER_ROUND = 30;
const work = path.join(stateDir, `bench-search-${process.pid}`);
const stops: (() => Promise<void> | void)[] = [];
const round = (n: number, digits = 1) => Math.round(n * 10 ** digits) / 10 ** digits;

// An invented workshop vocabulary; words are drawn with a skew (a few common, most rare), as in real notes.
const VOCABULARY = `motor rotor propeller thrust battery pack cell swell heat shrink solder joint bracket hinge shoulder
harness strap gimbal tilt wobble vibration bearing shaft collar knurl dovetail jig fence bandsaw lathe chuck tailstock
crème brûlée torch nozzle flame kiln clay glaze resin mould casting aluminium steel brass copper wire gauge fuse relay
switch servo stepper driver encoder sensor thermistor probe scale load cell strain gauge bridge amplifier filter ripple
capacitor inductor coil spring damper frame chassis hull keel rudder sail mast rigging pulley winch rope knot carabiner
tarp canopy parachute rocket fin nosecone igniter launch pad rail stand clamp vice drill bit tap thread bolt nut washer
rivet weld bead flux grinder sander belt disc blade guard fixture sled gantry router spindle collet endmill feed speed`
  .split(/\s+/)
  .filter(Boolean);
// Made-up words after the real ones, so the rarer words are many (1,000 words in all).
const SYLLABLES = ["ba", "ko", "ru", "mi", "te", "lo", "sa", "ve", "di", "nu", "pe", "zo", "ga", "fi", "hu", "ja", "ly", "qe", "wa", "xo"];
const madeUp = (i: number) => SYLLABLES[i % 20]! + SYLLABLES[Math.floor(i / 20) % 20]! + SYLLABLES[Math.floor(i / 400) % 20]! + "n";
const WORDS = [...VOCABULARY, ...Array.from({ length: 1000 - VOCABULARY.length }, (_, i) => madeUp(i * 7 + 3))];

/** Text of `words` words, skewed toward the start of the vocabulary; the same `seed` gives the same text. */
const textSql = (words: number, seed: string) =>
  `(select string_agg(v[1 + floor(power(((hashtext(${seed} || ':' || k)::bigint & 2147483647) / 2147483648.0), 1.5) * array_length(v, 1))::int], ' ')
     from generate_series(1, ${words}) as k)`;

async function seed(pool: pg.Pool, bigChannelId: string, ownerId: string) {
  await pool.query("select set_config('bench.vocabulary', $1, false)", [WORDS.join(" ")]);
  const vocab = "string_to_array(current_setting('bench.vocabulary'), ' ')";
  // Other channels first: an owner each, then their records, so the index holds every channel's words.
  // Only the channels made here: the crowd (crowd.ts) has search entries of its own already.
  const made = await pool.query<{ id: string }>(
    `with made as (insert into channels (name) select 'Other channel ' || i from generate_series(1, $1) as i returning id),
       owned as (insert into memberships (channel_id, user_id, role) select id, $2, 'owner' from made)
     select id from made`,
    [CHANNELS - 1, ownerId],
  );
  const otherIds = made.rows.map((row) => row.id);
  const others = `(select o.channel_id, o.n from unnest($1::uuid[]) with ordinality as o(channel_id, n))`;
  await pool.query(
    `insert into episodes (channel_id, title, question, rank)
     select o.channel_id, ${textSql(4, "'eo' || o.n || ':' || g")}, ${textSql(10, "'eq' || o.n || ':' || g")}, 'a' || lpad(g::text, 6, '0')
     from ${others} o cross join generate_series(1, $2) as g, (select ${vocab} as v) as w`,
    [otherIds, Math.max(1, Math.floor(PER_OTHER_CHANNEL / 2))],
  );
  await pool.query(
    `insert into episode_comments (channel_id, episode_id, body)
     select e.channel_id, e.id, ${textSql(14, "'ec' || e.id")} from episodes e, (select ${vocab} as v) as w where e.channel_id = any($1::uuid[])`,
    [otherIds],
  );

  // The big channel: 5% episodes, 20% bench runs, 25% clips, 20% marks, 25% comments, 5% shots.
  const share = (p: number) => Math.round((RECORDS * p) / 100);
  await pool.query(
    `insert into episodes (channel_id, title, question, why_worth_it, tags, rank)
     select $1, ${textSql(5, "'t' || g")}, ${textSql(12, "'q' || g")}, ${textSql(20, "'w' || g")}, array[v[1 + g % 40]], 'a' || lpad(g::text, 7, '0')
     from generate_series(1, $2) as g, (select ${vocab} as v) as w`,
    [bigChannelId, share(5)],
  );
  const episodes = `(select id, row_number() over (order by id) as n, count(*) over () as total from episodes where channel_id = $1)`;
  await pool.query(
    `insert into bench_runs (channel_id, episode_id, number, label, notes)
     select $1, e.id, g, ${textSql(3, "'rl' || g")}, ${textSql(25, "'rn' || g")}
     from generate_series(1, $2) as g join ${episodes} e on e.n = 1 + g % e.total, (select ${vocab} as v) as w`,
    [bigChannelId, share(20)],
  );
  await pool.query(
    `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, recorded_at, tags, notes, camera, frame_rate_numerator, frame_rate_denominator)
     select $1, e.id, 'bench/' || g, 'A' || lpad((g % 999)::text, 3, '0') || '_C' || lpad(g::text, 6, '0') || '_' || v[1 + g % array_length(v, 1)] || '.mov',
       'video/quicktime', 1000000, now() - (g || ' minutes')::interval, array[v[1 + (g * 7) % array_length(v, 1)]], ${textSql(15, "'cn' || g")}, 'A cam', 25, 1
     from generate_series(1, $2) as g join ${episodes} e on e.n = 1 + g % e.total, (select ${vocab} as v) as w`,
    [bigChannelId, share(25)],
  );
  await pool.query(
    `insert into clip_marks (channel_id, clip_id, in_frame, out_frame, in_label, out_label, note)
     select $1, c.id, 90000, 90050, '01:00:00:00', '01:00:02:00', ${textSql(8, "'mn' || c.id")}
     from (select id from clips where channel_id = $1 order by id limit $2) c, (select ${vocab} as v) as w`,
    [bigChannelId, share(20)],
  );
  await pool.query(
    `insert into episode_comments (channel_id, episode_id, author_id, body)
     select $1, e.id, $3, ${textSql(18, "'cb' || g")}
     from generate_series(1, $2) as g join ${episodes} e on e.n = 1 + g % e.total, (select ${vocab} as v) as w`,
    [bigChannelId, share(25), ownerId],
  );
  await pool.query(
    `insert into shots (channel_id, episode_id, description, kind)
     select $1, e.id, ${textSql(7, "'sd' || g")}, 'insert'
     from generate_series(1, $2) as g join ${episodes} e on e.n = 1 + g % e.total, (select ${vocab} as v) as w`,
    [bigChannelId, share(5)],
  );
  await pool.query("vacuum analyze");
}

async function timeSearches(appUrl: string, channelId: string, headers: Record<string, string>, queries: string[]) {
  const times: number[] = [];
  const hits: number[] = [];
  for (let i = 0; i < SEARCHES; i++) {
    const q = queries[i % queries.length]!;
    const start = performance.now();
    const response = await fetch(`${appUrl}/api/channels/${channelId}/search?${new URLSearchParams({ q })}`, { headers });
    const body = (await response.json()) as { groups: { hits: unknown[] }[] };
    times.push(performance.now() - start);
    if (!response.ok) throw new Error(`search for ${q} answered ${response.status}`);
    hits.push(body.groups.reduce((n, g) => n + g.hits.length, 0));
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), max: times.at(-1)!, emptyAnswers: hits.filter((n) => n === 0).length };
}

/** Episode saves in alternating rounds, the search trigger on and off: the median round of each. */
async function timeSaves(pool: pg.Pool, save: (i: number) => Promise<void>) {
  const on: number[] = [];
  const off: number[] = [];
  let i = 0;
  for (let r = 0; r < SAVE_ROUNDS * 2; r++) {
    const enabled = r % 2 === 0;
    await pool.query(`alter table episodes ${enabled ? "enable" : "disable"} trigger episodes_search`);
    const start = performance.now();
    for (let k = 0; k < SAVES_PER_ROUND; k++) await save(i++);
    (enabled ? on : off).push((performance.now() - start) / SAVES_PER_ROUND);
  }
  await pool.query("alter table episodes enable trigger episodes_search");
  on.sort((a, b) => a - b);
  off.sort((a, b) => a - b);
  const withIndex = percentile(on, 50);
  const without = percentile(off, 50);
  return { withIndex, without, overheadPct: ((withIndex - without) / without) * 100 };
}

async function main() {
  rmSync(work, { recursive: true, force: true });
  const { cluster, databaseUrl, crowd } = await crowdedCluster(path.join(work, "pg"), "kerf_bench_search");
  stops.push(() => {
    cluster.stop();
    rmSync(work, { recursive: true, force: true });
  });

  const handle = connectDatabase(databaseUrl);
  stops.push(() => handle.close());
  const big = await createCrewedChannel(handle.db, "Bench Channel");
  console.log(`Seeding ${RECORDS} records in one channel and ${PER_OTHER_CHANNEL} in each of ${CHANNELS - 1} others…`);
  const seedStart = performance.now();
  await seed(handle.pool, big.channel.id, big.owner.id);
  const counts = (
    await handle.pool.query<{ mine: number; all: number; channels: number }>(
      "select count(*) filter (where channel_id = $1)::int as mine, count(*)::int as all, count(distinct channel_id)::int as channels from search_documents",
      [big.channel.id],
    )
  ).rows[0]!;
  console.log(`  ${counts.mine} entries in the channel, ${counts.all} in ${counts.channels} channels, in ${round((performance.now() - seedStart) / 1000)} s`);

  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "ignore", "inherit"],
    env: await offlineServerEnv("search", { port: appPort, databaseUrl, clientDist: path.join(work, "no-client") }),
  });
  stops.push(() => stopChild(server));
  await waitForHttp(`${appUrl}/api/auth/me`, 60_000);
  const owner = await signIn(appUrl, big.owner);
  const headers = { cookie: owner.cookie, accept: "application/json" };

  // Common and rare words, two words, a misspelling, a partial word, an accent left off, a file name's part.
  const queries = ["motor", "sprocket", "gimbal tilt", "sholder harness", "dovet", "creme brulee", "knurl collar", "C000123", "rotor -propeller", "winch rope knot"];
  console.log("Warming up, then timing searches one at a time…");
  await timeSearches(appUrl, big.channel.id, headers, queries.slice(0, 5));
  const searches = await timeSearches(appUrl, big.channel.id, headers, queries);

  // The query alone, in this process: what the database takes, without HTTP, session and JSON.
  const queryTimes: number[] = [];
  for (let i = 0; i < SEARCHES; i++) {
    const start = performance.now();
    await findInChannel(handle.db, big.channel.id, searchableAreas("owner"), queries[i % queries.length]!);
    queryTimes.push(performance.now() - start);
  }
  queryTimes.sort((a, b) => a - b);

  console.log("Timing episode saves with the search index kept and not kept…");
  const episode = (await handle.pool.query<{ id: string; version: number }>("select id, version from episodes where channel_id = $1 limit 1", [big.channel.id])).rows[0]!;
  let version = episode.version;
  const httpSaves = await timeSaves(handle.pool, async (i) => {
    const response = await fetch(`${appUrl}/api/channels/${big.channel.id}/episodes/${episode.id}`, {
      method: "PATCH",
      headers: { ...headers, "content-type": "application/json", "x-csrf-token": owner.csrf },
      body: JSON.stringify({ version, title: `Gimbal tilt rig, take ${i}`, question: `Does take ${i} hold the horizon?` }),
    });
    if (!response.ok) throw new Error(`save answered ${response.status}: ${await response.text()}`);
    version = ((await response.json()) as { episode: { version: number } }).episode.version;
  });
  const sqlSaves = await timeSaves(handle.pool, async (i) => {
    await handle.pool.query("update episodes set title = $2, question = $3, updated_at = now() where id = $1", [episode.id, `Gimbal tilt rig, draft ${i}`, `Does draft ${i} hold?`]);
  });

  const figures = {
    other_channels: crowd.channels,
    other_episodes: crowd.episodes,
    other_clips: crowd.clips,
    records_in_channel: counts.mine,
    records_all_channels: counts.all,
    channels: counts.channels,
    search_p50_ms: round(searches.p50),
    search_p95_ms: round(searches.p95),
    search_max_ms: round(searches.max),
    search_query_p50_ms: round(percentile(queryTimes, 50)),
    search_query_p95_ms: round(percentile(queryTimes, 95)),
    searches_without_hits: searches.emptyAnswers,
    save_with_index_ms: round(httpSaves.withIndex, 2),
    save_without_index_ms: round(httpSaves.without, 2),
    search_index_write_overhead_pct: round(httpSaves.overheadPct),
    update_statement_with_index_ms: round(sqlSaves.withIndex, 3),
    update_statement_without_index_ms: round(sqlSaves.without, 3),
    update_statement_overhead_pct: round(sqlSaves.overheadPct),
    load_average_1min: round(os.loadavg()[0]!, 2),
    cpus: os.cpus().length,
  };
  const verdict = (ok: boolean) => (ok ? "met" : "NOT met");
  console.log(`
search (${counts.mine} entries in the channel, ${counts.all} in ${counts.channels} channels), through the HTTP route:
  p50 ${figures.search_p50_ms} ms, p95 ${figures.search_p95_ms} ms, slowest ${figures.search_max_ms} ms   (target p95 < 50 ms: ${verdict(figures.search_p95_ms < 50)})
  the query alone (in process): p50 ${figures.search_query_p50_ms} ms, p95 ${figures.search_query_p95_ms} ms
episode save (PATCH, new title and question): ${figures.save_with_index_ms} ms with the index kept, ${figures.save_without_index_ms} ms without
  extra cost ${figures.search_index_write_overhead_pct} %   (target < 20 %: ${verdict(figures.search_index_write_overhead_pct < 20)})
the UPDATE statement alone: ${figures.update_statement_with_index_ms} ms with, ${figures.update_statement_without_index_ms} ms without (${figures.update_statement_overhead_pct} % more: the trigger's own share)
machine: ${figures.cpus} CPUs, load average ${figures.load_average_1min} (other work stretches every figure)`);
  console.log(JSON.stringify(figures));
}

await runBench("bench:search", main, stops);
