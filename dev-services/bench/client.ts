import { spawn } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { launch } from "chrome-launcher";
import lighthouse, { type Result } from "lighthouse";
import { computeMedianRun } from "lighthouse/core/lib/median-run.js";
import { connectDatabase } from "../../server/db/client";
import { DEMO_CHANNEL, DEMO_PASSWORD, demoAccounts, seedDemo } from "../demo/channel";
import { repoRoot, stateDir } from "../paths";
import { freePort, stopChild, waitForHttp } from "../processes";
import { offlineServerEnv, runBench, signIn } from "./measure";
import { builtClient, throwawayDatabase } from "./throwaway";

/**
 * `npm run bench:client`: the client built into a folder of its own, a throwaway cluster with the
 * demo channel, a Kerf server of its own serving both, then Lighthouse with its default (mobile)
 * profile in Debian's Chromium on three pages: sign-in (signed out), the slate and an episode page
 * (signed in, the session's cookie sent with every request). Each page is audited BENCH_RUNS times
 * and the median run kept, as Lighthouse's guide to variability advises (docs/variability.md in the
 * GoogleChrome/lighthouse repository, "Run Lighthouse multiple times"), chosen by Lighthouse's own
 * `computeMedianRun`. The script the sign-in page loads is summed as gzip sends it.
 * The last line is one JSON object.
 */
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
const work = path.join(stateDir, `bench-client-${process.pid}`);
const clientDir = path.join(os.tmpdir(), `kerf-bench-client-${process.pid}`);
// The median run of each page, kept after the run for a closer look (Lighthouse's viewer opens them).
const reports = path.join(stateDir, "bench-client-reports");
const stops: (() => Promise<void> | void)[] = [];
const round = (n: number, digits = 1) => Math.round(n * 10 ** digits) / 10 ** digits;

interface PageAudit {
  name: string;
  path: string;
  cookie?: string;
}

/** The demo channel, and the episode whose test plan the demo fills in (its page opens on the plan). */
async function demoDatabase() {
  const databaseUrl = await throwawayDatabase(work, "kerf_bench_client", stops);
  const handle = connectDatabase(databaseUrl);
  try {
    await seedDemo(handle.db);
    const { rows } = await handle.pool.query<{ channel_id: string; id: string }>(
      "select e.channel_id, e.id from episodes e join channels c on c.id = e.channel_id where c.name = $1 and e.title = $2",
      [DEMO_CHANNEL, "Case fans versus one big rotor"],
    );
    return { databaseUrl, channelId: rows[0]!.channel_id, episodeId: rows[0]!.id };
  } finally {
    await handle.close();
  }
}

const score = (lhr: Result, category: string) => Math.round((lhr.categories[category]?.score ?? 0) * 100);
const numeric = (lhr: Result, audit: string) => lhr.audits[audit]?.numericValue ?? 0;

/** What Lighthouse found wanting: failed accessibility checks and performance advice with a saving. */
function problemsOf(lhr: Result): string[] {
  const refs = [...(lhr.categories.accessibility?.auditRefs ?? []), ...(lhr.categories.performance?.auditRefs ?? [])];
  return refs
    .map((ref) => lhr.audits[ref.id]!)
    .filter((audit) => audit.score !== null && audit.score < 0.9 && audit.scoreDisplayMode !== "informative" && audit.scoreDisplayMode !== "manual")
    .map((audit) => `${audit.id}${audit.displayValue ? ` (${audit.displayValue})` : ""}`);
}

function scriptsOf(lhr: Result): string[] {
  const details = lhr.audits["network-requests"]?.details as { items?: { url: string; resourceType?: string }[] } | undefined;
  return (details?.items ?? []).filter((item) => item.resourceType === "Script").map((item) => item.url);
}

