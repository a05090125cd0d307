import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { q } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

/*
 * Everywhere Kerf numbers things (bench runs, build iterations, a plan's criteria, a deal's items, an
 * episode's shots), many people entering at once get distinct numbers and no 5xx. Each round sends
 * AT_ONCE requests together on fresh rows; ROUNDS rounds, so a race that loses one time in a few
 * shows up. Numbers are never reused: a deleted run's number stays taken.
 */
const AT_ONCE = 12;
const ROUNDS = 5;

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let owner: Visitor;
beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Numbering Bench");
  owner = await app.signedIn(world.owner);
});
afterAll(() => app.close());

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;
const column = async (sql: string, id: string) => (await app.database.pool.query<{ n: number }>(sql, [id])).rows.map((row) => row.n);

interface Numbered {
  /** A fresh parent (episode or deal) and the path that adds one numbered row to it. */
  parent: () => Promise<{ id: string; path: string }>;
  body: (i: number) => object;
  /** The numbers the parent's rows hold, as stored. */
  numbers: (parentId: string) => Promise<number[]>;
}

const episodeIn = async () => (await createEpisode(app.db, world.channel.id, { stage: "build" })).id;

const numbered: Record<string, Numbered> = {
  "bench runs": {
    parent: async () => episodeIn().then((id) => ({ id, path: `/episodes/${id}/bench-runs` })),
    body: (i) => ({ label: `run ${i}`, parts: [], supply: null, measurements: { thrust: q(700 + i, "gf") }, notes: "" }),
    numbers: (id) => column("select number as n from bench_runs where episode_id = $1", id),
  },
  "build iterations": {
    parent: async () => episodeIn().then((id) => ({ id, path: `/episodes/${id}/build-log` })),
    body: (i) => ({ change: `change ${i}`, allUpMass: null, outcome: "pending", chosenRunId: null, notes: "" }),
    numbers: (id) => column("select number as n from build_iterations where episode_id = $1", id),
  },
  "test plan criteria": {
    parent: async () => episodeIn().then((id) => ({ id, path: `/episodes/${id}/test-plan/criteria` })),
    body: (i) => ({ metric: "thrust", comparator: "gte", threshold: q(600 + i, "gf"), required: true }),
    numbers: (id) => column("select position as n from test_criteria where episode_id = $1", id),
  },
  "a deal's items": {
    parent: async () => {
      const sponsor = await createSponsor(app.db, world.channel.id);
      const { deal } = await createDeal(app.db, world.channel.id, await episodeIn(), { sponsorId: sponsor.id, items: [] });
      return { id: deal.id, path: `/deals/${deal.id}/deliverables` };
    },
    body: (i) => ({ kind: "other", title: `item ${i}`, anchor: "fixed", fixedDate: "2030-05-01" }),
    numbers: (id) => column("select position as n from deliverables where deal_id = $1", id),
  },
  "an episode's shots": {
    parent: async () => episodeIn().then((id) => ({ id, path: `/episodes/${id}/shots` })),
    body: (i) => ({ description: `shot ${i}`, kind: "insert" }),
    numbers: (id) => column("select position as n from shots where episode_id = $1", id),
  },
};

describe("numbers handed out at once", () => {
  it.each(Object.keys(numbered))("when %s are entered twelve at once, round after round, then every answer is 201 and every number distinct", async (what) => {
    const kind = numbered[what]!;
    for (let round = 1; round <= ROUNDS; round++) {
      const parent = await kind.parent();
      const answers = await Promise.all(Array.from({ length: AT_ONCE }, (_, i) => owner.send("post", api(parent.path), kind.body(i))));
      const seen = `round ${round}: ${answers.map((a) => `${a.status} ${a.status >= 300 ? JSON.stringify(a.body).slice(0, 120) : ""}`).join("; ")}`;
      expect(answers.map((a) => a.status), seen).toEqual(Array(AT_ONCE).fill(201));
      const numbers = await kind.numbers(parent.id);
      expect(new Set(numbers).size, `round ${round}: ${numbers.join(", ")}`).toBe(AT_ONCE);
    }
  });

  it("when the last run is deleted, then the next run does not take its number", async () => {
    const episodeId = await episodeIn();
    const base = api(`/episodes/${episodeId}/bench-runs`);
    const body = numbered["bench runs"]!.body(0);
    await owner.send("post", base, body).expect(201);
    const second = await owner.send("post", base, body).expect(201);
    expect(second.body.run.number).toBe(2);
    await owner.send("delete", `${base}/${second.body.run.id}`).expect(204);
    expect((await owner.send("post", base, body).expect(201)).body.run.number).toBe(3);
  });
});
