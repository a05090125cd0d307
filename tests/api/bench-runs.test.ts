import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createCriterion, createPart, createRun, q, saveTestPlan } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

/** A channel whose episode has a plan: airframe 420 g, thrust-to-weight ≥ 1.2 and ≥ 5 gf/W required. */
async function setting() {
  const crewed = await createCrewedChannel(app.db, "Bench Channel");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Fans versus rotor", stage: "build" });
  await saveTestPlan(app.db, crewed.channel.id, episode.id, crewed.owner.id, { airframeMass: q(420, "g") });
  const ttw = await createCriterion(app.db, crewed.channel.id, episode.id, { metric: "thrust_to_weight", comparator: "gte", threshold: q(1.2, "1") });
  const tpw = await createCriterion(app.db, crewed.channel.id, episode.id, { metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W") });
  const motor = await createPart(app.db, crewed.channel.id, { name: "Tarn 2216", mass: q(2.4, "oz"), ratedVoltage: q(16.8, "V") });
  const prop = await createPart(app.db, crewed.channel.id, { name: "Skerry 10-inch prop", kind: "propeller", mass: q(14, "g"), ratedVoltage: null });
  const crew = await app.signedIn(crewed.crew);
  const base = `/api/channels/${crewed.channel.id}/episodes/${episode.id}/bench-runs`;
  return { ...crewed, episode, ttw, tpw, motor, prop, crew, base };
}

const close = (value: number, digits = 6) => expect.closeTo(value, digits);

describe("entering bench runs", () => {
  it("when crew enter a run in ounces and milliamps, then every figure and the verdict come back", async () => {
    const { crew, base, motor, prop, ttw, tpw } = await setting();
    const response = await crew
      .send("post", base, {
        label: "Tarn on 3S",
        parts: [{ partId: motor.id, count: 1 }, { partId: prop.id, count: 1 }],
        supply: { kind: "lipo", cells: 3 },
        measurements: { voltage: q(11.1, "V"), current: q(9800, "mA"), thrust: q(760, "gf") },
        notes: "",
      })
      .expect(201);
    const run = response.body.run;
    expect(run).toMatchObject({ number: 1, label: "Tarn on 3S", supply: { kind: "lipo", cells: 3 } });
    expect(run.parts.map((p: { name: string }) => p.name)).toEqual(["Tarn 2216", "Skerry 10-inch prop"]);
    // Own derivations: mass = 2.4 oz + 14 g = 68.0388555 g + 14 g = 82.0388555 g (NIST SP 811, B.8: 1 oz = 28.349523125 g);
    // P = 11.1 V × 9.8 A = 108.78 W (SI Brochure); 760 gf / 108.78 W = 6.98658 gf/W;
    // all-up 420 g + 82.0388555 g = 502.0388555 g; thrust-to-weight 760 / 502.0388555 = 1.51383.
    const e = run.evaluation;
    expect(e.massSource).toBe("shelf");
    expect(e.values.mass).toEqual({ value: close(82.0388555), unit: "g" });
    expect(e.figures.electrical_power).toEqual({ value: close(108.78), unit: "W" });
    expect(e.figures.thrust_per_watt).toEqual({ value: close(760 / 108.78), unit: "gf/W" });
    expect(e.allUpMass).toEqual({ value: close(502.0388555), unit: "g" });
    expect(e.figures.thrust_to_weight).toEqual({ value: close(760 / 502.0388555), unit: "1" });
    expect(e.results).toEqual([
      { criterionId: ttw.id, required: true, outcome: "pass" },
      { criterionId: tpw.id, required: true, outcome: "pass" },
    ]);
    expect(e.verdict).toBe("pass");
    expect(e.pack).toMatchObject({ label: "3S", nominal: q(11.1, "V"), full: q(12.6, "V") });
    expect(e.ratings.map((r: { check: { status: string } }) => r.check.status)).toEqual(["within_rating", "no_rating"]);
  });

  it("when a run misses a criterion or leaves one unmeasured, then it fails or waits", async () => {
    const { crew, base } = await setting();
    // Own derivation: 12 V × 4.1 A = 49.2 W; 290 gf / 49.2 W = 5.89 gf/W (pass); mass 1 lb = 453.59237 g (NIST SP 811, B.8),
    // all-up 873.59237 g, 290 / 873.59237 = 0.332 < 1.2 (fail).
    const failing = await crew
      .send("post", base, { label: "Twelve fans", parts: [], supply: { kind: "bench", voltage: q(12, "V") }, measurements: { mass: q(1, "lb"), voltage: q(12, "V"), current: q(4.1, "A"), thrust: q(290, "gf") }, notes: "" })
      .expect(201);
    expect(failing.body.run.evaluation.results.map((r: { outcome: string }) => r.outcome)).toEqual(["fail", "pass"]);
    expect(failing.body.run.evaluation.verdict).toBe("fail");
    expect(failing.body.run.number).toBe(1);

    const waiting = await crew.send("post", base, { label: "Spin-up only", parts: [], supply: null, measurements: { thrust: q(500, "gf") }, notes: "" }).expect(201);
    expect(waiting.body.run.evaluation.results.map((r: { outcome: string }) => r.outcome)).toEqual(["not_measured", "not_measured"]);
    expect(waiting.body.run.evaluation.verdict).toBe("incomplete");
    expect(waiting.body.run.number).toBe(2);
  });

  it("when the supply is above a part's rated voltage, then the run is flagged over-rated with a caution", async () => {
    const { crew, base, channel } = await setting();
    const small = await createPart(app.db, channel.id, { name: "Fjell 2814", mass: q(110, "g"), ratedVoltage: q(12.6, "V") });
    const response = await crew
      .send("post", base, { label: "Fjell on 4S", parts: [{ partId: small.id, count: 1 }], supply: { kind: "lipo", cells: 4 }, measurements: { voltage: q(16.4, "V"), current: q(3.1, "A") }, notes: "" })
      .expect(201);
    // Common practice: a 4S pack is 4 × 4.2 V = 16.8 V full; 16.8 − 12.6 = 4.2 V over.
    const [flag] = response.body.run.evaluation.ratings;
    expect(response.body.run.evaluation.supplyVoltage).toEqual(q(16.8, "V"));
    expect(flag).toMatchObject({ partName: "Fjell 2814", check: { status: "over_rated", overBy: q(4.2, "V") } });
    expect(flag.check.caution).toContain("The supply of 16.8 V is above the part's rated 12.6 V");
    expect(flag.check.caution).toContain("manufacturer's ratings, local codes and licensed practice");
  });

  it("when thrust is entered as a mass, or a reading is negative, then the field says so and nothing is saved", async () => {
    const { crew, base } = await setting();
    const mass = await crew.send("post", base, { label: "Wrong", parts: [], supply: null, measurements: { thrust: q(700, "g") }, notes: "" }).expect(400);
    expect(mass.body.error.fields).toEqual({ "measurements.thrust": "thrust must be in gf, kgf, N" });
    const negative = await crew.send("post", base, { label: "Wrong", parts: [], supply: null, measurements: { current: q(-1, "A") }, notes: "" }).expect(400);
    expect(negative.body.error.fields).toEqual({ "measurements.current.value": "Current cannot be negative" });
    const cells = await crew.send("post", base, { label: "Wrong", parts: [], supply: { kind: "lipo", cells: 0 }, measurements: {}, notes: "" }).expect(400);
    expect(Object.keys(cells.body.error.fields)).toEqual(["supply.cells"]);
    expect((await crew.get(base).expect(200)).body.runs).toEqual([]);
  });

  it("when a run names a part from another channel's shelf, then it answers 400 on that part and saves nothing", async () => {
    const { crew, base } = await setting();
    const other = await createUser(app.db);
    const elsewhere = await createChannel(app.db, other, "Elsewhere");
    const theirPart = await createPart(app.db, elsewhere.id, { name: "Their secret motor" });
    const response = await crew.send("post", base, { label: "Sneaky", parts: [{ partId: theirPart.id, count: 1 }], supply: null, measurements: {}, notes: "" }).expect(400);
    expect(response.body.error.fields).toEqual({ "parts.0.partId": "That part is not on this channel's shelf." });
    expect(JSON.stringify(response.body)).not.toContain("secret");
    expect((await crew.get(base).expect(200)).body.runs).toEqual([]);
  });

  it("when a run is changed, then it is judged again; when deleted, it is gone", async () => {
    const { crew, base, channel, episode, owner, motor } = await setting();
    const made = await createRun(app.db, channel.id, episode.id, owner.id, { label: "Before", measurements: { thrust: q(100, "gf") } });
    const changed = await crew
      .send("put", `${base}/${made.id}`, { label: "After", parts: [{ partId: motor.id, count: 2 }], supply: null, measurements: { mass: q(150, "g"), voltage: q(11.1, "V"), current: q(10, "A"), thrust: q(1, "kgf") }, notes: "reweighed", version: 1 })
      .expect(200);
    // Own derivation: 1000 gf / 111 W = 9.009 gf/W; 1000 gf over 570 g = 1.754.
    expect(changed.body.run).toMatchObject({ id: made.id, label: "After", notes: "reweighed", evaluation: { verdict: "pass", massSource: "measured" } });
    expect(changed.body.run.parts).toEqual([expect.objectContaining({ partId: motor.id, count: 2 })]);
    await crew.send("delete", `${base}/${made.id}`).expect(204);
    await crew.send("delete", `${base}/${made.id}`).expect(404);
  });

  it("when the plan's criteria change, then the runs are judged against the new plan", async () => {
    const { crew, base, channel, episode, owner } = await setting();
    await createRun(app.db, channel.id, episode.id, owner.id, { measurements: { voltage: q(11.1, "V"), current: q(10, "A"), thrust: q(760, "gf"), mass: q(80, "g") } });
    expect((await crew.get(base).expect(200)).body.runs[0].evaluation.verdict).toBe("pass");
    // Own derivation: 760 gf / 111 W = 6.85 gf/W, under a stricter 8 gf/W.
    await createCriterion(app.db, channel.id, episode.id, { metric: "thrust_per_watt", comparator: "gte", threshold: q(8, "gf/W") });
    expect((await crew.get(base).expect(200)).body.runs[0].evaluation.verdict).toBe("fail");
  });
});

describe("run numbers", () => {
  it("when several runs are entered at once, then each gets its own number", async () => {
    const { crew, base } = await setting();
    const body = (label: string) => ({ label, parts: [], supply: null, measurements: {}, notes: "" });
    const answers = await Promise.all(["a", "b", "c", "d", "e", "f"].map((label) => crew.send("post", base, body(label))));
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201, 201, 201, 201]);
    expect(answers.map((a) => a.body.run.number).sort()).toEqual([1, 2, 3, 4, 5, 6]);
  });
});

