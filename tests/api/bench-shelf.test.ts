import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createCriterion, createIteration, createPart, createRun, q, saveTestPlan } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const motor = {
  name: "Tarn 2216, 880 kV",
  kind: "motor",
  mass: q(2.4, "oz"),
  ratedVoltage: q(16.8, "V"),
  ratedCurrent: q(25000, "mA"),
  price: { amount: "24.90", currency: "EUR" },
  supplier: "Invented Hobby Supplies",
  notes: "Came with a prop adapter.",
};

async function setting() {
  const crewed = await createCrewedChannel(app.db, "Shelf Channel");
  const crew = await app.signedIn(crewed.crew);
  const base = `/api/channels/${crewed.channel.id}/bench/parts`;
  return { ...crewed, crew, base };
}

describe("the bench shelf", () => {
  it("when crew add a part, then it is kept as entered, with its ratings and price, and listed by name", async () => {
    const { crew, base } = await setting();
    const made = await crew.send("post", base, motor).expect(201);
    expect(made.body.part).toMatchObject({ ...motor, id: expect.any(String), runCount: 0 });
    await crew.send("post", base, { ...motor, name: "Brisk 120 mm fan", kind: "fan" }).expect(201);
    const list = await crew.get(base).expect(200);
    expect(list.body.parts.map((p: { name: string }) => p.name)).toEqual(["Brisk 120 mm fan", "Tarn 2216, 880 kV"]);
  });

  it("when a field is wrong, then each says what it needs and nothing is saved", async () => {
    const { crew, base } = await setting();
    const response = await crew.send("post", base, { ...motor, name: "", mass: q(68, "N"), ratedCurrent: q(25, "V"), price: { amount: "cheap", currency: "EUR" } }).expect(400);
    expect(response.body.error.fields).toEqual({
      name: "Name the part.",
      mass: "mass must be in g, kg, oz, lb",
      ratedCurrent: "rated current must be in A, mA",
      "price.amount": "Write the price as a number such as 12.50.",
    });
    expect((await crew.get(base).expect(200)).body.parts).toEqual([]);
  });

  it("when a part is changed, then the runs it was in are judged with its new mass", async () => {
    const { crew, base, channel, owner } = await setting();
    const part = await createPart(app.db, channel.id, { mass: q(100, "g") });
    const episode = await createEpisode(app.db, channel.id, { title: "Lift test" });
    await saveTestPlan(app.db, channel.id, episode.id, owner.id, { airframeMass: q(400, "g") });
    await createCriterion(app.db, channel.id, episode.id, { metric: "thrust_to_weight", comparator: "gte", threshold: q(1.5, "1") });
    await createRun(app.db, channel.id, episode.id, owner.id, { parts: [{ partId: part.id, count: 1 }], measurements: { thrust: q(760, "gf") } });
    const runs = `/api/channels/${channel.id}/episodes/${episode.id}/bench-runs`;
    // Own derivation: 760 gf over 400 + 100 g = 1.52 ≥ 1.5; over 400 + 150 g = 1.38 < 1.5.
    expect((await crew.get(runs).expect(200)).body.runs[0].evaluation.verdict).toBe("pass");
    await crew.send("put", `${base}/${part.id}`, { ...motor, mass: q(150, "g"), version: 1 }).expect(200);
    expect((await crew.get(runs).expect(200)).body.runs[0].evaluation.verdict).toBe("fail");
  });

  it("when a part's page is read, then it lists every run it was in, across episodes, with the verdict", async () => {
    const { crew, base, channel, owner } = await setting();
    const part = await createPart(app.db, channel.id, { name: "Tarn 2216", ratedVoltage: q(12.6, "V") });
    const unused = await createPart(app.db, channel.id, { name: "Unused" });
    const first = await createEpisode(app.db, channel.id, { title: "Fans versus rotor" });
    const second = await createEpisode(app.db, channel.id, { title: "Hover bike, small" });
    await saveTestPlan(app.db, channel.id, first.id, owner.id);
    await createCriterion(app.db, channel.id, first.id, { metric: "thrust", comparator: "gte", threshold: q(700, "gf") });
    await createRun(app.db, channel.id, first.id, owner.id, { label: "On 3S", parts: [{ partId: part.id, count: 1 }], supply: { kind: "lipo", cells: 3 }, measurements: { thrust: q(760, "gf") } });
    await createRun(app.db, channel.id, second.id, owner.id, { label: "Four on 4S", parts: [{ partId: part.id, count: 4 }], supply: { kind: "lipo", cells: 4 } });
    await createRun(app.db, channel.id, second.id, owner.id, { label: "Without it", parts: [{ partId: unused.id, count: 1 }] });

    const page = await crew.get(`${base}/${part.id}`).expect(200);
    expect(page.body.part).toMatchObject({ name: "Tarn 2216", runCount: 2 });
    const runs = page.body.runs.map((r: { label: string; episodeTitle: string; count: number; verdict: string; overRated: boolean }) => [r.label, r.episodeTitle, r.count, r.verdict, r.overRated]);
    // Common practice: 3S is 12.6 V full (not above 12.6 V); 4S is 16.8 V full, above the rating.
    expect(runs).toEqual(
      expect.arrayContaining([
        ["On 3S", "Fans versus rotor", 1, "pass", false],
        ["Four on 4S", "Hover bike, small", 4, "incomplete", true],
      ]),
    );
    expect(runs).toHaveLength(2);
  });

  it("when a part that was measured is deleted, then it stays and says why; an unused part goes", async () => {
    const { crew, base, channel, owner } = await setting();
    const used = await createPart(app.db, channel.id, { name: "Measured motor" });
    const episode = await createEpisode(app.db, channel.id);
    await createRun(app.db, channel.id, episode.id, owner.id, { parts: [{ partId: used.id, count: 1 }] });
    const refused = await crew.send("delete", `${base}/${used.id}`).expect(409);
    expect(refused.body.error.message).toBe("Measured motor is in 1 run, so it stays on the shelf: take it out of those runs first.");
    const spare = await createPart(app.db, channel.id);
    await crew.send("delete", `${base}/${spare.id}`).expect(204);
    await crew.get(`${base}/${spare.id}`).expect(404);
  });

  it("when another channel's part is read or changed, then it answers 404 and nothing changes", async () => {
    const { crew, base } = await setting();
    const other = await createUser(app.db);
    const elsewhere = await createChannel(app.db, other, "Elsewhere");
    const theirs = await createPart(app.db, elsewhere.id, { name: "Their motor" });
    await crew.get(`${base}/${theirs.id}`).expect(404);
    await crew.send("put", `${base}/${theirs.id}`, { ...motor, version: 1 }).expect(404);
    await crew.send("delete", `${base}/${theirs.id}`).expect(404);
    expect((await app.database.pool.query("select name from bench_parts where id = $1", [theirs.id])).rows).toEqual([{ name: "Their motor" }]);
    expect((await crew.get(base).expect(200)).body.parts).toEqual([]);
  });
});

