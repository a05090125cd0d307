import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createIteration, createRun } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { createClip } from "../factories/rushes";
import { startTestApp, type TestApp } from "../support/test-app";
import { rushesWorld } from "./rushes-helpers";

let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;
beforeAll(async () => {
  app = await startTestApp();
  world = await rushesWorld(app);
});
afterAll(() => app.close());

const markOn = async (clipId: string) =>
  (await world.as.crew.send("post", `${world.base}/clips/${clipId}/marks`, { in: "01:00:01;00", out: "01:00:02;00", note: "the prop lets go" }).expect(201)).body.mark as { id: string };

describe("footage that shows a bench run or build iteration", () => {
  it("when a clip and a mark are linked, then the episode's footage links list them under the run and the iteration, with the poster signed", async () => {
    const run = await createRun(app.db, world.channel.id, world.episode.id, world.owner.id, { label: "Static thrust" });
    const iteration = await createIteration(app.db, world.channel.id, world.episode.id, world.owner.id);
    const clip = await createClip(app.db, world.channel.id, world.episode.id, { fileName: "C0101.MP4", posterKey: `${world.channel.id}/${world.episode.id}/poster-test.jpg` });
    await world.as.editor.send("patch", `${world.base}/clips/${clip.id}`, { benchRunId: run.id }).expect(200);
    const mark = await markOn(clip.id);
    const linked = await world.as.crew.send("patch", `${world.base}/clips/${clip.id}/marks/${mark.id}`, { buildIterationId: iteration.id }).expect(200);
    expect(linked.body.mark).toMatchObject({ buildIterationId: iteration.id, benchRunId: null, note: "the prop lets go" });

    const links = await world.as.crew.get(`${world.base}/episodes/${world.episode.id}/footage-links`).expect(200);
    const runEntry = links.body.runs.find((r: { id: string }) => r.id === run.id);
    expect(runEntry).toMatchObject({ number: expect.any(Number), title: "Static thrust" });
    expect(runEntry.footage).toEqual([expect.objectContaining({ clipId: clip.id, fileName: "C0101.MP4", mark: null })]);
    expect(runEntry.footage[0].posterUrl).toMatch(/X-Amz-Signature=/);
    const iterationEntry = links.body.iterations.find((i: { id: string }) => i.id === iteration.id);
    expect(iterationEntry.footage).toEqual([expect.objectContaining({ clipId: clip.id, mark: { id: mark.id, in: "01:00:01;00", out: "01:00:02;00", note: "the prop lets go" } })]);
    expect(links.body.clips.map((c: { id: string }) => c.id)).toContain(clip.id);

    // Unlinking the mark takes it off the iteration.
    await world.as.crew.send("patch", `${world.base}/clips/${clip.id}/marks/${mark.id}`, { buildIterationId: null }).expect(200);
    const after = await world.as.crew.get(`${world.base}/episodes/${world.episode.id}/footage-links`).expect(200);
    expect(after.body.iterations.find((i: { id: string }) => i.id === iteration.id).footage).toEqual([]);
  });

  it("when a mark names a run or iteration of another episode or channel, or none at all, then it answers 400 on that field and the mark keeps its link", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const mark = await markOn(clip.id);
    const url = `${world.base}/clips/${clip.id}/marks/${mark.id}`;
    const ownRun = await createRun(app.db, world.channel.id, world.episode.id, world.owner.id);
    await world.as.editor.send("patch", url, { benchRunId: ownRun.id }).expect(200);

    const otherEpisode = await createEpisode(app.db, world.channel.id, { title: "Another build" });
    const elsewhere = await createCrewedChannel(app.db, "Elsewhere Links");
    const elsewhereEpisode = await createEpisode(app.db, elsewhere.channel.id, { title: "Theirs" });
    const refused = [
      { benchRunId: (await createRun(app.db, world.channel.id, otherEpisode.id, world.owner.id)).id },
      { benchRunId: (await createRun(app.db, elsewhere.channel.id, elsewhereEpisode.id, elsewhere.owner.id)).id },
      { benchRunId: "00000000-0000-4000-8000-000000000001" },
      { buildIterationId: (await createIteration(app.db, world.channel.id, otherEpisode.id, world.owner.id)).id },
      { buildIterationId: (await createIteration(app.db, elsewhere.channel.id, elsewhereEpisode.id, elsewhere.owner.id)).id },
    ];
    for (const patch of refused) {
      const response = await world.as.editor.send("patch", url, patch);
      const seen = `${JSON.stringify(patch)}: ${response.status} ${JSON.stringify(response.body)}`;
      expect(response.status, seen).toBe(400);
      expect(Object.keys(response.body.error.fields), seen).toEqual(Object.keys(patch));
    }
    // A new mark naming another channel's run is refused the same way, and nothing is made.
    const made = await world.as.editor.send("post", `${world.base}/clips/${clip.id}/marks`, { in: "01:00:03;00", out: "01:00:04;00", ...refused[1] });
    expect(made.status).toBe(400);
    const detail = await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(200);
    expect(detail.body.clip.marks).toEqual([expect.objectContaining({ id: mark.id, benchRunId: ownRun.id })]);
  });

  it("when another channel asks for this episode's footage links, or for a mark of this channel, then it is 404", async () => {
    const elsewhere = await createCrewedChannel(app.db, "Elsewhere Reader");
    const outsider = await app.signedIn(elsewhere.owner);
    await outsider.get(`${world.base}/episodes/${world.episode.id}/footage-links`).expect(404);
    const theirs = `/api/channels/${elsewhere.channel.id}`;
    await outsider.get(`${theirs}/episodes/${world.episode.id}/footage-links`).expect(404);
  });

  it("when a linked run or iteration is deleted, then the mark stays and its link is cleared", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const mark = await markOn(clip.id);
    const run = await createRun(app.db, world.channel.id, world.episode.id, world.owner.id);
    const iteration = await createIteration(app.db, world.channel.id, world.episode.id, world.owner.id);
    await world.as.editor.send("patch", `${world.base}/clips/${clip.id}/marks/${mark.id}`, { benchRunId: run.id, buildIterationId: iteration.id }).expect(200);
    await world.as.owner.send("delete", `${world.base}/episodes/${world.episode.id}/bench-runs/${run.id}`).expect(204);
    await world.as.owner.send("delete", `${world.base}/episodes/${world.episode.id}/build-log/${iteration.id}`).expect(204);
    const detail = await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(200);
    expect(detail.body.clip.marks).toEqual([expect.objectContaining({ id: mark.id, benchRunId: null, buildIterationId: null })]);
  });
});
