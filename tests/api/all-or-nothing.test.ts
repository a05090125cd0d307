import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { apiRoutes } from "../../server/app";
import type { RouteSpec } from "../../server/http/route-table";
import { createDeal, createSponsor } from "../factories/sponsors";
import { createEpisode } from "../factories/episodes";
import { allRecipes, fillPath, makeAccessWorld } from "../support/access-world";
import { MAIL_QUEUE } from "../../server/jobs/queue";
import { waitForQueueToSettle } from "../support/jobs";
import { changedTables, refuseWritesTo, tableFingerprints } from "../support/rows-snapshot";
import { startTestApp, type TestApp } from "../support/test-app";
import type { AccessWorld, Recipe } from "./access/matrix";

/*
 * Every write is all or nothing. Each write route is called once as the owner, to learn which tables
 * it changes; then, for each of those tables in turn, it is called again on fresh rows while writes to
 * that one table fail (a statement trigger that raises, standing in for a full disk or a broken row).
 * Whatever the route wrote before reaching that table must be gone: the request fails and no row of
 * any table has changed. A route that commits a first write and then fails on a later one (the episode
 * edit whose sponsor dates follow the publish date, a sign-up whose channel can't be made) fails here.
 */
/*
 * The answer a write route gives is derived from what it wrote (a deal's read analysis, a run's
 * verdict); a derivation that throws must undo the write too. These switches make the next derivation
 * throw, standing in for any bug or unforeseen row.
 */
const derivationFails = vi.hoisted(() => ({ read: false, run: false }));
vi.mock("../../shared/sponsors/read", async (original) => {
  const actual = await original<typeof import("../../shared/sponsors/read")>();
  return { ...actual, analyseRead: (...args: Parameters<typeof actual.analyseRead>) => (derivationFails.read ? failed("analyseRead") : actual.analyseRead(...args)) };
});
vi.mock("../../shared/bench/runs", async (original) => {
  const actual = await original<typeof import("../../shared/bench/runs")>();
  return { ...actual, evaluateRun: (...args: Parameters<typeof actual.evaluateRun>) => (derivationFails.run ? failed("evaluateRun") : actual.evaluateRun(...args)) };
});
function failed(what: string): never {
  throw new Error(`test fault: ${what} threw`);
}
afterEach(() => {
  derivationFails.read = false;
  derivationFails.run = false;
});

const writeMethods = new Set(["post", "put", "patch", "delete"]);
const routeName = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;

let app: TestApp;
let world: AccessWorld;
let recipes: Record<string, Recipe>;
beforeAll(async () => {
  app = await startTestApp({ signInLimits: { perAccount: 10_000, perAddress: 100_000, windowMs: 60_000 } });
  world = await makeAccessWorld(app);
  recipes = allRecipes(app, world);
});
afterAll(() => app.close());

async function call(spec: RouteSpec, recipe: Recipe) {
  const agent = await app.signedIn(world.people.owner);
  const prepared = (await recipe.prepare?.({ caller: "owner", person: world.people.owner })) ?? {};
  const path = fillPath(spec.path, { channelId: world.channel.id, ...prepared.params });
  // Mail queued by an earlier call writes its rows when it is sent (an invitation's link): let it finish first.
  await waitForQueueToSettle(app.database.pool);
  const before = await tableFingerprints(app);
  return {
    before,
    send: () => agent.send(spec.method as "post", path, spec.method === "delete" ? undefined : prepared.body),
  };
}

/**
 * The request's own writes, read before any mail it queued is sent: a mail job writes its own rows (an
 * address change's link) when it runs, maybe at once, and those are no part of the request's work.
 */
async function withMailHeld<T>(work: () => Promise<T>): Promise<T> {
  await app.jobs.boss.offWork(MAIL_QUEUE);
  try {
    return await work();
  } finally {
    await app.startMailWorker();
  }
}

describe("writes are all or nothing", () => {
  const writes = () => apiRoutes(app.deps).filter((spec) => writeMethods.has(spec.method) && spec.path !== "/api/auth/sign-out");

  it("when any table a write route changes refuses the write, then the route fails and no table has changed", async () => {
    const halfDone: string[] = [];
    let faults = 0;
    for (const spec of writes()) {
      const recipe = recipes[routeName(spec)];
      expect(recipe, `no access-matrix recipe for ${routeName(spec)}`).toBeDefined();
      const baseline = await call(spec, recipe!);
      const tables = await withMailHeld(async () => {
        const answer = await baseline.send();
        expect(answer.status, `${routeName(spec)} as owner: ${JSON.stringify(answer.body).slice(0, 300)}`).toBe(recipe!.ok);
        return changedTables(baseline.before, await tableFingerprints(app));
      });
      for (const table of tables) {
        const attempt = await call(spec, recipe!);
        const { refused, changed } = await withMailHeld(async () => {
          const fault = await refuseWritesTo(app, table);
          const refused = await Promise.resolve(attempt.send()).finally(fault.restore);
          return { refused, changed: changedTables(attempt.before, await tableFingerprints(app)) };
        });
        faults++;
        if (refused.status < 400 || changed.length > 0) halfDone.push(`${routeName(spec)} with ${table} refusing writes: ${refused.status}, changed ${changed.join(", ") || "nothing"}`);
      }
    }
    console.log(`all-or-nothing: ${faults} writes failed on purpose across ${writes().length} write routes`);
    expect(halfDone).toEqual([]);
  }, 600_000);

  it("when an episode's publish date moves and its sponsor items' history refuses the entries, then the date stays as it was", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { title: "Dated episode", targetPublishDate: "2031-05-20" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2031-05-20" });
    const owner = await app.signedIn(world.people.owner);
    const before = await tableFingerprints(app);
    const fault = await refuseWritesTo(app, "deliverable_events");
    const response = await Promise.resolve(owner.send("patch", `/api/channels/${world.channel.id}/episodes/${episode.id}`, { version: episode.version, targetPublishDate: "2031-06-03" })).finally(fault.restore);
    expect(response.status).toBe(500);
    expect(changedTables(before, await tableFingerprints(app))).toEqual([]);
  });

  /** Sends a recipe's call with one derivation failing; the route answers 500 and no table has changed. */
  async function withFailingDerivation(route: string, which: keyof typeof derivationFails) {
    const [method, template] = route.split(" ") as [string, string];
    const recipe = recipes[route]!;
    const attempt = await call({ method: method.toLowerCase(), path: template } as RouteSpec, recipe);
    derivationFails[which] = true;
    const response = await attempt.send();
    derivationFails[which] = false;
    expect(response.status, route).toBe(500);
    expect(changedTables(attempt.before, await tableFingerprints(app)), route).toEqual([]);
  }

  const C = "/api/channels/:channelId";
  it.each([`POST ${C}/deals`, `PATCH ${C}/deals/:dealId`, `PUT ${C}/deals/:dealId/money`, `PUT ${C}/deals/:dealId/cut`, `POST ${C}/deals/:dealId/deliverables`, `PATCH ${C}/deliverables/:deliverableId`])(
    "when %s writes and the deal's answer then fails to derive, then nothing was written",
    (route) => withFailingDerivation(route, "read"),
  );

  it.each([`POST ${C}/episodes/:episodeId/bench-runs`, `PUT ${C}/episodes/:episodeId/bench-runs/:runId`])(
    "when %s writes and the run's verdict then fails to derive, then nothing was written",
    (route) => withFailingDerivation(route, "run"),
  );
});
