import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
// The slate's gate registry first: it pulls in the bench's gates the way the app does.
import { slatePlugs } from "../../server/app";
import { gateProblems } from "../../server/seams/stage-gates";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createCriterion, q, saveTestPlan } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

async function setting() {
  const crewed = await createCrewedChannel(app.db, "Bench Channel");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Fans versus rotor", stage: "test_plan" });
  const agent = await app.signedIn(crewed.owner);
  const base = `/api/channels/${crewed.channel.id}/episodes/${episode.id}/test-plan`;
  return { ...crewed, episode, agent, base };
}

const sheet = {
  hypothesis: "One 10-inch rotor lifts the frame with 20 % margin.",
  method: "Clamp the stand, spin up for 30 s, read the scale.",
  quantities: [
    { name: "Static thrust", symbol: "T", measures: "thrust", unit: "gf" },
    { name: "Mass of the part", symbol: "m", measures: "mass", unit: "oz" },
  ],
  airframeMass: q(420, "g"),
};

describe("the test plan sheet", () => {
  it("when an episode has no sheet yet, then it reads as an empty one, in any stage", async () => {
    const { agent, channel } = await setting();
    const published = await createEpisode(app.db, channel.id, { stage: "publish" });
    const response = await agent.get(`/api/channels/${channel.id}/episodes/${published.id}/test-plan`).expect(200);
    expect(response.body.plan).toMatchObject({ episodeId: published.id, hypothesis: "", method: "", quantities: [], airframeMass: null, criteria: [], hazards: [], updatedAt: null });
  });

  it("when the producer saves the sheet, then everyone on the channel reads it back as entered", async () => {
    const { producer, crew, editor, base } = await setting();
    const saved = await (await app.signedIn(producer)).send("put", base, { ...sheet, version: 0 }).expect(200);
    expect(saved.body.plan).toMatchObject({ ...sheet, version: 1 });
    for (const person of [crew, editor]) {
      const read = await (await app.signedIn(person)).get(base).expect(200);
      expect(read.body.plan).toMatchObject({ ...sheet, updatedAt: expect.any(String) });
    }
  });

  it("when a quantity's unit is of the wrong kind, then it answers 400 on that field and keeps the old sheet", async () => {
    const { agent, base } = await setting();
    await agent.send("put", base, { ...sheet, version: 0 }).expect(200);
    const wrong = { ...sheet, hypothesis: "Changed", quantities: [{ name: "Static thrust", symbol: "T", measures: "thrust", unit: "g" }], version: 1 };
    const response = await agent.send("put", base, wrong).expect(400);
    expect(response.body.error.fields).toEqual({ "quantities.0.unit": "Thrust is measured in gf, kgf, N" });
    expect((await agent.get(base).expect(200)).body.plan.hypothesis).toBe(sheet.hypothesis);
  });

  it("refuses unknown fields rather than dropping them silently", async () => {
    const { agent, base } = await setting();
    const response = await agent.send("put", base, { ...sheet, verdict: "pass", version: 0 }).expect(400);
    expect(response.body.error.code).toBe("validation_failed");
  });
});

