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
import { percentile, runBench } from "./measure";

/**
 * `npm run bench:intake`: a throwaway cluster with 100 channels. One of them imports 50,000
 * generated comments through the real import (CSV text, the column mapping, one transaction per file
 * of 5,000 rows, every row grouped as it is written); the others import a few dozen each first, so the
 * index holds every channel's rows. Then:
 * - import_rows_per_s: the big channel's rows over the time its files took;
 * - group_p95_ms: grouping one new suggestion (lock, compare with the open ideas, write), 300 times;
 * - grouping_precision / grouping_recall: over pairs of suggestions, Kerf's ideas against the
 *   generator's own asks (precision: of the pairs Kerf put together, the share that are one ask;
 *   recall: of the pairs that are one ask, the share Kerf put together).
 *
 * How the generator makes its asks and their near-duplicates: an ask is a subject, an action and a
 * target from three lists of 31 (invented workshop phrases); the ask for (a, b) takes target (a + b)
 * mod 31, so two asks share at most one of the three parts (as distinct viewer asks often share a tool
 * or a goal). Asks are drawn with a skew (a few asked hundreds of times, most a handful). Each copy is
 * then changed the way people write the same thing:
 * - reworded: one of a dozen openings ("Can you make", "I'd love to see", "Next video:") and
 *   closings ("please!!", "for science"), verbs in another form ("climb" / "climbing");
 * - misspelt: in half the copies one or two words of five letters or more get a letter dropped,
 *   doubled or swapped with its neighbour;
 * - reordered: in a third of the copies the target comes first ("Up a flight of stairs: a cordless drill…").
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

const SUBJECTS = `a cordless drill|a leaf blower|a toaster element|a bicycle dynamo|a shopping trolley|a potato cannon|a lawn mower engine|a washing machine motor|a hot glue gun|a solar panel|a car jack|a microwave transformer|a fridge compressor|a paper airplane|a cardboard boat|a 3D printed gear|a hydraulic press|a model rocket|a Tesla coil|a kitchen blender|a sewing machine|a garden hose|a stack of magnets|a fidget spinner|an office chair|a belt sander|a pressure washer|a ceiling fan|a skateboard truck|a bathroom scale|a claw hammer`.split("|");
const ACTIONS = `climb|lift|tow|launch|power|cool|heat|crush|spin|float|carry|pump|cut|light|charge|balance|stop|throw|melt|push|sort|grip|measure|fold|steer|bounce|shred|dry|freeze|wind|weld`.split("|");
const TARGETS = `a flight of stairs|a family car|a garden shed|a bowling ball|a small boat|a pizza oven|a cinder block|a wooden pallet|a water tank|a tennis ball|a camping tent|a ceramic mug|a steel beam|a pumpkin|a snowman|a bag of cement|a scooter|a watermelon|a beehive|a phone battery|a treehouse|a canoe|an ice block|a paddling pool|a robot arm|a go-kart|a hammock|a bookshelf|a dartboard|a kite|a drum kit`.split("|");
const N = SUBJECTS.length;
const OPENINGS = ["Can", "Can you make", "I'd love to see if", "Please try to make", "Next video:", "Could someone test whether", "Challenge idea:", "Would it be possible for", "What if", "Try making", "Hey, can", "Idea:"];
const CLOSINGS = ["", "", "?", "?!", " please!!", " for science", " - would watch", " lol", " next episode?", "!"];
const VERB_FORMS = (verb: string) => [verb, `${verb.replace(/e$/, "")}ing`, `${verb}s`];

/** A small seeded generator (mulberry32), so every run writes the same comments. */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
type Rand = ReturnType<typeof random>;
const pick = <T>(rand: Rand, list: readonly T[]) => list[Math.floor(rand() * list.length)]!;

function misspell(rand: Rand, word: string): string {
  if (word.length < 5) return word;
  const i = 1 + Math.floor(rand() * (word.length - 2));
  const kind = Math.floor(rand() * 3);
  if (kind === 0) return word.slice(0, i) + word.slice(i + 1);
  if (kind === 1) return word.slice(0, i) + word[i] + word.slice(i);
  return word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2);
}

function variant(rand: Rand, ask: number): string {
  const a = Math.floor(ask / N);
  const b = ask % N;
  const subject = SUBJECTS[a]!;
  const action = pick(rand, VERB_FORMS(ACTIONS[b]!));
  const target = TARGETS[(a + b) % N]!;
  let text = rand() < 1 / 3 ? `${target[0]!.toUpperCase()}${target.slice(1)}: ${subject} ${action} it` : `${pick(rand, OPENINGS)} ${subject} ${action} ${target}`;
  text += pick(rand, CLOSINGS);
  if (rand() < 0.5) {
    const words = text.split(" ");
    for (let k = 0; k < 1 + Math.floor(rand() * 2); k++) {
      const at = Math.floor(rand() * words.length);
      words[at] = misspell(rand, words[at]!);
    }
    text = words.join(" ");
  }
  return text;
}

interface Comment {
  id: string;
  author: string;
  text: string;
  ask: number;
}

/** `rows` comments over `asks` asks drawn with a skew (rank r asked about 1/r^0.9 as often as the first). */
function comments(rows: number, asks: number, seed: number, prefix: string): Comment[] {
  const rand = random(seed);
  const order = Array.from({ length: N * N }, (_, i) => i).sort(() => rand() - 0.5).slice(0, asks);
  const weights = order.map((_, r) => 1 / (r + 1) ** 0.9);
  const total = weights.reduce((s, w) => s + w, 0);
  const out: Comment[] = [];
  for (let i = 0; i < rows; i++) {
    let x = rand() * total;
    let r = 0;
    while (r < weights.length - 1 && (x -= weights[r]!) > 0) r++;
    out.push({ id: `${prefix}-${i}`, author: `viewer${Math.floor(rand() * rows * 0.6)}`, text: variant(rand, order[r]!), ask: order[r]! });
  }
  return out;
}

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
import: ${figures.rows_in_channel} rows in ${figures.import_seconds} s, ${figures.import_rows_per_s} rows/s (each row grouped as it is written)
grouping one new suggestion: p50 ${figures.group_p50_ms} ms, p95 ${figures.group_p95_ms} ms   (target p95 < 30 ms: ${verdict(figures.group_p95_ms < 30)})
grouping against the generator's ${asks} asks (${ideas} ideas formed): precision ${figures.grouping_precision}, recall ${figures.grouping_recall}   (target ≥ 0.9 each: ${verdict(figures.grouping_precision >= 0.9 && figures.grouping_recall >= 0.9)})
machine: ${figures.cpus} CPUs, load average ${figures.load_average_1min} (other work stretches every timing)`);
  console.log(JSON.stringify(figures));
}

await runBench("bench:intake", main, stops);
