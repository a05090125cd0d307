import { spawn } from "node:child_process";
import { existsSync, rmSync } from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { brotliDecompressSync, gunzipSync } from "node:zlib";
import autocannon from "autocannon";
import { generateNKeysBetween } from "fractional-indexing";
import { connectDatabase } from "../../server/db/client";
import { slatePlugs } from "../../server/app";
import { collectFlags } from "../../server/seams/board-flags";
import { stages } from "../../shared/slate/stages";
import { createCrewedChannel } from "../../tests/factories/accounts";
import { repoRoot, stateDir } from "../paths";
import { offlineServerEnv, percentile, runBench, signIn } from "./measure";
import { crowdedCluster } from "./kept-crowd";
import { freePort, run, stopChild, waitForHttp } from "../processes";
import { measureBoardRender } from "./slate-render";

/**
 * `npm run bench:slate`: a channel with 2,000 episodes and their histories in a throwaway cluster,
 * a Kerf server of its own, then
 * - the board endpoint and a one-row endpoint (the channel's stage lengths) through the same
 *   middleware (session, CSRF, membership): 200 requests each, one at a time, for p50 and p95;
 * - both under load (autocannon, several connections) for their requests per second and the ratio;
 * - the board right after a change (a move before each read: the kept board is brought up to date in place);
 * - unless BENCH_RENDER=0: a 500-card board rendered in Debian's Chromium, watching for long frames.
 * The last line is one JSON object.
 */
const EPISODES = Number(process.env.BENCH_EPISODES ?? 2000);
const REQUESTS = 200;
// Each read after its own move: enough of them that the 95th percentile is not the third-slowest of a few.
const AFTER_CHANGE_READS = 200;
const LOAD_SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 8);
const RENDER_CARDS = 500;
const work = path.join(stateDir, `bench-slate-${process.pid}`);
const clientDir = path.join(os.tmpdir(), `kerf-bench-slate-client-${process.pid}`);
const stops: (() => Promise<void> | void)[] = [];

const round = (n: number, digits = 1) => Math.round(n * 10 ** digits) / 10 ** digits;

/** `count` episodes spread over the stages, each with the history that walked it there; some with an override or a skipped gate. */
async function seedEpisodes(pool: ReturnType<typeof connectDatabase>["pool"], channelId: string, ownerIds: string[], count: number) {
  const perStage = Math.ceil(count / stages.length);
  for (const [index, stage] of stages.entries()) {
    const n = Math.min(perStage, count - index * perStage);
    if (n <= 0) break;
    await pool.query(
      `insert into episodes (channel_id, title, question, stage, rank, owner_id, tags, target_publish_date, created_at, stage_entered_at, budget_amount, budget_currency)
       select $1, 'Bench episode ' || $2 || ' ' || i, 'Does bench question ' || i || ' hold up?', $2::stage, ($3::text[])[i],
         ($4::uuid[])[1 + i % array_length($4::uuid[], 1)],
         case when i % 3 = 0 then array['flying', 'batteries'] when i % 3 = 1 then array['heat'] else '{}'::text[] end,
         case when i % 10 = 0 then null else current_date + (i % 120) - 20 end,
         now() - ((10 + i % 60) || ' days')::interval, now() - ((i % 25) || ' days')::interval,
         case when i % 4 = 0 then 100 + i % 900 end, case when i % 4 = 0 then 'EUR' end
       from generate_series(1, $5) as i`,
      [channelId, stage, generateNKeysBetween(null, null, n), ownerIds, n],
    );
  }
  // The history: an opening entry, then one move per stage up to the current one.
  await pool.query(
    `insert into stage_moves (channel_id, episode_id, from_stage, to_stage, moved_by, moved_at, reason, skipped)
     select e.channel_id, e.id, case when s.i = 1 then null else (enum_range(null::stage))[s.i - 1] end, (enum_range(null::stage))[s.i], e.owner_id,
       case when (enum_range(null::stage))[s.i] = e.stage then e.stage_entered_at else e.created_at + (s.i || ' days')::interval end,
       case when s.i > 1 and (hashtext(e.id::text) % 17) = 0 and (enum_range(null::stage))[s.i] = e.stage then 'Moving on; the plan follows.' end,
       case when s.i > 1 and (hashtext(e.id::text) % 17) = 0 and (enum_range(null::stage))[s.i] = e.stage
         then '[{"code":"test_plan.no_hypothesis","message":"The test plan has no hypothesis yet."}]'::jsonb else '[]'::jsonb end
     from episodes e cross join generate_series(1, 7) as s(i)
     where e.channel_id = $1 and s.i <= array_position(enum_range(null::stage), e.stage)`,
    [channelId],
  );
  await pool.query(
    `insert into due_overrides (channel_id, episode_id, stage, due_date)
     select channel_id, id, stage, target_publish_date - 30 from episodes
     where channel_id = $1 and stage <> 'publish' and target_publish_date is not null and hashtext(id::text) % 20 = 0`,
    [channelId],
  );
  await pool.query("analyze");
}

