import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

/*
 * Finding: authenticated JSON went out without Cache-Control, so a shared cache or the browser's
 * back-forward store could keep one person's channel data. Every API answer is `no-store` unless its
 * route says otherwise: the board keeps its revision ETag (private, revalidated every time).
 */
let app: TestApp;
let owner: Visitor;
let base: string;
let episodeId: string;
beforeAll(async () => {
  app = await startTestApp();
  const crewed = await createCrewedChannel(app.db, "Cache Channel");
  episodeId = (await createEpisode(app.db, crewed.channel.id, { title: "Cached?" })).id;
  owner = await app.signedIn(crewed.owner);
  base = `/api/channels/${crewed.channel.id}`;
});
afterAll(() => app.close());

describe("caching of API answers", () => {
  it("when a signed-in person reads channel data, who they are or a missing route, then each answer is no-store", async () => {
    for (const path of [`${base}/episodes/${episodeId}`, "/api/auth/me", `${base}/desk`, `${base}/nothing-here`, "/api/health"]) {
      const response = await owner.get(path);
      expect(response.headers["cache-control"], path).toBe("no-store");
    }
    const write = await owner.send("post", `${base}/episodes/${episodeId}/comments`, { body: "Cache me not" }).expect(201);
    expect(write.headers["cache-control"]).toBe("no-store");
  });

  it("when the board is read, then it keeps its own private revalidation and answers 304 to its ETag", async () => {
    const first = await owner.get(`${base}/episodes`).expect(200);
    expect(first.headers["cache-control"]).toBe("private, no-cache");
    const etag = first.headers.etag as string;
    expect(etag).toBeTruthy();
    await owner.get(`${base}/episodes`).set("If-None-Match", etag).expect(304);
  });
});
