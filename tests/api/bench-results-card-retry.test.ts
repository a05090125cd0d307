import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "../../dev-services/demo/channel";
import { startResultsCardWorker } from "../../server/bench/bench.jobs";
import { claimCard } from "../../server/bench/results-card.repository";
import { RESULTS_CARD_QUEUE, type ResultsCardJob } from "../../server/bench/results-card.service";
import { closeSharedBrowser } from "../../server/jobs/chromium";
import { settledJobs } from "../support/jobs";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { demoCardEpisode } from "./results-card-helpers";

/*
 * A card whose drawing never finished (its server stopped mid-run) is drawn by pg-boss's retry of the
 * job. The test plays the stopped server with pg-boss's own calls: it takes the job (`fetch`), starts
 * the drawing as the worker would (`claimCard`), and lets pg-boss give up on the run as its shutdown
 * does (`fail`). Only then does a worker start, so nothing else takes the job before.
 */
let app: TestApp;
let owner: Visitor;
let subject: Awaited<ReturnType<typeof demoCardEpisode>>;

beforeAll(async () => {
  app = await startTestApp();
  subject = await demoCardEpisode(app);
  owner = await app.signedIn({ email: "owner@example.com", password: DEMO_PASSWORD });
});
afterAll(async () => {
  await app.close();
  await closeSharedBrowser();
});

describe("a results card whose drawing never finished", () => {
  it("when pg-boss gives up on the run, then its retry draws the card the first run left drawing", async () => {
    const { channelId, episodeId, base } = subject;
    await owner.send("post", `${base}/results-card`).expect(202);
    const [job] = await app.jobs.boss.fetch<ResultsCardJob>(RESULTS_CARD_QUEUE);
    expect(job?.data).toMatchObject({ channelId, episodeId });
    expect(await claimCard(app.db, channelId, episodeId)).not.toBeNull();
    await app.jobs.boss.fail(RESULTS_CARD_QUEUE, job!.id, { message: "pg-boss shut down while active" });
    expect((await owner.get(`${base}/results-card`).expect(200)).body.card).toMatchObject({ state: "drawing", png: null });

    await startResultsCardWorker(app.jobs.boss, { db: app.db, storage: app.deps.storage, jobs: app.jobs, chromiumPath: app.deps.env.CHROMIUM_PATH }, { pollSeconds: 0.5 });
    const [settled] = await settledJobs(app.database.pool, RESULTS_CARD_QUEUE, (one) => one.id === job!.id, 1, 60_000);
    expect(settled).toMatchObject({ state: "completed", output: { outcome: "made" } });
    const card = (await owner.get(`${base}/results-card`).expect(200)).body.card;
    expect(card).toMatchObject({ state: "ready", failure: null });
    expect(card.png?.fileName).toBe("results-card-case-fans-versus-one-big-rotor.png");
  });
});