async function auditOnce(port: number, url: string, cookie: string | undefined): Promise<Result> {
  const result = await lighthouse(url, {
    port,
    output: "json",
    logLevel: "error",
    onlyCategories: ["performance", "accessibility"],
    // Lighthouse's own list plus cookies: each run is a first visit, and a cookie left in the browser's
    // jar (the sign-in page's CSRF token) would replace the Cookie header given below.
    clearStorageTypes: ["file_systems", "shader_cache", "service_workers", "cache_storage", "cookies"],
    ...(cookie ? { extraHeaders: { Cookie: cookie } } : {}),
  });
  if (!result) throw new Error(`Lighthouse gave no result for ${url}`);
  const { lhr } = result;
  if (lhr.runtimeError) throw new LighthouseRunError(`Lighthouse on ${url}: ${lhr.runtimeError.message}`, lhr.runtimeError.code);
  if (!lhr.finalDisplayedUrl.startsWith(url)) throw new Error(`${url} ended at ${lhr.finalDisplayedUrl}: the page audited is not the one asked for`);
  return lhr;
}

class LighthouseRunError extends Error {
  constructor(
    message: string,
    readonly code: string,
  ) {
    super(message);
  }
}

/** Lighthouse's own advice for a trace it failed to record ("Please run Lighthouse again"). */
const RECORDING_FAILURES = new Set(["NO_NAVSTART", "NO_FCP", "NO_TRACING_STARTED", "NO_RESOURCE_REQUEST"]);
const RECORDING_TRIES = 3;

/** One audit, run again (up to three tries) when Lighthouse failed to record its trace: a failed recording says nothing of the page. */
async function auditRecorded(port: number, url: string, cookie: string | undefined): Promise<Result> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await auditOnce(port, url, cookie);
    } catch (error) {
      if (!(error instanceof LighthouseRunError) || !RECORDING_FAILURES.has(error.code) || attempt === RECORDING_TRIES) throw error;
      console.log(`${error.message}; running it again (try ${attempt + 1} of ${RECORDING_TRIES}).`);
    }
  }
}

/** The run Lighthouse's own `computeMedianRun` picks (nearest the median first paint and interactive time); the problems any run found. */
async function auditPage(port: number, appUrl: string, page: PageAudit) {
  const runs: Result[] = [];
  for (let i = 0; i < RUNS; i++) runs.push(await auditRecorded(port, appUrl + page.path, page.cookie));
  const lhr = computeMedianRun(runs);
  writeFileSync(path.join(reports, `${page.name}.json`), JSON.stringify(lhr));
  return {
    name: page.name,
    perf: score(lhr, "performance"),
    a11y: score(lhr, "accessibility"),
    fcpMs: numeric(lhr, "first-contentful-paint"),
    lcpMs: numeric(lhr, "largest-contentful-paint"),
    tbtMs: numeric(lhr, "total-blocking-time"),
    cls: numeric(lhr, "cumulative-layout-shift"),
    scripts: scriptsOf(lhr),
    benchmarkIndex: lhr.environment.benchmarkIndex,
    problems: [...new Set(runs.flatMap(problemsOf))],
  };
}

/** The bytes each script takes on the wire when the browser takes gzip (files under 1 kB are sent as they are). */
async function gzipBytes(urls: string[]): Promise<number> {
  let total = 0;
  for (const url of new Set(urls)) {
    const response = await fetch(url, { headers: { "accept-encoding": "gzip" } });
    if (!response.ok) throw new Error(`${url} answered ${response.status}`);
    const length = response.headers.get("content-length");
    const body = await response.arrayBuffer();
    total += length === null ? body.byteLength : Number(length);
  }
  return total;
}

/**
 * The pages that fetched zod (its core, known by its `$ZodType` class name) without a form being used:
 * the slate and the episode page fetch it only with a form, the sign-in page on its first check.
 */
async function pagesFetchingZod(audited: { name: string; scripts: string[] }[]): Promise<string[]> {
  const holdsZod = new Map<string, boolean>();
  for (const url of new Set(audited.flatMap((a) => a.scripts))) holdsZod.set(url, (await (await fetch(url)).text()).includes("$ZodType"));
  return audited.filter((a) => a.scripts.some((url) => holdsZod.get(url))).map((a) => a.name);
}

