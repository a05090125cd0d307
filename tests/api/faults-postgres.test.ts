import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { startPrivateCluster, type PrivateCluster } from "../support/private-cluster";
import { startTestApp, type TestApp } from "../support/test-app";

let cluster: PrivateCluster;
let app: TestApp;
beforeAll(async () => {
  cluster = await startPrivateCluster();
  app = await startTestApp({ database: cluster.database });
}, 60_000);
afterAll(async () => {
  await app.close();
  await cluster.remove();
});

describe("PostgreSQL restarted under a running server", () => {
  it("when the database goes away, then requests fail cleanly with 503, and succeed again once it is back, without restarting Kerf", async () => {
    const { channel, owner } = await createCrewedChannel(app.db, "Outage Channel");
    await createEpisode(app.db, channel.id, { title: "Survives the outage" });
    const agent = await app.signedIn(owner);
    const episodesPath = `/api/channels/${channel.id}/episodes`;
    await agent.get(episodesPath).expect(200);

    cluster.stop();
    const during = await agent.get(episodesPath);
    expect(during.status).toBe(503);
    expect(during.body.error).toMatchObject({ code: "unavailable", message: expect.stringMatching(/database/i) });
    const health = await agent.get("/api/health");
    expect(health.status).toBe(503);
    expect(health.body.database).toBe("down");

    cluster.start();
    // The pool drops its dead connections on first use; the same session is still valid.
    let after = await agent.get(episodesPath);
    await expect.poll(async () => (after = await agent.get(episodesPath)).status, { timeout: 5_000, interval: 250 }).toBe(200);
    expect(after.body.episodes.map((e: { title: string }) => e.title)).toEqual(["Survives the outage"]);
    await agent.get("/api/health").expect(200);
  }, 60_000);
});