describe("the build log", () => {
  async function logSetting() {
    const s = await setting();
    const episode = await createEpisode(app.db, s.channel.id, { title: "Rotor lifter", stage: "build" });
    const run = await createRun(app.db, s.channel.id, episode.id, s.owner.id, { label: "Chosen", measurements: { thrust: q(760, "gf") } });
    return { ...s, episode, run, log: `/api/channels/${s.channel.id}/episodes/${episode.id}/build-log` };
  }

  it("when iterations are logged, then they are numbered and each gets thrust-to-weight from its own mass and the chosen run", async () => {
    const { crew, log, run } = await logSetting();
    const first = await crew.send("post", log, { change: "Bare frame", allUpMass: q(640, "g"), outcome: "partly", chosenRunId: run.id, notes: "" }).expect(201);
    const second = await crew.send("post", log, { change: "Printed arms", allUpMass: q(1.3, "lb"), outcome: "worked", chosenRunId: run.id, notes: "" }).expect(201);
    await crew.send("post", log, { change: "Camera mount", allUpMass: null, outcome: "pending", chosenRunId: null, notes: "" }).expect(201);
    // Own derivations: 760 gf over 640 g = 1.1875; over 1.3 lb = 589.670081 g (NIST SP 811, B.8) = 1.28885.
    expect(first.body.iteration).toMatchObject({ number: 1, chosenRun: { id: run.id, label: "Chosen", thrust: q(760, "gf") }, thrustToWeight: { value: 1.1875, unit: "1" } });
    expect(second.body.iteration.thrustToWeight).toEqual({ value: expect.closeTo(760 / 589.670081, 9), unit: "1" });
    const list = (await crew.get(log).expect(200)).body.iterations;
    expect(list.map((i: { number: number; thrustToWeight: unknown }) => [i.number, i.thrustToWeight === "not_measured"])).toEqual([
      [1, false],
      [2, false],
      [3, true],
    ]);
  });

  it("when the chosen run belongs to another episode, then the field says so", async () => {
    const { crew, log, channel, owner } = await logSetting();
    const elsewhere = await createEpisode(app.db, channel.id);
    const foreign = await createRun(app.db, channel.id, elsewhere.id, owner.id);
    const response = await crew.send("post", log, { change: "x", allUpMass: null, outcome: "pending", chosenRunId: foreign.id, notes: "" }).expect(400);
    expect(response.body.error.fields).toEqual({ chosenRunId: "Pick one of this episode's runs." });
  });

  it("when the chosen run is deleted, then the iteration keeps its mass and waits for a new run", async () => {
    const { crew, log, run, channel, episode, owner } = await logSetting();
    const iteration = await createIteration(app.db, channel.id, episode.id, owner.id, { chosenRunId: run.id });
    await crew.send("delete", `/api/channels/${channel.id}/episodes/${episode.id}/bench-runs/${run.id}`).expect(204);
    const [after] = (await crew.get(log).expect(200)).body.iterations;
    expect(after).toMatchObject({ id: iteration.id, chosenRunId: null, chosenRun: null, thrustToWeight: "not_measured", allUpMass: q(640, "g") });
  });

  it("when an iteration is changed or deleted, then the log follows", async () => {
    const { crew, log, channel, episode, owner } = await logSetting();
    const iteration = await createIteration(app.db, channel.id, episode.id, owner.id);
    const changed = await crew.send("put", `${log}/${iteration.id}`, { change: "Lighter arms", allUpMass: q(0.6, "kg"), outcome: "failed", chosenRunId: null, notes: "Cracked on landing", version: 1 }).expect(200);
    expect(changed.body.iteration).toMatchObject({ change: "Lighter arms", outcome: "failed", notes: "Cracked on landing" });
    await crew.send("delete", `${log}/${iteration.id}`).expect(204);
    expect((await crew.get(log).expect(200)).body.iterations).toEqual([]);
  });
});