describe("pass criteria", () => {
  it("when criteria are added in any unit of their kind, then they come back in order", async () => {
    const { agent, base } = await setting();
    const first = await agent.send("post", `${base}/criteria`, { metric: "thrust_to_weight", comparator: "gte", threshold: q(1.2, "1"), required: true }).expect(201);
    const second = await agent.send("post", `${base}/criteria`, { metric: "thrust_per_watt", comparator: "gte", threshold: q(0.005, "kgf/W"), required: true }).expect(201);
    await agent.send("post", `${base}/criteria`, { metric: "voltage", comparator: "eq", threshold: q(11.1, "V"), tolerance: q(200, "mV"), required: false }).expect(201);
    await agent.send("post", `${base}/criteria`, { metric: "current", comparator: "between", low: q(5, "A"), high: q(20000, "mA"), required: false }).expect(201);
    expect(first.body.criterion).toMatchObject({ id: expect.any(String), position: 1, metric: "thrust_to_weight" });
    expect(second.body.criterion.position).toBe(2);
    const plan = (await agent.get(base).expect(200)).body.plan;
    expect(plan.criteria.map((c: { metric: string }) => c.metric)).toEqual(["thrust_to_weight", "thrust_per_watt", "voltage", "current"]);
  });

  it("when a criterion's threshold is in a unit of another kind, then the error sits on the threshold's unit and nothing is saved", async () => {
    const { agent, base } = await setting();
    const response = await agent.send("post", `${base}/criteria`, { metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "g"), required: true }).expect(400);
    expect(response.body.error.fields).toEqual({ "threshold.unit": "The threshold is in g but thrust per watt is in gf/W" });
    expect((await agent.get(base).expect(200)).body.plan.criteria).toEqual([]);
  });

  it("when a unit is unknown, or a range is upside down, then it says so", async () => {
    const { agent, base } = await setting();
    const unknown = await agent.send("post", `${base}/criteria`, { metric: "mass", comparator: "lte", threshold: q(8, "stone"), required: true }).expect(400);
    expect(unknown.body.error.fields["threshold.unit"]).toMatch(/^Use one of g, kg, oz, lb/);
    // NIST SP 811 (2008), Appendix B.8: 1 lb = 453.59237 g, so 1 lb up to 400 g is upside down.
    const upsideDown = await agent.send("post", `${base}/criteria`, { metric: "mass", comparator: "between", low: q(1, "lb"), high: q(400, "g"), required: true }).expect(400);
    expect(upsideDown.body.error.fields).toEqual({ high: "the high bound is below the low bound" });
  });

  it("when a criterion is changed or removed, then the sheet follows; another episode's criterion answers 404", async () => {
    const { agent, base, channel, episode } = await setting();
    const made = await createCriterion(app.db, channel.id, episode.id);
    const changed = await agent.send("put", `${base}/criteria/${made.id}`, { metric: "thrust", comparator: "gte", threshold: q(1, "kgf"), required: false, version: 1 }).expect(200);
    expect(changed.body.criterion).toMatchObject({ id: made.id, metric: "thrust", required: false, version: 2 });

    const elsewhere = await createEpisode(app.db, channel.id);
    const otherBase = `/api/channels/${channel.id}/episodes/${elsewhere.id}/test-plan`;
    await agent.send("delete", `${otherBase}/criteria/${made.id}`).expect(404);
    await agent.send("delete", `${base}/criteria/${randomUUID()}`).expect(404);
    await agent.send("delete", `${base}/criteria/${made.id}`).expect(204);
    expect((await agent.get(base).expect(200)).body.plan.criteria).toEqual([]);
  });
});

describe("safety", () => {
  it("when a hazard is picked from Kerf's list, then it carries its usual caution", async () => {
    const { agent, base } = await setting();
    const response = await agent.send("post", `${base}/hazards`, { kind: "lipo_unattended_charging", mitigation: "Charge on the steel tray, someone present." }).expect(201);
    expect(response.body.hazard).toMatchObject({
      kind: "lipo_unattended_charging",
      title: "Lithium cells: fire when charging unattended",
      caution: expect.stringContaining("Never charge unattended"),
      checkedBy: null,
    });
  });

  it("when a listed hazard is added twice, even at once, then it is on the plan once and the second is told", async () => {
    const { agent, base } = await setting();
    const body = { kind: "spinning_blades", mitigation: "Guard fitted." };
    const answers = await Promise.all([agent.send("post", `${base}/hazards`, body), agent.send("post", `${base}/hazards`, body), agent.send("post", `${base}/hazards`, body)]);
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409]);
    const refused = answers.find((a) => a.status === 409)!;
    expect(refused.body.error.message).toBe("This hazard is already on the plan: change its precautions there.");
    const plan = await agent.get(`${base}`).expect(200);
    expect(plan.body.plan.hazards.filter((h: { kind: string }) => h.kind === "spinning_blades")).toHaveLength(1);
    // Typed-in hazards are told apart by their names, so two are fine.
    await agent.send("post", `${base}/hazards`, { kind: "custom", title: "Hot glue", mitigation: "Stand." }).expect(201);
    await agent.send("post", `${base}/hazards`, { kind: "custom", title: "Solder fumes", mitigation: "Extractor." }).expect(201);
  });

  it("when a hazard is typed in, then it needs a name and a mitigation", async () => {
    const { agent, base } = await setting();
    const missing = await agent.send("post", `${base}/hazards`, { kind: "custom", mitigation: "" }).expect(400);
    expect(missing.body.error.fields).toEqual({ mitigation: "Say how the risk is kept down.", title: "Name the hazard." });
    const typed = await agent.send("post", `${base}/hazards`, { kind: "custom", title: "Compressed air", mitigation: "Regulator set to 2 bar." }).expect(201);
    expect(typed.body.hazard).toMatchObject({ title: "Compressed air", caution: null });
  });

  it("when someone checks a hazard, then it records who; changing the mitigation clears the check", async () => {
    const { agent, owner, producer, base } = await setting();
    const made = (await agent.send("post", `${base}/hazards`, { kind: "spinning_blades", mitigation: "Guard ring." }).expect(201)).body.hazard;
    const checked = await (await app.signedIn(producer)).send("patch", `${base}/hazards/${made.id}`, { checked: true }).expect(200);
    expect(checked.body.hazard.checkedBy).toEqual({ id: producer.id, name: producer.name });
    expect(Math.abs(Date.now() - Date.parse(checked.body.hazard.checkedAt))).toBeLessThan(60_000);

    const rewritten = await agent.send("patch", `${base}/hazards/${made.id}`, { mitigation: "Guard ring and safety glasses." }).expect(200);
    expect(rewritten.body.hazard).toMatchObject({ mitigation: "Guard ring and safety glasses.", checkedBy: null, checkedAt: null });

    const both = await agent.send("patch", `${base}/hazards/${made.id}`, { mitigation: "Guard ring, glasses, behind the line.", checked: true }).expect(200);
    expect(both.body.hazard.checkedBy.id).toBe(owner.id);
    await agent.send("patch", `${base}/hazards/${made.id}`, {}).expect(400);
  });
});

