import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { SearchAnswer, SearchHit, SearchKind } from "../../shared/search/schemas";
import { trigramSimilarity } from "../../shared/search/highlight";
import { minorUnitDigits, minorUnitExceptions } from "../../shared/money/minor-units";
import { clipMarks } from "../../server/db/schema/rushes";
import { episodeComments } from "../../server/db/schema/slate";
import { createCrewedChannel } from "../factories/accounts";
import { createIteration, createPart, createRun, saveTestPlan } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { createClip, createShot } from "../factories/rushes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { newEpisode } from "./slate-support";

let app: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;

beforeAll(async () => {
  app = await startTestApp();
  world = await makeWorld();
});
afterAll(() => app.close());

/** One channel holding one record of every kind, each with a word of its own; a second channel with look-alike words. */
async function makeWorld() {
  const crewed = await createCrewedChannel(app.db, "Search Test Channel");
  const { channel, owner } = crewed;
  const c = channel.id;
  const episode = await createEpisode(app.db, c, { title: "Shoulder rig from conduit", question: "Can pipe carry a camera all day?", tags: ["ergonomics"] });
  await saveTestPlan(app.db, c, episode.id, owner.id, { hypothesis: "The harness spreads load across the clavicle.", method: "Weigh the straps with a luggage scale." });
  const run = await createRun(app.db, c, episode.id, owner.id, { label: "Tilt test", notes: "Wobbled past forty degrees of gimbal tilt." });
  const part = await createPart(app.db, c, { name: "Aluminium elbow joint", supplier: "Corner hardware", notes: "Knurled grip." });
  const iteration = await createIteration(app.db, c, episode.id, owner.id, { change: "Swapped zip ties for hose clamps", notes: "Rattle gone." });
  const shot = await createShot(app.db, c, episode.id, { description: "Macro of the knurled collar turning", kind: "insert" });
  const clip = await createClip(app.db, c, episode.id, { fileName: "A003_C017_pendulum.mov", tags: ["slowmo"], notes: "Sun flare on the lens." });
  const [mark] = await app.db
    .insert(clipMarks)
    .values({ channelId: c, clipId: clip.id, inFrame: 48, outFrame: 96, inLabel: "01:00:01;18", outLabel: "01:00:03;06", note: "The pack swelled here" })
    .returning();
  const [comment] = await app.db.insert(episodeComments).values({ channelId: c, episodeId: episode.id, authorId: owner.id, body: "Crème brûlée torch for the heat-shrink?" }).returning();
  const sponsor = await createSponsor(app.db, c, { company: "Quillon Fasteners" });
  const { deal } = await createDeal(app.db, c, episode.id, { sponsorId: sponsor.id, fee: "98765.43", currency: "EUR", script: "Thanks to Quillon for the marmalade-tough rivets.", promoCode: "RIVET15" });
  await app.database.pool.query("update deals set invoice_number = 'ZEPHYR-4412' where id = $1", [deal.id]);

  const other = await createCrewedChannel(app.db, "Other Search Channel");
  await createEpisode(app.db, other.channel.id, { title: "Pendulum shoulder gyroscope", question: "Secret neighbour words: marmalade zephyr" });

  return { ...crewed, episode, run, part, iteration, shot, clip, mark: mark!, comment: comment!, sponsor, deal, other };
}

async function search(agent: Visitor, query: string, channelId = world.channel.id): Promise<SearchAnswer> {
  const response = await agent.get(`/api/channels/${channelId}/search`).query({ q: query });
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body;
}
const hits = (answer: SearchAnswer): SearchHit[] => answer.groups.flatMap((g) => g.hits);
const kindsOf = (answer: SearchAnswer) => hits(answer).map((h) => h.kind);
const matched = (runs: { text: string; match: boolean }[]) => runs.filter((r) => r.match).map((r) => r.text);