// One connection for the timed reads, kept alive between them, as a browser's tab keeps one.
const readAgent = new http.Agent({ keepAlive: true, maxSockets: 1 });

/** A GET timed from its start to the body's last byte as it arrives (compressed as sent). */
function timedGet(url: string, headers: Record<string, string>): Promise<{ ms: number; status: number; wire: Buffer; encoding: string }> {
  return new Promise((resolve, reject) => {
    const start = performance.now();
    const request = http.get(url, { headers, agent: readAgent }, (response) => {
      const chunks: Buffer[] = [];
      response.on("data", (chunk: Buffer) => chunks.push(chunk));
      response.on("end", () =>
        resolve({ ms: performance.now() - start, status: response.statusCode ?? 0, wire: Buffer.concat(chunks), encoding: String(response.headers["content-encoding"] ?? "identity") }),
      );
      response.on("error", reject);
    });
    request.on("error", reject);
  });
}

const decoders: Record<string, (wire: Buffer) => Buffer> = { br: brotliDecompressSync, gzip: gunzipSync, identity: (wire) => wire };

/**
 * One request at a time, `count` times: latency as the server's answer reaches the client, to its last
 * byte. The clock stops before the body is decoded: Node's fetch took 10–15 ms to gunzip the 740 KiB
 * board in this process (a browser decodes it natively in about a millisecond), which timed the
 * benchmark's own client, not Kerf. The last body is decoded after the clock, for its size.
 */
async function timeSequential(url: string, headers: Record<string, string>, count: number, before?: () => Promise<void>) {
  const times: number[] = [];
  let last: Awaited<ReturnType<typeof timedGet>> | null = null;
  for (let i = 0; i < count; i++) {
    if (before) await before();
    last = await timedGet(url, headers);
    if (last.status !== 200) throw new Error(`${url} answered ${last.status}`);
    times.push(last.ms);
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), bytes: last ? decoders[last.encoding]!(last.wire).byteLength : 0 };
}

function throughput(appUrl: string, pathname: string, headers: Record<string, string>): Promise<{ rps: number; errors: number }> {
  return new Promise((resolve, reject) => {
    autocannon({ url: appUrl + pathname, connections: CONNECTIONS, duration: LOAD_SECONDS, headers }, (error, result) =>
      error ? reject(error) : resolve({ rps: result.requests.average, errors: result.errors + result.timeouts + result.non2xx }),
    );
  });
}

