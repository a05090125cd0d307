import { generateNKeysBetween } from "fractional-indexing";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Stage } from "../../shared/slate/stages";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp } from "../support/test-app";
import { board, cardOf, column, moveTo, newEpisode } from "./slate-support";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

async function columnOf(channelId: string, stage: Stage, titles: string[]) {
  const ranks = generateNKeysBetween(null, null, titles.length);
  const made = [];
  for (const [i, title] of titles.entries()) made.push(await createEpisode(app.db, channelId, { title, stage, rank: ranks[i] }));
  return made;
}

const rows = async (channelId: string) =>
  (await app.database.pool.query<{ id: string; rank: string; stage: string; version: number; updated_at: Date }>("select id, rank, stage, version, updated_at from episodes where channel_id = $1 order by id", [channelId])).rows;

const historyRows = async (episodeId: string) =>
  (await app.database.pool.query("select from_stage, to_stage, moved_by, reason, skipped from stage_moves where episode_id = $1 order by moved_at", [episodeId])).rows;

describe("ordering cards", () => {
  it("when a card is dropped between two others, then only its own row changes", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const [a, b, c, d] = await columnOf(channel.id, "build", ["A", "B", "C", "D"]);
    const agent = await app.signedIn(owner);
    const before = await rows(channel.id);

    await moveTo(agent, channel.id, d!, { stage: "build", afterId: a!.id, beforeId: b!.id }).expect(200);
    expect(column(await board(agent, channel.id), "build")).toEqual(["A", "D", "B", "C"]);

    const after = await rows(channel.id);
    const changed = after.filter((row, i) => row.rank !== before[i]!.rank || row.version !== before[i]!.version);
    expect(changed.map((r) => r.id)).toEqual([d!.id]);
    expect(await historyRows(d!.id)).toEqual([]); // a reorder inside a column is not a stage move
    void c;
  });

  it("when a card goes to the top or the end, then the column keeps every other card in order", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const [a, , c] = await columnOf(channel.id, "shoot", ["A", "B", "C"]);
    const agent = await app.signedIn(owner);
    await moveTo(agent, channel.id, c!, { stage: "shoot", afterId: null, beforeId: a!.id }).expect(200);
    expect(column(await board(agent, channel.id), "shoot")).toEqual(["C", "A", "B"]);
    await moveTo(agent, channel.id, { id: a!.id, version: 1 }, { stage: "shoot" }).expect(200);
    expect(column(await board(agent, channel.id), "shoot")).toEqual(["C", "B", "A"]);
  });

  it("when the card it was dropped after has moved away meanwhile, then it still moves, to the end", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const [a, b] = await columnOf(channel.id, "edit", ["A", "B"]);
    const [x] = await columnOf(channel.id, "shoot", ["X"]);
    const agent = await app.signedIn(owner);
    await moveTo(agent, channel.id, a!, { stage: "sponsor_read" }).expect(200);
    await moveTo(agent, channel.id, x!, { stage: "edit", afterId: a!.id }).expect(200);
    expect(column(await board(agent, channel.id), "edit")).toEqual(["B", "X"]);
    void b;
  });
});

