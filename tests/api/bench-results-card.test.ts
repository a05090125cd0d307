import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "../../dev-services/demo/channel";
import { startResultsCardWorker } from "../../server/bench/bench.jobs";
import { closeSharedBrowser } from "../../server/jobs/chromium";
import { RESULTS_CARD_QUEUE } from "../../server/bench/results-card.service";
import { figureIn, plannedUnit } from "../../shared/bench/comparison";
import { formatNumber } from "../../shared/bench/format";
import { cardTable } from "../../shared/bench/results-card";
import type { ResultsCardView } from "../../shared/bench/results-card-view";
import type { RunView, TestPlanView } from "../../shared/bench/schemas";
import { createEpisode } from "../factories/episodes";
import { settledJobs } from "../support/jobs";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { demoCardEpisode } from "./results-card-helpers";

let app: TestApp;
let owner: Visitor;
let editor: Visitor;
let base: string;
let channelId: string;

beforeAll(async () => {
  app = await startTestApp();
  ({ channelId, base } = await demoCardEpisode(app));
  [owner, editor] = await Promise.all([app.signedIn({ email: "owner@example.com", password: DEMO_PASSWORD }), app.signedIn({ email: "editor@example.com", password: DEMO_PASSWORD })]);
  await startResultsCardWorker(app.jobs.boss, { db: app.db, storage: app.deps.storage, jobs: app.jobs, chromiumPath: app.deps.env.CHROMIUM_PATH }, { pollSeconds: 0.5 });
});
afterAll(async () => {
  await app.close();
  await closeSharedBrowser();
});

/** Width and height from a PNG's IHDR chunk: bytes 16–23, big-endian (PNG specification, 3rd ed., 11.2.2 IHDR). */
function pngSize(bytes: Buffer) {
  expect(bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  expect(bytes.subarray(12, 16).toString("ascii")).toBe("IHDR");
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

async function drawnCard(): Promise<ResultsCardView> {
  await settledJobs(app.database.pool, RESULTS_CARD_QUEUE, (job) => job.data.channelId === channelId, 1);
  return (await editor.get(`${base}/results-card`).expect(200)).body.card;
}

describe("the results card", () => {
  it("when the owner asks for the demo's card, then a job draws a 1920 × 1080 PNG and its SVG, kept as the episode's stills", async () => {
    expect((await editor.get(`${base}/results-card`).expect(200)).body.card).toBeNull();
    const asked = await owner.send("post", `${base}/results-card`).expect(202);
    expect(asked.body.card).toMatchObject({ state: "queued", png: null });

    const card = await drawnCard();
    expect(card.state).toBe("ready");
    expect(card.png?.fileName).toBe("results-card-case-fans-versus-one-big-rotor.png");
    const png = Buffer.from(await (await fetch(card.png!.url)).arrayBuffer());
    expect(pngSize(png)).toEqual({ width: 1920, height: 1080 });

    const stills = (await app.database.pool.query("select file_name, content_type from stills where episode_id = $1 order by content_type", [base.split("/").pop()])).rows;
    expect(stills).toEqual([
      { file_name: "results-card-case-fans-versus-one-big-rotor.png", content_type: "image/png" },
      { file_name: "results-card-case-fans-versus-one-big-rotor.svg", content_type: "image/svg+xml" },
    ]);
    // The first card starts the instance's Chromium: on a loaded machine that alone can take many seconds.
  }, 90_000);

  it("shows every figure exactly as the bench table writes it, in the table's units", async () => {
    const card = (await editor.get(`${base}/results-card`).expect(200)).body.card as ResultsCardView;
    const svg = await (await fetch(card.svg!.url)).text();
    const runs: RunView[] = (await editor.get(`${base}/bench-runs`).expect(200)).body.runs;
    const plan: TestPlanView = (await editor.get(`${base}/test-plan`).expect(200)).body.plan;
    const table = cardTable({ runs, criteria: plan.criteria });
    expect(table.columns.map((c) => `${c.key} ${c.unit}`)).toEqual(["thrust_to_weight 1", "thrust_per_watt gf/W", "thrust gf"]);
    for (const row of table.rows) {
      const run = runs.find((r) => r.number === row.number)!;
      // The table's cell: formatNumber of the figure in the unit the table opens with (ComparisonTable).
      const cells = table.columns.map((c) => {
        const value = figureIn(run.evaluation.values[c.key], plannedUnit(plan.criteria, c.key));
        return value === null ? "–" : formatNumber(value);
      });
      expect(row.figures).toEqual(cells);
      for (const figure of cells) expect(svg).toContain(`>${figure}</text>`);
    }
    // Own arithmetic for run 1: 11.9 V × 4.1 A = 48.79 W; 290 gf / 48.79 W = 5.944 gf/W, written 5.94.
    expect(table.rows.find((r) => r.number === 1)!.figures[1]).toBe("5.94");
    expect(table.rows.filter((r) => r.best).map((r) => r.label)).toEqual(["Tarn with the 10-inch prop on 3S"]);
  });

  it("refuses a card for an episode with no runs, and queues nothing", async () => {
    const empty = await createEpisode(app.db, channelId, { title: "No runs yet", stage: "test_plan" });
    const answer = await owner.send("post", `/api/channels/${channelId}/episodes/${empty.id}/results-card`).expect(409);
    expect(answer.body.error.message).toBe("The card shows the bench's runs: enter a run first.");
    expect((await owner.get(`/api/channels/${channelId}/episodes/${empty.id}/results-card`).expect(200)).body.card).toBeNull();
  });

  it("draws in the channel's colours once set, and refuses colours whose text would not read, changing nothing", async () => {
    const colours = `/api/channels/${channelId}/results-card-colours`;
    expect((await editor.get(colours).expect(200)).body).toEqual({ colours: { background: "#fbf9f5", ink: "#1f2a2c", accent: "#f2b33d" }, own: true });
    const refused = await owner.send("put", colours, { colours: { background: "#ffffff", ink: "#aaaaaa", accent: "#f2b33d" } }).expect(400);
    expect(refused.body.error.message).toBe("The text colour has 2.3 : 1 contrast with the background; it needs at least 4.5 : 1.");
    await owner.send("put", colours, { colours: { background: "#notahex", ink: "#000000", accent: "#f2b33d" } }).expect(400);
    expect((await editor.get(colours).expect(200)).body.own).toBe(true);

    await editor.send("put", colours, { colours: { background: "#102A3C", ink: "#F4F1EA", accent: "#F2B33D" } }).expect(200);
    await owner.send("post", `${base}/results-card`).expect(202);
    await settledJobs(app.database.pool, RESULTS_CARD_QUEUE, (job) => job.data.channelId === channelId, 2);
    const card = (await editor.get(`${base}/results-card`).expect(200)).body.card as ResultsCardView;
    expect(card.state).toBe("ready");
    const svg = await (await fetch(card.svg!.url)).text();
    expect(svg).toContain('<rect width="1920" height="1080" fill="#102a3c"/>');
    expect(svg).toContain('fill="#f4f1ea"');
    await owner.send("put", colours, { colours: null }).expect(200);
  }, 90_000);
});
