import { rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { stringify } from "csv-stringify/sync";
import { connectDatabase, type Database } from "../../server/db/client";
import { migrateDatabase } from "../../server/db/migrate";
import { inTransaction } from "../../server/db/transaction";
import type { Caller } from "../../server/http/route-table";
import { fileSuggestion } from "../../server/intake/grouping";
import { lockChannelGrouping } from "../../server/intake/grouping.repository";
import { fingerprintOf, importFile } from "../../server/intake/imports.service";
import { createChannel, createUser } from "../../tests/factories/accounts";
import { stateDir } from "../paths";
import { ensureDatabase, startCluster } from "../postgres";
import { freePort } from "../processes";
import { comments, N, type Comment } from "./intake-comments";
import { percentile, runBench } from "./measure";

/**
 * `npm run bench:intake`: a throwaway cluster with 100 channels. One of them imports 50,000
 * generated comments through the real import (CSV text, the column mapping, one transaction per file
 * of 5,000 rows, grouped as if filed one by one: each distinct key compared once with the ideas so far);
 * the others import a few dozen each first, so the index holds every channel's rows. Then:
 * - import_rows_per_s: the big channel's rows over the time its files took;
 * - group_p95_ms: grouping one new suggestion (lock, compare with the open ideas, write), 300 times;
 * - grouping_precision / grouping_recall: over pairs of suggestions, Kerf's ideas against the
 *   generator's own asks (precision: of the pairs Kerf put together, the share that are one ask;
 *   recall: of the pairs that are one ask, the share Kerf put together).
 *
 * How the generator words its asks and their near-duplicates: see intake-comments.ts.
 * The last line is one JSON object.
 */
const ROWS = Number(process.env.BENCH_ROWS ?? 50_000);
const CHANNELS = Number(process.env.BENCH_CHANNELS ?? 100);
const PER_OTHER_CHANNEL = Number(process.env.BENCH_PER_CHANNEL ?? 40);
const FILE_ROWS = 5_000;
const GROUPINGS = 300;
const work = path.join(stateDir, `bench-intake-${process.pid}`);
const stops: (() => Promise<void> | void)[] = [];
const round = (n: number, digits = 1) => Math.round(n * 10 ** digits) / 10 ** digits;

const csvOf = (rows: Comment[]) => stringify([["Comment ID", "Author", "Comment"], ...rows.map((c) => [c.id, c.author, c.text])]);
const mapping = { text: "Comment", author: "Author", commentId: "Comment ID" };

async function importAll(db: Database, caller: Caller, rows: Comment[]): Promise<void> {
  for (let i = 0; i < rows.length; i += FILE_ROWS) {
    const result = await importFile(db, caller, { csv: csvOf(rows.slice(i, i + FILE_ROWS)), mapping });
    if (result.added + result.skipped !== Math.min(FILE_ROWS, rows.length - i)) throw new Error("the import lost rows");
  }
}

/** Pairwise precision and recall of Kerf's ideas against the generator's asks (pair counts from the contingency table). */
function pairScores(rows: { idea: string; ask: number }[]) {
  const pairs = (n: number) => (n * (n - 1)) / 2;
  const tally = (key: (r: { idea: string; ask: number }) => string) => {
    const counts = new Map<string, number>();
    for (const r of rows) counts.set(key(r), (counts.get(key(r)) ?? 0) + 1);
    return [...counts.values()].reduce((s, n) => s + pairs(n), 0);
  };
  const both = tally((r) => `${r.idea}|${r.ask}`);
  return { precision: both / tally((r) => r.idea), recall: both / tally((r) => String(r.ask)) };
}

async function main() {
  rmSync(work, { recursive: true, force: true });
  const cluster = startCluster({ dataDir: path.join(work, "pg"), port: await freePort(), fresh: true });
  stops.push(() => {
    cluster.stop();
    rmSync(work, { recursive: true, force: true });
  });
  const databaseUrl = await ensureDatabase(cluster, "kerf_bench_intake");
  await migrateDatabase(databaseUrl);
  const handle = connectDatabase(databaseUrl);
  stops.push(() => handle.close());
  const owner = await createUser(handle.db, { name: "Bench Owner" });
  const callerFor = (channelId: string): Caller => ({ userId: owner.id, name: owner.name, email: owner.email, emailVerified: true, timeZone: "UTC", channelId, role: "owner" });

  console.log(`Importing ${PER_OTHER_CHANNEL} comments into each of ${CHANNELS - 1} other channels…`);
  for (let c = 1; c < CHANNELS; c++) {
    const channel = await createChannel(handle.db, owner, `Other channel ${c}`);
    await importAll(handle.db, callerFor(channel.id), comments(PER_OTHER_CHANNEL, 12, 1000 + c, `o${c}`));
  }
  const big = await createChannel(handle.db, owner, "Bench Channel");
  const caller = callerFor(big.id);
  const asks = Math.min(N * N, Math.round(ROWS / 50));
  const rows = comments(ROWS, asks, 42, "big");
  console.log(`Importing ${ROWS} comments (${asks} asks, reworded, misspelt, reordered) into one channel, ${FILE_ROWS} rows a file…`);
  const importStart = performance.now();
  await importAll(handle.db, caller, rows);
  const importSeconds = (performance.now() - importStart) / 1000;
  await handle.pool.query("vacuum analyze");

  const truth = new Map(rows.map((r) => [fingerprintOf({ commentId: r.id, author: r.author, postedAt: null, text: r.text }), r.ask]));
  const filed = await handle.pool.query<{ idea_id: string; fingerprint: string }>("select idea_id, fingerprint from intake_suggestions where channel_id = $1", [big.id]);
  const scores = pairScores(filed.rows.map((r) => ({ idea: r.idea_id, ask: truth.get(r.fingerprint)! })));
  const ideas = new Set(filed.rows.map((r) => r.idea_id)).size;

  console.log(`Grouping ${GROUPINGS} new suggestions one at a time…`);
  const fresh = comments(GROUPINGS, asks, 7, "new");
  const times: number[] = [];
  for (const comment of fresh) {
    const start = performance.now();
    await inTransaction(handle.db, async (tx) => {
      await lockChannelGrouping(tx, big.id);
      await fileSuggestion(tx, big.id, { text: comment.text, source: "hand", personKey: `bench:${comment.id}` });
    });
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);

  const figures = {
    rows_in_channel: filed.rows.length,
    channels: CHANNELS,
    asks_generated: asks,
    ideas_formed: ideas,
    import_seconds: round(importSeconds),
    import_rows_per_s: Math.round(ROWS / importSeconds),
    group_p50_ms: round(percentile(times, 50)),
    group_p95_ms: round(percentile(times, 95)),
    grouping_precision: round(scores.precision, 3),
    grouping_recall: round(scores.recall, 3),
    load_average_1min: round(os.loadavg()[0]!, 2),
    cpus: os.cpus().length,
  };
  const verdict = (ok: boolean) => (ok ? "met" : "NOT met");
  console.log(`
import: ${figures.rows_in_channel} rows in ${figures.import_seconds} s, ${figures.import_rows_per_s} rows/s (grouped as if filed one by one)
grouping one new suggestion: p50 ${figures.group_p50_ms} ms, p95 ${figures.group_p95_ms} ms   (target p95 < 30 ms: ${verdict(figures.group_p95_ms < 30)})
grouping against the generator's ${asks} asks (${ideas} ideas formed): precision ${figures.grouping_precision}, recall ${figures.grouping_recall}   (target ≥ 0.9 each: ${verdict(figures.grouping_precision >= 0.9 && figures.grouping_recall >= 0.9)})
machine: ${figures.cpus} CPUs, load average ${figures.load_average_1min} (other work stretches every timing)`);
  console.log(JSON.stringify(figures));
}

await runBench("bench:intake", main, stops);
