import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "../../dev-services/demo/channel";
import { startResultsCardWorker } from "../../server/bench/bench.jobs";
import { claimCard } from "../../server/bench/results-card.repository";
import { RESULTS_CARD_GIVEN_UP_QUEUE, RESULTS_CARD_QUEUE, type ResultsCardJob, settleGivenUpCard } from "../../server/bench/results-card.service";
import { closeSharedBrowser } from "../../server/jobs/chromium";
import { jobsIn, settledJobs } from "../support/jobs";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { demoCardEpisode } from "./results-card-helpers";

/*
 * A card whose drawing never finished (its server stopped mid-run) is drawn by pg-boss's retry of the
 * job. The test plays the stopped server with pg-boss's own calls: it takes the job (`fetch`), starts
 * the drawing as the worker would (`claimCard`), and lets pg-boss give up on the run as its shutdown
 * does (`fail`). Only then does a worker start, so nothing else takes the job before; until then only
 * the worker that settles jobs pg-boss gave up on runs.
 */
let app: TestApp;
let owner: Visitor;
let subject: Awaited<ReturnType<typeof demoCardEpisode>>;

beforeAll(async () => {
  app = await startTestApp();
  subject = await demoCardEpisode(app);
  owner = await app.signedIn({ email: "owner@example.com", password: DEMO_PASSWORD });
  await app.jobs.boss.work<ResultsCardJob>(RESULTS_CARD_GIVEN_UP_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, ([job]) => settleGivenUpCard({ db: app.db, jobs: app.jobs }, job!.data));
});
afterAll(async () => {
  await app.close();
  await closeSharedBrowser();
});

/** Takes the card's next run (pg-boss's retry once the first was given up) and starts drawing, as the worker would. */
async function startRun(retry: boolean) {
  const { channelId, episodeId } = subject;
  let job: { id: string; data: ResultsCardJob } | undefined;
  await expect.poll(async () => (job = (await app.jobs.boss.fetch<ResultsCardJob>(RESULTS_CARD_QUEUE))[0]), { timeout: 10_000, interval: 50 }).toBeDefined();
  expect(await claimCard(app.db, channelId, episodeId, retry)).not.toBeNull();
  return job!;
}

const giveUp = (jobId: string) => app.jobs.boss.fail(RESULTS_CARD_QUEUE, jobId, { message: "pg-boss shut down while active" });
const givenUpCopies = (n: number) => settledJobs(app.database.pool, RESULTS_CARD_GIVEN_UP_QUEUE, (one) => one.data.episodeId === subject.episodeId, n, 30_000);

describe("a results card whose drawing never finished", () => {
  it("when its server stops during both runs, then the card fails, saying so, instead of drawing for good", async () => {
    const { base } = subject;
    await owner.send("post", `${base}/results-card`).expect(202);
    await giveUp((await startRun(false)).id);
    await giveUp((await startRun(true)).id);
    const [copy] = await givenUpCopies(1);
    expect(copy).toMatchObject({ state: "completed", output: { outcome: "failed" } });
    expect((await owner.get(`${base}/results-card`).expect(200)).body.card).toMatchObject({
      state: "failed",
      failure: "The server stopped twice before it finished drawing the card; ask for it again, and tell whoever runs Kerf if it happens again.",
    });
  });

  it("when someone asked for the card again meanwhile, then the given-up run leaves it to the new job", async () => {
    const { base } = subject;
    await owner.send("post", `${base}/results-card`).expect(202);
    await giveUp((await startRun(false)).id);
    const second = await startRun(true);
    await owner.send("post", `${base}/results-card`).expect(202);
    await giveUp(second.id);
    const copies = await givenUpCopies(2);
    expect(copies[1]).toMatchObject({ state: "completed", output: { outcome: "skipped", reason: "another job has the card" } });
    expect((await owner.get(`${base}/results-card`).expect(200)).body.card).toMatchObject({ state: "queued", failure: null });
    const waiting = (await jobsIn(app.database.pool, RESULTS_CARD_QUEUE)).filter((job) => job.state === "created");
    await app.jobs.boss.cancel(RESULTS_CARD_QUEUE, waiting.map((job) => job.id));
  });

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