describe("moving between stages", () => {
  it("when a card moves forward and back, then each move is recorded with who, when, from and to", async () => {
    const { channel, owner, editor } = await createCrewedChannel(app.db);
    const made = await newEpisode(await app.signedIn(owner), channel.id, { title: "Drill-motor skateboard" });
    const agent = await app.signedIn(editor);
    const forward = await moveTo(agent, channel.id, made, { stage: "test_plan" }).expect(200);
    expect(forward.body.episode).toMatchObject({ stage: "test_plan", version: 2 });
    await moveTo(agent, channel.id, forward.body.episode, { stage: "challenge" }).expect(200);

    const history = (await agent.get(`/api/channels/${channel.id}/episodes/${made.id}/history`).expect(200)).body;
    expect(history.entries.map((e: { from: string | null; to: string; byName: string }) => [e.from, e.to, e.byName])).toEqual([
      [null, "challenge", "Olive Owner"],
      ["challenge", "test_plan", "Edda Editor"],
      ["test_plan", "challenge", "Edda Editor"],
    ]);
    const times = Object.fromEntries(history.timeInStage.map((t: { stage: string; visits: number }) => [t.stage, t.visits]));
    expect(times).toMatchObject({ challenge: 2, test_plan: 1, build: 0 });
    expect(cardOf(await board(agent, channel.id), made.id).daysInStage).toBe(0);
  });

  it("when a move sends a stale version, then it answers 409 with where the card is now, and nothing moves", async () => {
    const { channel, owner, producer } = await createCrewedChannel(app.db);
    const made = await newEpisode(await app.signedIn(owner), channel.id);
    const first = await app.signedIn(owner);
    const second = await app.signedIn(producer);
    await moveTo(first, channel.id, made, { stage: "test_plan" }).expect(200);
    const late = await moveTo(second, channel.id, made, { stage: "build", reason: "moving on" }).expect(409);
    expect(late.body.error.code).toBe("conflict");
    expect(late.body.error.message).toMatch(/Someone else changed this episode/);
    expect(late.body.current).toMatchObject({ id: made.id, stage: "test_plan", version: 2 });
    expect((await rows(channel.id))[0]).toMatchObject({ stage: "test_plan", version: 2 });
    expect((await historyRows(made.id)).map((h) => h.to_stage)).toEqual(["challenge", "test_plan"]);
  });

  it("when a card would be placed next to itself or into no stage, then the field says so", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id);
    const self = await moveTo(agent, channel.id, made, { stage: "build", afterId: made.id }).expect(400);
    expect(self.body.error.fields).toEqual({ afterId: "A card can't be placed next to itself." });
    const nowhere = await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/move`, { version: 1, stage: "storage" }).expect(400);
    expect(nowhere.body.error.fields).toEqual({ stage: "Pick one of the seven stages." });
  });
});

describe("two people at once", () => {
  it("when twenty cards are moved into the same gap in parallel, then every move lands and each has its own place", async () => {
    const { channel, owner, producer } = await createCrewedChannel(app.db);
    const [anchor, below] = await columnOf(channel.id, "test_plan", ["Anchor", "Below"]);
    const movers = await columnOf(
      channel.id,
      "challenge",
      Array.from({ length: 20 }, (_, i) => `Card ${i}`),
    );
    const agents = [await app.signedIn(owner), await app.signedIn(producer)];
    const answers = await Promise.all(movers.map((card, i) => moveTo(agents[i % 2]!, channel.id, card, { stage: "test_plan", afterId: anchor!.id, beforeId: below!.id })));
    expect(answers.map((r) => r.status)).toEqual(movers.map(() => 200));

    const after = await board(agents[0]!, channel.id);
    const lane = column(after, "test_plan");
    expect(lane).toHaveLength(22);
    expect(lane[0]).toBe("Anchor");
    expect(lane[21]).toBe("Below");
    const inOrder = after.episodes.filter((e) => e.stage === "test_plan").map((e) => e.id);
    const rankOf = new Map((await rows(channel.id)).map((r) => [r.id, r.rank]));
    const ranks = inOrder.map((id) => rankOf.get(id)!);
    expect(new Set(ranks).size).toBe(22);
    expect([...ranks].sort()).toEqual(ranks); // byte order is board order
    const moves = await app.database.pool.query("select count(*)::int as n from stage_moves where channel_id = $1 and to_stage = 'test_plan'", [channel.id]);
    expect(moves.rows[0].n).toBe(20);
  });

  it("when two people move the same card at the same version, then one wins and the other gets the conflict", async () => {
    const { channel, owner, editor } = await createCrewedChannel(app.db);
    const [card] = await columnOf(channel.id, "shoot", ["Contested"]);
    const [one, two] = await Promise.all([
      moveTo(await app.signedIn(owner), channel.id, card!, { stage: "edit" }),
      moveTo(await app.signedIn(editor), channel.id, card!, { stage: "challenge" }),
    ]);
    expect([one.status, two.status].sort()).toEqual([200, 409]);
    const loser = one.status === 409 ? one : two;
    const winner = one.status === 200 ? one : two;
    expect(loser.body.current.stage).toBe(winner.body.episode.stage);
    expect(await historyRows(card!.id)).toHaveLength(1);
  });
});

describe("gates on forward moves", () => {
  it("when a card leaves test plan without its essentials, then it asks for a reason, and with one it moves and records both", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const [card] = await columnOf(channel.id, "test_plan", ["No plan yet"]);

    const asked = await moveTo(agent, channel.id, card!, { stage: "build" }).expect(422);
    expect(asked.body.error.code).toBe("unprocessable");
    // The test-plan feature's gate: no hypothesis, no pass criterion.
    expect(asked.body.problems).toEqual([
      { code: "test_plan.no_hypothesis", message: "The test plan has no hypothesis yet." },
      { code: "test_plan.no_required_criterion", message: "The test plan has no required pass criterion yet." },
    ]);
    expect((await rows(channel.id))[0]).toMatchObject({ stage: "test_plan", version: 1 });

    const tooShort = await moveTo(agent, channel.id, card!, { stage: "build", reason: " " }).expect(400);
    expect(tooShort.body.error.fields).toEqual({ reason: "Say in a few words why it moves on anyway." });

    await moveTo(agent, channel.id, card!, { stage: "build", reason: "Parts arrive Monday; the plan follows." }).expect(200);
    const [moved] = await historyRows(card!.id);
    expect(moved).toMatchObject({ from_stage: "test_plan", to_stage: "build", moved_by: owner.id, reason: "Parts arrive Monday; the plan follows." });
    expect(moved.skipped).toEqual(asked.body.problems);

    const flags = cardOf(await board(agent, channel.id), card!.id).flags;
    expect(flags).toEqual([expect.objectContaining({ code: "slate.essentials_skipped", tone: "warn" }), expect.objectContaining({ code: "slate.no_publish_date", tone: "info" })]);
    expect(flags[0]!.detail).toContain("Parts arrive Monday");
  });

  it("when a card moves backward, then no essentials are asked for", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const [card] = await columnOf(channel.id, "build", ["Back to the plan"]);
    await moveTo(agent, channel.id, card!, { stage: "test_plan" }).expect(200);
    expect(await historyRows(card!.id)).toEqual([expect.objectContaining({ from_stage: "build", to_stage: "test_plan", reason: null, skipped: [] })]);
  });
});