describe("search finds each kind of record", () => {
  const cases: [SearchKind, string, () => string][] = [
    ["episode", "conduit", () => world.episode.id],
    ["testPlan", "clavicle", () => world.episode.id],
    ["benchRun", "gimbal", () => world.run.id],
    ["part", "aluminium elbow", () => world.part.id],
    ["buildEntry", "hose clamps", () => world.iteration.id],
    ["shot", "collar", () => world.shot.id],
    ["clip", "pendulum", () => world.clip.id],
    ["mark", "swelled", () => world.mark.id],
    ["comment", "torch", () => world.comment.id],
    ["sponsor", "quillon", () => world.sponsor.id],
    ["deal", "rivets", () => world.deal.id],
    ["dealMoney", "ZEPHYR-4412", () => world.deal.id],
  ];
  it.each(cases)("a %s, by its own word (%s)", async (kind, query, id) => {
    const answer = await search(await app.signedIn(world.owner), query);
    const hit = hits(answer).find((h) => h.kind === kind);
    expect(hit, JSON.stringify(answer)).toMatchObject({ id: id() });
    expect([...matched(hit!.title), ...matched(hit!.snippet)].length).toBeGreaterThan(0);
  });

  it("a mark carries its clip and where it begins, and its episode's title", async () => {
    const answer = await search(await app.signedIn(world.owner), "swelled");
    const mark = hits(answer).find((h) => h.kind === "mark")!;
    expect(mark).toMatchObject({ place: { clipId: world.clip.id, at: "01:00:01;18" }, episodeId: world.episode.id, episodeTitle: "Shoulder rig from conduit" });
    expect(matched(mark.snippet)).toEqual(["swelled"]);
  });
});

describe("typos, accents and partial words", () => {
  it('"sholder" finds the episode about a shoulder rig, with the word marked', async () => {
    const answer = await search(await app.signedIn(world.owner), "sholder");
    const episode = hits(answer).find((h) => h.kind === "episode");
    expect(episode?.id).toBe(world.episode.id);
    expect(matched(episode!.title)).toEqual(["Shoulder"]);
  });

  it('"creme" finds "Crème", and "brulee" finds "brûlée"', async () => {
    const answer = await search(await app.signedIn(world.crew), "creme brulee");
    const comment = hits(answer).find((h) => h.kind === "comment");
    expect(comment?.id).toBe(world.comment.id);
    expect(matched(comment!.snippet)).toEqual(["Crème", "brûlée"]);
  });

  it("a misspelt word beside a right one finds the record holding both", async () => {
    const answer = await search(await app.signedIn(world.owner), "sholder condiut");
    expect(hits(answer).find((h) => h.kind === "episode")?.id).toBe(world.episode.id);
  });

  it("near spellings come only from the areas the role reads", async () => {
    // "zephir" is near "zephyr", a word only the deal's money entry (area fees) holds besides the other channel's.
    for (const who of ["crew", "editor"] as const) expect((await search(await app.signedIn(world[who]), "zephir")).groups).toEqual([]);
    expect(kindsOf(await search(await app.signedIn(world.owner), "zephir"))).toContain("dealMoney");
  });

  it("a save that keeps the searched words leaves the entry as it was", async () => {
    const before = await app.database.pool.query("select updated_at from search_documents where kind = 'episode' and record_id = $1", [world.episode.id]);
    await app.database.pool.query("update episodes set title = title, question = question where id = $1", [world.episode.id]);
    const after = await app.database.pool.query("select updated_at from search_documents where kind = 'episode' and record_id = $1", [world.episode.id]);
    expect(after.rows[0].updated_at).toEqual(before.rows[0].updated_at);
  });

  it("the start of a word finds it", async () => {
    expect(kindsOf(await search(await app.signedIn(world.owner), "pendul"))).toContain("clip");
  });

  it("the database's decimals of each currency, with which a fee is searched, are the ones the app uses", async () => {
    const codes = [...Object.keys(minorUnitExceptions), "EUR", "USD", "GBP"];
    const { rows } = await app.database.pool.query("select code, currency_minor_digits(code) as digits from unnest($1::text[]) as code", [codes]);
    expect(Object.fromEntries(rows.map((row) => [row.code, row.digits]))).toEqual(Object.fromEntries(codes.map((code) => [code, minorUnitDigits(code)])));
  });

  it("the database's trigram figure is the one the highlighter uses", async () => {
    const { rows } = await app.database.pool.query("select similarity('sholder', 'shoulder')::float8 as s");
    expect(rows[0].s).toBeCloseTo(trigramSimilarity("sholder", "shoulder"), 5);
  });
});

