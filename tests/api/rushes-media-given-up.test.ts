import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { CLIP_MEDIA_GIVEN_UP_QUEUE, CLIP_MEDIA_QUEUE, type ClipMediaJob } from "../../server/rushes/media.service";
import { claimClip, failClip } from "../../server/rushes/media.repository";
import { startClipMediaWorkers } from "../../server/rushes/rushes.jobs";
import { jobsIn, settledJobs } from "../support/jobs";
import { startTestApp, type TestApp } from "../support/test-app";
import { patternBytes, rushesWorld, uploadFile } from "./rushes-helpers";

/*
 * A clip's media run that never finishes (its process restarted or died) must not leave the clip
 * "making" for good. These tests play the part of that process with pg-boss's own calls: they take
 * the clip's job (`fetch`), start the run as the worker would (`claimClip`), and then let pg-boss give
 * up on it as its shutdown does for a job still running (`fail`, which is also what a run past its
 * time comes to). Only the worker that settles given-up jobs runs here, so nothing else takes the jobs.
 */
let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;

beforeAll(async () => {
  app = await startTestApp();
  world = await rushesWorld(app);
  await startClipMediaWorkers(app.jobs.boss, { db: app.db, storage: app.deps.storage, jobs: app.jobs }, { pollSeconds: 0.5, workers: 0 });
});
afterAll(() => app.close());
/** A job a test queued and left waiting is cancelled, so the next test takes only its own clip's. */
afterEach(async () => {
  const waiting = (await jobsIn(app.database.pool, CLIP_MEDIA_QUEUE)).filter((job) => job.state === "created");
  if (waiting.length > 0) await app.jobs.boss.cancel(CLIP_MEDIA_QUEUE, waiting.map((job) => job.id));
});

async function uploadClip(name: string): Promise<string> {
  const done = await uploadFile(world.as.editor, world.base, world.episode.id, name, patternBytes(4_000));
  expect(done.status).toBe(201);
  return done.body.clip.id as string;
}

const mediaOf = async (clipId: string) => (await world.as.editor.get(`${world.base}/clips/${clipId}`).expect(200)).body.clip.media;
const mediaJobsOf = async (clipId: string) => (await jobsIn(app.database.pool, CLIP_MEDIA_QUEUE)).filter((job) => job.data.clipId === clipId);

/** Takes the clip's waiting job and starts its run, as a worker would. */
async function startRun(clipId: string) {
  const [job] = await app.jobs.boss.fetch<ClipMediaJob>(CLIP_MEDIA_QUEUE);
  expect(job?.data.clipId).toBe(clipId);
  expect(await claimClip(app.db, world.channel.id, clipId)).not.toBeNull();
  return job!;
}

/** pg-boss gives up on the run: what its shutdown records for a job still running. */
const giveUp = (jobId: string) => app.jobs.boss.fail(CLIP_MEDIA_QUEUE, jobId, { message: "pg-boss shut down while active" });

/** Waits until the n-th given-up copy of the clip's job is settled, and answers what it did. */
async function settledGivenUp(clipId: string, nth: number) {
  const jobs = await settledJobs(app.database.pool, CLIP_MEDIA_GIVEN_UP_QUEUE, (job) => job.data.clipId === clipId, nth);
  return jobs[nth - 1]!;
}

describe("a clip whose media run never finished", () => {
  it("when pg-boss gives up on the run, then the clip waits again and a new job is queued for it", async () => {
    const clipId = await uploadClip("C101.mov");
    const run = await startRun(clipId);
    expect(await mediaOf(clipId)).toMatchObject({ state: "making", attempts: 1 });

    await giveUp(run.id);
    const settled = await settledGivenUp(clipId, 1);
    expect(settled).toMatchObject({ state: "completed", output: { outcome: "queued again" } });
    expect(await mediaOf(clipId)).toMatchObject({ state: "waiting", attempts: 1, failure: null });
    const jobs = await mediaJobsOf(clipId);
    expect(jobs.map((job) => job.state)).toEqual(["failed", "created"]);
  });

  it("when its third run never finishes either, then the clip fails, says so, and can be retried by hand", async () => {
    const clipId = await uploadClip("C102.mov");
    for (let n = 1; n <= 3; n++) {
      await giveUp((await startRun(clipId)).id);
      await settledGivenUp(clipId, n);
    }
    const last = await settledGivenUp(clipId, 3);
    expect(last.output).toMatchObject({ outcome: "failed" });
    const media = await mediaOf(clipId);
    expect(media).toMatchObject({ state: "failed", attempts: 3 });
    expect(media.failure).toBe("The server stopped before it finished this clip's poster and proxy, after several tries; retry, and tell whoever runs Kerf if it happens again.");
    expect((await mediaJobsOf(clipId)).map((job) => job.state)).toEqual(["failed", "failed", "failed"]);

    await world.as.crew.send("post", `${world.base}/clips/${clipId}/media/retry`).expect(202);
    expect((await mediaJobsOf(clipId)).map((job) => job.state)).toEqual(["failed", "failed", "failed", "created"]);
  });

  it("when the run itself failed and said why, then the given-up job leaves the clip and its reason as they are", async () => {
    const clipId = await uploadClip("C103.mov");
    const run = await startRun(clipId);
    await failClip(app.db, world.channel.id, clipId, "The file holds neither picture nor sound the server can read.");
    await giveUp(run.id);
    expect((await settledGivenUp(clipId, 1)).output).toMatchObject({ outcome: "skipped" });
    expect(await mediaOf(clipId)).toMatchObject({ state: "failed", failure: "The file holds neither picture nor sound the server can read." });
    expect((await mediaJobsOf(clipId)).map((job) => job.state)).toEqual(["failed"]);
  });
});