async function main() {
  mkdirSync(reports, { recursive: true });
  console.log("Building the client and seeding the demo channel…");
  await builtClient(clientDir, stops);
  const { databaseUrl, channelId, episodeId } = await demoDatabase();

  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: repoRoot,
    stdio: ["ignore", "ignore", "inherit"],
    env: await offlineServerEnv("client", { port: appPort, databaseUrl, clientDist: clientDir }),
  });
  stops.push(() => stopChild(server));
  // Generous: on a loaded machine the server alone can take a minute to start.
  await waitForHttp(`${appUrl}/api/auth/me`, 180_000);
  const owner = demoAccounts.find((account) => account.role === "owner")!;
  const { cookie } = await signIn(appUrl, { email: owner.email, password: DEMO_PASSWORD });

  const chrome = await launch({ chromePath: CHROMIUM, chromeFlags: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"] });
  stops.push(() => chrome.kill());
  const pages: PageAudit[] = [
    { name: "sign-in", path: "/sign-in" },
    { name: "slate", path: `/c/${channelId}/slate`, cookie },
    { name: "episode", path: `/c/${channelId}/episodes/${episodeId}`, cookie },
  ];
  // BENCH_PAGES=episode (or a comma list) audits just those pages, for a quick look at one.
  const only = process.env.BENCH_PAGES?.split(",");
  const audited = [];
  for (const page of pages.filter((p) => !only || only.includes(p.name))) {
    console.log(`Lighthouse (mobile) on ${page.name}, ${RUNS} runs…`);
    audited.push(await auditPage(chrome.port, appUrl, page));
  }
  const signInPage = audited.find((a) => a.name === "sign-in") ?? audited[0]!;
  const firstLoadGz = await gzipBytes(signInPage.scripts);
  const zodPages = await pagesFetchingZod(audited);

  const figures = {
    lighthouse_perf_min: Math.min(...audited.map((a) => a.perf)),
    lighthouse_a11y_min: Math.min(...audited.map((a) => a.a11y)),
    first_load_js_kb_gz: round(firstLoadGz / 1024),
    first_load_scripts: new Set(signInPage.scripts).size,
    pages_fetching_zod: zodPages,
    ...Object.fromEntries(
      audited.flatMap((a) => [
        [`${a.name}_perf`, a.perf],
        [`${a.name}_a11y`, a.a11y],
        [`${a.name}_fcp_ms`, Math.round(a.fcpMs)],
        [`${a.name}_lcp_ms`, Math.round(a.lcpMs)],
        [`${a.name}_tbt_ms`, Math.round(a.tbtMs)],
        [`${a.name}_cls`, round(a.cls, 3)],
      ]),
    ),
    runs_per_page: RUNS,
    // Lighthouse's measure of this machine's speed during the runs (a typical desktop is well over 1,000).
    benchmark_index_min: Math.round(Math.min(...audited.map((a) => a.benchmarkIndex))),
    load_average_1min: round(os.loadavg()[0]!, 2),
    cpus: os.cpus().length,
  };
  const verdict = (ok: boolean) => (ok ? "met" : "NOT met");
  const lines = audited.map(
    (a) =>
      `${a.name.padEnd(8)} performance ${a.perf}, accessibility ${a.a11y}; first paint ${round(a.fcpMs / 1000, 2)} s, largest paint ${round(a.lcpMs / 1000, 2)} s, blocking ${Math.round(a.tbtMs)} ms, layout shift ${round(a.cls, 3)}` +
      (a.problems.length ? `\n         wanting: ${a.problems.join(", ")}` : ""),
  );
  console.log(`
Lighthouse 12.2.3, mobile profile (simulated slow 4G, CPU slowed 4x), the median of ${RUNS} runs per page:
${lines.join("\n")}
lowest performance ${figures.lighthouse_perf_min}   (target >= 90: ${verdict(figures.lighthouse_perf_min >= 90)})
lowest accessibility ${figures.lighthouse_a11y_min}   (target 100: ${verdict(figures.lighthouse_a11y_min === 100)})
sign-in's script: ${figures.first_load_js_kb_gz} kB gzipped in ${figures.first_load_scripts} files   (target <= 150 kB: ${verdict(figures.first_load_js_kb_gz <= 150)})
pages that fetched zod without a form used: ${zodPages.length ? zodPages.join(", ") : "none"}   (target none: ${verdict(zodPages.length === 0)})
each page's median run: ${reports}/<page>.json
machine: ${figures.cpus} CPUs, load average ${figures.load_average_1min}, Lighthouse's benchmark index ${figures.benchmark_index_min} (its CPU figures stretch with other work on the machine)`);
  console.log(JSON.stringify(figures));
}

await runBench("bench:client", main, stops);
