import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../../server/app";
import { channelChildren } from "../../server/db/channel-scope";
import { childParamsOf } from "../../server/http/guards";
import { channelAccess, type RouteSpec } from "../../server/http/route-table";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { fillPath } from "../support/access-world";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const channelRoutes = () => apiRoutes(app.deps).filter((spec) => spec.access.kind === "channel");
const named = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;

describe("the ids a channel route names", () => {
  it("when the routes are mounted, then every :param is a row the guard checks or a value the route declares", () => {
    for (const spec of channelRoutes()) expect(() => childParamsOf(spec), named(spec)).not.toThrow();
    const unknown: RouteSpec = { method: "get", path: "/api/channels/:channelId/widgets/:widgetId", access: channelAccess("episodes", "R"), handler: () => undefined };
    expect(() => childParamsOf(unknown)).toThrow(/:widgetId is neither a row of the channel/);
  });

  it("when a route names a row the channel doesn't have, then every route answers 404 with that row's name before its handler runs", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const checked = channelRoutes().filter((spec) => childParamsOf(spec).length > 0);
    expect(checked.length).toBeGreaterThan(60);
    for (const spec of checked) {
      const params = Object.fromEntries(childParamsOf(spec).map((param) => [param, randomUUID()]));
      const path = fillPath(spec.path, { channelId: channel.id, partNumber: "1", stage: "build", day: "7", ...params });
      const body = spec.body === undefined || spec.body === "json" ? {} : undefined;
      const response = spec.method === "get" ? await agent.get(path) : await agent.send(spec.method, path, body);
      const first = channelChildren[childParamsOf(spec)[0]!].what;
      expect(response.status, `${named(spec)}: ${JSON.stringify(response.body)}`).toBe(404);
      expect(response.body.error.message, named(spec)).toBe(`${first} not found.`);
    }
  });

  it("when a row is another channel's, then checking it costs no query more than turning away a stranger", async () => {
    const mine = await createCrewedChannel(app.db);
    const theirs = await createCrewedChannel(app.db);
    const foreign = await createEpisode(app.db, theirs.channel.id);
    const agent = await app.signedIn(mine.owner);
    await agent.get("/api/auth/me").expect(200);
    const queries = await countQueries(async () => {
      await agent.get(`/api/channels/${mine.channel.id}/episodes/${foreign.id}/test-plan`).expect(404);
    });
    const strangerQueries = await countQueries(async () => {
      await agent.get(`/api/channels/${theirs.channel.id}/episodes/${foreign.id}/test-plan`).expect(404);
    });
    expect(queries).toBe(strangerQueries);
  });
});

/** The queries the app's pool runs while `work` runs (the session's included, so compare like with like). */
async function countQueries(work: () => Promise<void>): Promise<number> {
  const pool = app.database.pool;
  const original = pool.query;
  let count = 0;
  pool.query = function (this: typeof pool, ...args: unknown[]) {
    count++;
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
  try {
    await work();
  } finally {
    pool.query = original;
  }
  return count;
}