describe("what a role may see", () => {
  it("crew and editors never find a fee, an invoice number or the deal's money entry; owners and producers do", async () => {
    for (const who of ["crew", "editor"] as const) {
      const agent = await app.signedIn(world[who]);
      for (const query of ["ZEPHYR-4412", "98765.43", "EUR"]) {
        const answer = await search(agent, query);
        expect(kindsOf(answer), `${who} searching ${query}`).not.toContain("dealMoney");
        expect(JSON.stringify(answer.groups)).not.toMatch(/98765|ZEPHYR/);
      }
      // The deal's words are theirs to read; its money isn't in them.
      const deal = hits(await search(agent, "quillon")).find((h) => h.kind === "deal");
      expect(deal?.id).toBe(world.deal.id);
      expect(JSON.stringify(deal)).not.toMatch(/98765|EUR/);
    }
    for (const who of ["owner", "producer"] as const) {
      expect(kindsOf(await search(await app.signedIn(world[who]), "98765.43"))).toContain("dealMoney");
    }
  });

  it("another channel's words never appear, not even as near spellings", async () => {
    const agent = await app.signedIn(world.owner);
    for (const query of ["gyroscope", "gyroscop", "marmalade zephyr", "neighbour"]) {
      const answer = await search(agent, query);
      expect(JSON.stringify(answer.groups), query).not.toMatch(/gyroscope|neighbour/i);
    }
    // And the other channel's owner, searching this channel's words in their own, finds only their own.
    const theirs = await search(await app.signedIn(world.other.owner), "conduit clavicle rivets", world.other.channel.id);
    expect(theirs.groups).toEqual([]);
  });
});

describe("the index follows every write", () => {
  it("an episode saved through the API is found by its new words at once, and no longer by its old ones", async () => {
    const agent = await app.signedIn(world.owner);
    const made = await newEpisode(agent, world.channel.id, { title: "Bandsaw fence", question: "How square can a fence be?" });
    expect(hits(await search(agent, "bandsaw")).map((h) => h.id)).toContain(made.id);
    await agent.send("patch", `/api/channels/${world.channel.id}/episodes/${made.id}`, { version: made.version, title: "Scroll saw fence" }).expect(200);
    expect(hits(await search(agent, "bandsaw")).map((h) => h.id)).not.toContain(made.id);
    expect(hits(await search(agent, "scroll saw")).map((h) => h.id)).toContain(made.id);
    // A stale save changes nothing, the index included.
    await agent.send("patch", `/api/channels/${world.channel.id}/episodes/${made.id}`, { version: made.version, title: "Jigsaw fence" }).expect(409);
    expect(hits(await search(agent, "jigsaw")).map((h) => h.id)).not.toContain(made.id);
  });

  it("a removed record leaves the index", async () => {
    const agent = await app.signedIn(world.owner);
    const part = await createPart(app.db, world.channel.id, { name: "Obsolete trunnion" });
    expect(kindsOf(await search(agent, "trunnion"))).toContain("part");
    await agent.send("delete", `/api/channels/${world.channel.id}/bench/parts/${part.id}`).expect(204);
    expect(kindsOf(await search(agent, "trunnion"))).not.toContain("part");
  });

  it("a title match ranks above a match in the text", async () => {
    const c = world.channel.id;
    await createEpisode(app.db, c, { title: "Dovetail jig", question: "Square?" });
    await createEpisode(app.db, c, { title: "Shop tour", question: "Where the dovetail jig hangs." });
    const episodes = hits(await search(await app.signedIn(world.owner), "dovetail")).filter((h) => h.kind === "episode");
    expect(episodes.map((h) => h.title.map((r) => r.text).join(""))).toEqual(["Dovetail jig", "Shop tour"]);
  });
});

describe("bad searches", () => {
  it("answers 400 with a plain message for no words or too many, and for a list of queries", async () => {
    const agent = await app.signedIn(world.owner);
    const path = `/api/channels/${world.channel.id}/search`;
    expect((await agent.get(path).query({ q: "  " }).expect(400)).body.error.fields).toEqual({ q: "Type a word to search for." });
    expect((await agent.get(path).query({ q: "x".repeat(201) }).expect(400)).body.error.fields).toEqual({ q: "Keep the search under 200 characters." });
    await agent.get(`${path}?q=a&q=b`).expect(400);
  });

  it("answers operators, quotes and stray symbols without an error", async () => {
    const agent = await app.signedIn(world.owner);
    for (const query of ['"shoulder rig" -conduit', "or", "&|!():*", "'; drop table episodes; --", "-"]) await search(agent, query);
  });
});