async function main() {
  rmSync(work, { recursive: true, force: true });
  const render = process.env.BENCH_RENDER !== "0" && existsSync(process.env.CHROMIUM_PATH ?? "/usr/bin/chromium");
  if (render) {
    console.log("Building the client for the render check…");
    stops.push(() => rmSync(clientDir, { recursive: true, force: true }));
    // Its own folder outside .kerf/ (the server serves no path under a dot-folder) and away from dist/, which other runs use.
    const built = await run(path.join(repoRoot, "node_modules", ".bin", "vite"), ["build", "--outDir", clientDir, "--emptyOutDir", "--logLevel", "error"], { cwd: repoRoot });
    if (built !== 0) throw new Error("client build failed");
  }

  const { cluster, databaseUrl, crowd } = await crowdedCluster(path.join(work, "pg"), "kerf_bench_slate");
  stops.push(() => {
    cluster.stop();
    rmSync(work, { recursive: true, force: true });
  });

  console.log(`Seeding ${EPISODES} episodes with their histories…`);
  const handle = connectDatabase(databaseUrl);
  const big = await createCrewedChannel(handle.db, "Bench Channel");
  const seedStart = performance.now();
  await seedEpisodes(handle.pool, big.channel.id, [big.owner.id, big.producer.id, big.editor.id], EPISODES);
  const small = await createCrewedChannel(handle.db, "Render Channel");
  await seedEpisodes(handle.pool, small.channel.id, [small.owner.id, small.producer.id], RENDER_CARDS);
  // Other features' flag sources run on every board load (their tables raise no board revision): their share.
  const ids = (await handle.pool.query<{ id: string }>("select id from episodes where channel_id = $1 and archived_at is null", [big.channel.id])).rows.map((r) => r.id);
  const flagTimes: number[] = [];
  for (let i = 0; i < 25; i++) {
    const start = performance.now();
    await collectFlags(slatePlugs.boardFlags, handle.db, big.channel.id, ids, { timeZone: "UTC", today: new Date().toISOString().slice(0, 10) });
    if (i >= 5) flagTimes.push(performance.now() - start);
  }
  flagTimes.sort((a, b) => a - b);
  const history = (await handle.pool.query<{ n: number }>("select count(*)::int as n from stage_moves where channel_id = $1", [big.channel.id])).rows[0]!.n;
  const movable = (await handle.pool.query<{ id: string; version: number }>("select id, version from episodes where channel_id = $1 and stage = 'build' limit 1", [big.channel.id])).rows[0]!;
  await handle.close();
  console.log(`  ${EPISODES} episodes, ${history} history rows in ${round((performance.now() - seedStart) / 1000)} s`);

  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  // BENCH_PROFILE=<dir> writes the server's CPU profile there when it stops (open it in Chromium's devtools).
  const profile = process.env.BENCH_PROFILE ? ["--cpu-prof", "--cpu-prof-dir", path.resolve(process.env.BENCH_PROFILE)] : [];
  const server = spawn(process.execPath, [...profile, "--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "ignore", "inherit"],
    env: await offlineServerEnv("slate", { port: appPort, databaseUrl, clientDist: render ? clientDir : path.join(work, "no-client") }),
  });
  stops.push(() => stopChild(server));
  stops.push(() => readAgent.destroy());
  // A loaded machine may take minutes to start a server (its code is compiled as it loads).
  await waitForHttp(`${appUrl}/api/auth/me`, 180_000);

  const owner = await signIn(appUrl, big.owner);
  // As a browser asks: with brotli and gzip accepted (the board sends its kept body compressed; the one-row answer is too small to bother).
  const headers = { cookie: owner.cookie, accept: "application/json", "accept-encoding": "gzip, deflate, br" };
  const boardPath = `/api/channels/${big.channel.id}/episodes`;
  const oneRowPath = `/api/channels/${big.channel.id}/slate/settings`;
  const firstResponse = await fetch(appUrl + boardPath, { headers });
  const wireBytes = Number(firstResponse.headers.get("content-length") ?? 0);
  const wireEncoding = firstResponse.headers.get("content-encoding") ?? "identity";
  const first = (await firstResponse.json()) as { episodes: unknown[] };
  if (first.episodes.length !== EPISODES) throw new Error(`the board shows ${first.episodes.length} cards, not ${EPISODES}`);

  console.log("Warming up, then timing one request at a time…");
  await timeSequential(appUrl + boardPath, headers, 30);
  await timeSequential(appUrl + oneRowPath, headers, 30);
  const board = await timeSequential(appUrl + boardPath, headers, REQUESTS);
  const oneRow = await timeSequential(appUrl + oneRowPath, headers, REQUESTS);

  // A move before every read: the board's revision changes, so each read brings the kept board up to date.
  let version = movable.version;
  const moveOnce = async () => {
    const response = await fetch(`${appUrl}/api/channels/${big.channel.id}/episodes/${movable.id}/move`, {
      method: "POST",
      headers: { ...headers, "content-type": "application/json", "x-csrf-token": owner.csrf },
      body: JSON.stringify({ version, stage: "build" }),
    });
    if (!response.ok) throw new Error(`move answered ${response.status}: ${await response.text()}`);
    version = ((await response.json()) as { episode: { version: number } }).episode.version;
  };
  const afterChange = await timeSequential(appUrl + boardPath, headers, AFTER_CHANGE_READS, moveOnce);

  console.log(`Load: ${CONNECTIONS} connections for ${LOAD_SECONDS} s on each route…`);
  const boardLoad = await throughput(appUrl, boardPath, headers);
  const oneRowLoad = await throughput(appUrl, oneRowPath, headers);

  let rendered: Awaited<ReturnType<typeof measureBoardRender>> | null = null;
  if (render) {
    console.log(`Rendering a ${RENDER_CARDS}-card board in Chromium…`);
    rendered = await measureBoardRender({ appUrl, channelId: small.channel.id, person: small.owner, cards: RENDER_CARDS });
  }

  const figures = {
    other_channels: crowd.channels,
    other_episodes: crowd.episodes,
    other_clips: crowd.clips,
    episodes: EPISODES,
    history_rows: history,
    board_bytes: board.bytes,
    board_wire_bytes: wireBytes,
    board_encoding: wireEncoding,
    board_p50_ms: round(board.p50),
    board_p95_ms: round(board.p95),
    one_row_p50_ms: round(oneRow.p50),
    one_row_p95_ms: round(oneRow.p95),
    flag_sources_p50_ms: round(percentile(flagTimes, 50)),
    board_after_change_p50_ms: round(afterChange.p50),
    board_after_change_p95_ms: round(afterChange.p95),
    board_requests_per_s: Math.round(boardLoad.rps),
    one_row_requests_per_s: Math.round(oneRowLoad.rps),
    throughput_ratio: round(boardLoad.rps / oneRowLoad.rps, 2),
    load_errors: boardLoad.errors + oneRowLoad.errors,
    ...(rendered
      ? {
          render_cards: rendered.cards,
          render_cards_in_dom_first: rendered.firstPaintCards,
          render_max_frame_ms: rendered.maxFrameMs,
          render_max_long_task_ms: rendered.maxLongTaskMs,
          render_all_cards_max_frame_ms: rendered.allCardsMaxFrameMs,
          drag_max_frame_ms: rendered.dragMaxFrameMs,
          drag_all_cards_max_frame_ms: rendered.dragAllShownMs,
        }
      : {}),
    load_average_1min: round(os.loadavg()[0]!, 2),
    cpus: os.cpus().length,
  };
  const verdict = (ok: boolean) => (ok ? "met" : "NOT met");
  console.log(`
board (${EPISODES} cards, ${round(board.bytes / 1024, 0)} KiB, ${round(wireBytes / 1024, 0)} KiB as ${wireEncoding}):  p50 ${figures.board_p50_ms} ms, p95 ${figures.board_p95_ms} ms   (target p95 < 50 ms: ${verdict(figures.board_p95_ms < 50)})
one-row route (stage lengths):      p50 ${figures.one_row_p50_ms} ms, p95 ${figures.one_row_p95_ms} ms
other features' flag sources:       p50 ${figures.flag_sources_p50_ms} ms of every board load (one query per source)
board right after a change:         p50 ${figures.board_after_change_p50_ms} ms, p95 ${figures.board_after_change_p95_ms} ms   (target p95 < 30 ms: ${verdict(figures.board_after_change_p95_ms < 30)})
throughput:                         board ${figures.board_requests_per_s}/s, one-row ${figures.one_row_requests_per_s}/s, ratio ${figures.throughput_ratio}   (target >= 0.5: ${verdict(figures.throughput_ratio >= 0.5)})${
    rendered
      ? `
render in Chromium (${rendered.cards} cards): longest frame ${rendered.maxFrameMs} ms, longest task ${rendered.maxLongTaskMs} ms over ${rendered.runs} loads (target < 100 ms: ${verdict(rendered.maxFrameMs < 100)})
  ${rendered.firstPaintCards} cards are laid out at first, the rest as each column scrolls; scrolling every column to its end: longest frame ${rendered.allCardsMaxFrameMs} ms
  a drag across columns: longest frame ${rendered.dragMaxFrameMs} ms as the board opens, ${rendered.dragAllShownMs} ms with all ${rendered.cards} cards in the page`
      : ""
  }
machine: ${figures.cpus} CPUs, load average ${figures.load_average_1min} (other work on the machine stretches every figure)`);
  console.log(JSON.stringify(figures));
}

await runBench("bench:slate", main, stops);