describe("another channel's sheet", () => {
  it("when an outsider aims at it through their own channel or this one, then it answers 404 and changes nothing", async () => {
    const { channel, episode, base } = await setting();
    const outsider = await createUser(app.db, { name: "Other Host" });
    const theirs = await createChannel(app.db, outsider, "Elsewhere");
    const agent = await app.signedIn(outsider);
    await agent.get(base).expect(404);
    await agent.send("put", `/api/channels/${theirs.id}/episodes/${episode.id}/test-plan`, { ...sheet, version: 0 }).expect(404);
    const made = await createCriterion(app.db, channel.id, episode.id);
    await agent.send("delete", `/api/channels/${theirs.id}/episodes/${episode.id}/test-plan/criteria/${made.id}`).expect(404);
    const rows = await app.database.pool.query("select 1 from test_plans where episode_id = $1", [episode.id]);
    expect(rows.rowCount).toBe(0);
    expect((await app.database.pool.query("select 1 from test_criteria where id = $1", [made.id])).rowCount).toBe(1);
  });
});

describe("the gate when leaving the test plan stage", () => {
  const problemsFor = (channelId: string, episodeId: string, from: "challenge" | "test_plan" | "build", to: "test_plan" | "build" | "shoot" | "challenge") =>
    gateProblems(slatePlugs.stageGates, { db: app.db, channelId, episodeId, from, to });

  it("when the sheet has no hypothesis and no required criterion, then both are named", async () => {
    const { channel, episode } = await setting();
    const problems = await problemsFor(channel.id, episode.id, "test_plan", "build");
    expect(problems.map((p) => p.code)).toEqual(expect.arrayContaining(["test_plan.no_hypothesis", "test_plan.no_required_criterion"]));
  });

  it("when only informative criteria exist, or the hypothesis is blank, then it still stops", async () => {
    const { channel, episode, owner } = await setting();
    await saveTestPlan(app.db, channel.id, episode.id, owner.id, { hypothesis: "   " });
    await createCriterion(app.db, channel.id, episode.id, { required: false });
    const codes = (await problemsFor(channel.id, episode.id, "test_plan", "shoot")).map((p) => p.code);
    expect(codes).toContain("test_plan.no_hypothesis");
    expect(codes).toContain("test_plan.no_required_criterion");
  });

  it("when the essentials are there, then the bench's gate is satisfied", async () => {
    const { channel, episode, owner } = await setting();
    await saveTestPlan(app.db, channel.id, episode.id, owner.id);
    await createCriterion(app.db, channel.id, episode.id, { required: true });
    const codes = (await problemsFor(channel.id, episode.id, "test_plan", "build")).map((p) => p.code);
    expect(codes.filter((code) => code.startsWith("test_plan."))).toEqual([]);
  });

  it("when the move jumps over test plan from challenge, then it applies; moving into test plan or back does not", async () => {
    const { channel, episode } = await setting();
    const jump = (await problemsFor(channel.id, episode.id, "challenge", "build")).map((p) => p.code);
    expect(jump).toContain("test_plan.no_hypothesis");
    const into = (await problemsFor(channel.id, episode.id, "challenge", "test_plan")).map((p) => p.code);
    expect(into.filter((code) => code.startsWith("test_plan."))).toEqual([]);
    const back = await problemsFor(channel.id, episode.id, "build", "challenge");
    expect(back).toEqual([]);
  });

  it("when the episode is moved out of test plan through the slate, then the move asks for a reason and names what is missing", async () => {
    const { channel, episode, agent, owner } = await setting();
    const moveTo = (stage: string, extra: object = {}) => agent.send("post", `/api/channels/${channel.id}/episodes/${episode.id}/move`, { version: episode.version, stage, ...extra });
    const refused = await moveTo("build").expect(422);
    expect(refused.body.problems.map((p: { code: string }) => p.code)).toEqual(expect.arrayContaining(["test_plan.no_hypothesis", "test_plan.no_required_criterion"]));

    await saveTestPlan(app.db, channel.id, episode.id, owner.id);
    await createCriterion(app.db, channel.id, episode.id, { required: true });
    const moved = await moveTo("build").expect(200);
    expect(moved.body.episode.stage).toBe("build");
  });
});