describe("CSV export of the runs", () => {
  it("answers text/csv with CRLF records and a header naming each column's unit (RFC 4180)", async () => {
    const { crew, base, channel, episode, owner } = await setting();
    await createRun(app.db, channel.id, episode.id, owner.id, { label: "Motor B, first try", measurements: { voltage: q(11.1, "V"), current: q(9800, "mA"), thrust: q(760, "gf"), mass: q(82, "g") }, notes: 'said "wow"' });
    const response = await crew.get(`${base}.csv`).buffer(true).parse((res, done) => {
      let text = "";
      res.on("data", (chunk: Buffer) => (text += chunk.toString("utf8")));
      res.on("end", () => done(null, text));
    });
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^text\/csv; charset=utf-8/);
    expect(response.headers["content-disposition"]).toBe("attachment; filename=bench-runs-fans-versus-rotor.csv");
    const text = response.body as string;
    const [header, row, end] = text.split("\r\n");
    expect(header).toContain("Current (A)");
    expect(header).toContain("criterion 1: Thrust-to-weight ≥ 1.2 (required)");
    // Own derivation: 9800 mA = 9.8 A; 11.1 V × 9.8 A = 108.78 W.
    expect(row).toMatch(/^1,"Motor B, first try",,,82,11\.1,9\.8,108\.78,760,/);
    expect(row).toMatch(/,"said ""wow"""$/);
    expect(end).toBe("");
  });
});

describe("another channel's runs", () => {
  it("when an outsider or a wrong episode is used, then it answers 404 and changes nothing", async () => {
    const { base, channel, episode, owner } = await setting();
    const run = await createRun(app.db, channel.id, episode.id, owner.id, { label: "Ours" });
    const outsider = await createUser(app.db);
    const theirs = await createChannel(app.db, outsider, "Elsewhere");
    const agent = await app.signedIn(outsider);
    await agent.get(base).expect(404);
    await agent.get(`${base}.csv`).expect(404);
    const throughTheirs = `/api/channels/${theirs.id}/episodes/${episode.id}/bench-runs`;
    await agent.get(throughTheirs).expect(404);
    await agent.send("delete", `${throughTheirs}/${run.id}`).expect(404);
    const ownerAgent = await app.signedIn(owner);
    const otherEpisode = await createEpisode(app.db, channel.id);
    await ownerAgent.send("delete", `/api/channels/${channel.id}/episodes/${otherEpisode.id}/bench-runs/${run.id}`).expect(404);
    await ownerAgent.send("delete", `${base}/${randomUUID()}`).expect(404);
    expect((await app.database.pool.query("select label from bench_runs where id = $1", [run.id])).rows).toEqual([{ label: "Ours" }]);
  });
});
