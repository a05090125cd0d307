import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { builtClient } from "../support/built-client";
import { startTestApp, type TestApp } from "../support/test-app";

/*
 * An episode's address without a part (the board's links) is sent as the page of the part its stage
 * opens on, so the part's code and answers come with it. Only a member of the episode's channel is
 * told: anyone else gets the plain episode page, which says nothing about the episode.
 */
let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ clientDist: builtClient() });
});
afterAll(() => app.close());

const PART_CODE = "TestPlanSheet-4d5e6f.js";
const PART_ANSWER = (channelId: string, episodeId: string) => `</api/channels/${channelId}/episodes/${episodeId}/test-plan>`;

describe("the episode page at an address without a part", () => {
  it("when a member opens an episode in Test plan, then the page asks for the test plan's code and answers", async () => {
    const { channel, editor } = await createCrewedChannel(app.db);
    const episode = await createEpisode(app.db, channel.id, { stage: "test_plan" });
    const page = await (await app.signedIn(editor)).get(`/c/${channel.id}/episodes/${episode.id}`).expect(200);
    expect(page.text).toContain(PART_CODE);
    expect(page.headers.link).toContain(PART_ANSWER(channel.id, episode.id));
  });

  it("when someone outside the channel, a visitor without a session or a member asking for another channel's episode opens it, then the page is the plain one", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const episode = await createEpisode(app.db, channel.id, { stage: "test_plan" });
    const outsider = await createUser(app.db, { name: "Oskar Outside" });
    const elsewhere = await createChannel(app.db, outsider);
    const asks = [
      (await app.signedIn(outsider)).get(`/c/${channel.id}/episodes/${episode.id}`),
      (await app.visitor()).get(`/c/${channel.id}/episodes/${episode.id}`),
      // A channel the outsider is in, with an episode id from another channel.
      (await app.signedIn(outsider)).get(`/c/${elsewhere.id}/episodes/${episode.id}`),
      (await app.signedIn(owner)).get(`/c/${channel.id}/episodes/not-an-id`),
    ];
    for (const ask of asks) {
      const page = await ask.expect(200);
      expect(page.text).toContain("episode-page-1a2b3c.js");
      expect(page.text).not.toContain(PART_CODE);
      expect(page.headers.link ?? "").not.toContain("/test-plan>");
    }
  });

  it("when the address names a part, then that part's page is sent whatever the stage", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const episode = await createEpisode(app.db, channel.id, { stage: "edit" });
    const page = await (await app.signedIn(owner)).get(`/c/${channel.id}/episodes/${episode.id}/test-plan`).expect(200);
    expect(page.text).toContain(PART_CODE);
  });
});
