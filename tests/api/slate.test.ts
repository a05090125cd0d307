import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addMember, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { episodeTitlesResponseSchema } from "../../shared/slate/schemas";
import { shiftDate } from "../../shared/sponsors/dates";
import { startTestApp, type TestApp } from "../support/test-app";
import { board, cardOf, column, fields, newEpisode } from "./slate-support";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const episodeRow = async (id: string) => (await app.database.pool.query("select * from episodes where id = $1", [id])).rows[0];

describe("creating an episode", () => {
  it("when the owner creates one with every field, then it lands on top of challenge with its opening history", async () => {
    const { channel, owner, producer } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    await newEpisode(agent, channel.id, { title: "First" });
    const made = await newEpisode(agent, channel.id, {
      title: "  Leaf-blower hovercraft ",
      origin: "viewer",
      originLink: "https://example.com/suggestions/42",
      ownerId: producer.id,
      tags: ["Hover", "garden kit"],
      budgetAmount: "249.50",
      budgetCurrency: "EUR",
      targetPublishDate: "2027-03-05",
    });
    expect(made).toMatchObject({
      title: "Leaf-blower hovercraft",
      stage: "challenge",
      version: 1,
      origin: "viewer",
      originLink: "https://example.com/suggestions/42",
      ownerId: producer.id,
      ownerName: "Pim Producer",
      tags: ["hover", "garden kit"],
      budgetAmount: "249.50",
      budgetCurrency: "EUR",
      targetPublishDate: "2027-03-05",
      archivedAt: null,
    });
    expect(column(await board(agent, channel.id), "challenge")).toEqual(["Leaf-blower hovercraft", "First"]);
    const history = await agent.get(`/api/channels/${channel.id}/episodes/${made.id}/history`).expect(200);
    expect(history.body.entries).toEqual([expect.objectContaining({ from: null, to: "challenge", byId: owner.id, byName: "Olive Owner" })]);
  });

  it("when fields are wrong, then each gets its own message and nothing is made", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const response = await agent
      .send("post", `/api/channels/${channel.id}/episodes`, {
        ...fields(),
        title: " ",
        question: "two\nlines",
        origin: "viewer",
        originLink: "",
        budgetAmount: "about 300",
        targetPublishDate: "2027-02-30",
        tags: ["ok", "!!"],
      })
      .expect(400);
    expect(response.body.error.code).toBe("validation_failed");
    expect(response.body.error.fields).toEqual({
      title: "Give the episode a working title.",
      question: "Keep this to one line.",
      budgetAmount: "Write the budget as a number, e.g. 1800.50 or 1,800.50.",
      budgetCurrency: "Pick the budget's currency.",
      targetPublishDate: "That date doesn't exist.",
      "tags.1": "Tags are words: letters, digits, spaces and dashes.",
      originLink: "Paste the link to the viewer's suggestion.",
    });
    expect((await board(agent, channel.id)).episodes).toEqual([]);
  });

  it("when a budget has no currency or the owner is not a member, then the field says so", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const stranger = await createUser(app.db);
    const agent = await app.signedIn(owner);
    const noCurrency = await agent.send("post", `/api/channels/${channel.id}/episodes`, fields({ budgetAmount: "300" })).expect(400);
    expect(noCurrency.body.error.fields).toEqual({ budgetCurrency: "Pick the budget's currency." });
    const notMember = await agent.send("post", `/api/channels/${channel.id}/episodes`, fields({ ownerId: stranger.id })).expect(400);
    expect(notMember.body.error.fields).toEqual({ ownerId: "Pick a member of this channel." });
    const unknownField = await agent.send("post", `/api/channels/${channel.id}/episodes`, { ...fields(), stage: "publish" }).expect(400);
    expect(unknownField.body.error.code).toBe("validation_failed");
  });
});

describe("a budget as people type it", () => {
  it("when the budget is typed with grouping marks, then it is kept as the plain amount; a negative one is told it must be zero or more", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const grouped = await newEpisode(agent, channel.id, { budgetAmount: "1,800.50", budgetCurrency: "EUR" });
    expect(grouped.budgetAmount).toBe("1800.50");
    const european = await newEpisode(agent, channel.id, { budgetAmount: "1.800,50", budgetCurrency: "EUR" });
    expect(european.budgetAmount).toBe("1800.50");
    const negative = await agent.send("post", `/api/channels/${channel.id}/episodes`, fields({ budgetAmount: "-20", budgetCurrency: "EUR" })).expect(400);
    expect(negative.body.error.fields).toEqual({ budgetAmount: "The budget must be zero or more." });
  });
});

describe("editing an episode", () => {
  it("when some fields change against the current version, then they change and the version goes up", async () => {
    const { channel, owner, editor } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(editor);
    const made = await newEpisode(await app.signedIn(owner), channel.id);
    const edited = await agent
      .send("patch", `/api/channels/${channel.id}/episodes/${made.id}`, { version: 1, title: "Parachute from a bin bag", targetPublishDate: "2027-04-02" })
      .expect(200);
    expect(edited.body.episode).toMatchObject({ title: "Parachute from a bin bag", targetPublishDate: "2027-04-02", version: 2, question: made.question });
  });

  it("when an edit sends a stale version, then it answers 409 with the current state and changes nothing", async () => {
    const { channel, owner, producer } = await createCrewedChannel(app.db);
    const made = await newEpisode(await app.signedIn(owner), channel.id);
    const first = await app.signedIn(owner);
    const second = await app.signedIn(producer);
    await first.send("patch", `/api/channels/${channel.id}/episodes/${made.id}`, { version: 1, title: "Owner's title" }).expect(200);
    const late = await second.send("patch", `/api/channels/${channel.id}/episodes/${made.id}`, { version: 1, title: "Producer's title" }).expect(409);
    expect(late.body.error.code).toBe("conflict");
    expect(late.body.current).toMatchObject({ id: made.id, title: "Owner's title", version: 2 });
    expect((await episodeRow(made.id)).title).toBe("Owner's title");
  });

  it("when an edit would break a rule across fields, then the merged episode is checked", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id);
    const response = await agent.send("patch", `/api/channels/${channel.id}/episodes/${made.id}`, { version: 1, origin: "viewer" }).expect(400);
    expect(response.body.error.fields).toEqual({ originLink: "Paste the link to the viewer's suggestion." });
    expect((await episodeRow(made.id)).version).toBe(1);
  });

  it("when an episode is archived and restored, then the board hides it and shows it again", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id, { title: "Shelved idea" });
    const archived = await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/archive`, { version: 1 }).expect(200);
    expect(archived.body.episode.archivedAt).not.toBeNull();
    expect(column(await board(agent, channel.id), "challenge")).toEqual([]);
    expect(column(await board(agent, channel.id, "?archived=1"), "challenge")).toEqual(["Shelved idea"]);
    await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/restore`, { version: 1 }).expect(409);
    const restored = await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/restore`, { version: 2 }).expect(200);
    expect(restored.body.episode).toMatchObject({ archivedAt: null, version: 3 });
    expect(column(await board(agent, channel.id), "challenge")).toEqual(["Shelved idea"]);
  });
});

describe("the board", () => {
  it("when filters are given, then only the matching cards come back", async () => {
    const { channel, owner, editor } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    await newEpisode(agent, channel.id, { title: "Mine, flying", ownerId: owner.id, tags: ["flying"] });
    await newEpisode(agent, channel.id, { title: "Editor's, flying", ownerId: editor.id, tags: ["flying", "batteries"] });
    await newEpisode(agent, channel.id, { title: "Nobody's", tags: ["batteries"] });
    // Due long ago and entered before then: overdue.
    await createEpisode(app.db, channel.id, { title: "Late one", stage: "build", targetPublishDate: "2020-03-06", stageEnteredAt: new Date("2020-01-06T09:00:00Z") });

    const titles = async (query: string) => (await board(agent, channel.id, query)).episodes.map((e) => e.title).sort();
    expect(await titles(`?owner=${editor.id}`)).toEqual(["Editor's, flying"]);
    expect(await titles("?owner=none")).toEqual(["Late one", "Nobody's"]);
    expect(await titles("?tag=flying")).toEqual(["Editor's, flying", "Mine, flying"]);
    expect(await titles("?tag=Batteries&owner=none")).toEqual(["Nobody's"]);
    expect(await titles("?risk=1")).toEqual(["Late one"]);
    expect(await titles("?sponsor=nobody")).toEqual([]);
    const bad = await agent.get(`/api/channels/${channel.id}/episodes?owner=someone`).expect(400);
    expect(bad.body.error.fields).toEqual({ owner: "Pick a member, or none." });
  });

  it("when a card is late, then it says so with its days in stage and due date", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const late = await createEpisode(app.db, channel.id, { title: "Late one", stage: "build", targetPublishDate: "2020-03-06", stageEnteredAt: new Date("2020-01-06T09:00:00Z") });
    const card = cardOf(await board(agent, channel.id), late.id);
    // Default lengths after build: publish 1 + sponsor read 3 + edit 7 + shoot 3 = 14 WD, taken by hand
    // from Fri 6 Mar 2020 back: 6, 5, 4, 3, 2 Mar, 28, 27, 26, 25, 24, 21, 20, 19, 18 Feb (weekends
    // skipped; 2020 calendar from Python's calendar module). Build is due the WD before: Mon 17 Feb 2020.
    expect(card.stageDue).toBe("2020-02-17");
    expect(card.daysInStage).toBeGreaterThan(365);
    expect(card.flags).toEqual([expect.objectContaining({ code: "slate.stage_overdue", tone: "alarm", detail: "Build was due Mon 17 Feb." })]);
  });

  it("when nothing changed since the last load, then a revalidation answers 304; after a change, 200", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id);
    const first = await agent.get(`/api/channels/${channel.id}/episodes`).expect(200);
    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^W\//);
    await agent.get(`/api/channels/${channel.id}/episodes`).set("If-None-Match", etag).expect(304);
    // A change made outside the app's routes raises the revision too (the trigger on episodes).
    await app.database.pool.query("update episodes set title = 'Renamed by hand' where id = $1", [made.id]);
    const after = await agent.get(`/api/channels/${channel.id}/episodes`).set("If-None-Match", etag).expect(200);
    expect(after.body.episodes[0].title).toBe("Renamed by hand");
  });

  it("when a client accepts brotli or gzip, then the same board comes compressed that way", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    for (let i = 0; i < 5; i++) await newEpisode(agent, channel.id, { title: `Compressed ${i}` });
    const plain = await agent.get(`/api/channels/${channel.id}/episodes`).set("Accept-Encoding", "identity").expect(200);
    expect(plain.headers["content-encoding"]).toBeUndefined();
    for (const [accept, encoding] of [["gzip, deflate, br", "br"], ["gzip", "gzip"]] as const) {
      const response = await agent.get(`/api/channels/${channel.id}/episodes`).set("Accept-Encoding", accept).expect(200);
      expect(response.headers["content-encoding"]).toBe(encoding);
      expect(response.headers.vary).toContain("Accept-Encoding");
      expect(response.headers.etag).toBe(plain.headers.etag);
      expect(response.body).toEqual(plain.body); // superagent decodes both
    }
  });

  it("when a sponsor item of an episode changes, then the next board load shows it, though the answer is kept", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const episode = await createEpisode(app.db, channel.id, { title: "Sponsored one", targetPublishDate: shiftDate(new Date().toISOString().slice(0, 10), 3) });
    const before = await board(agent, channel.id);
    expect(before.flags[episode.id]).toBeUndefined();
    expect(before.sponsorOptions).toEqual([]);

    // Rows written straight to the tables, as a script would: the triggers on the sponsor tables raise the revision.
    const sponsor = await createSponsor(app.db, channel.id, { company: "Quillon Fasteners" });
    const made = await createDeal(app.db, channel.id, episode.id, { sponsorId: sponsor.id, publishDate: shiftDate(new Date().toISOString().slice(0, 10), 3) });
    const flagged = await board(agent, channel.id);
    expect(flagged.flags[episode.id]!.map((f) => f.code)).toEqual(expect.arrayContaining(["sponsors.item_due"]));
    expect(flagged.sponsorOptions).toEqual([{ value: sponsor.id, label: "Quillon Fasteners" }]);
    expect((await board(agent, channel.id, `?sponsor=${sponsor.id}`)).episodes.map((e) => e.id)).toEqual([episode.id]);

    await app.database.pool.query("update deliverables set status = 'done' where deal_id = $1", [made.deal.id]);
    expect((await board(agent, channel.id)).flags[episode.id]).toBeUndefined();
    await app.database.pool.query("update deals set state = 'cancelled' where id = $1", [made.deal.id]);
    expect((await board(agent, channel.id)).sponsorOptions).toEqual([]);
    expect((await board(agent, channel.id, `?sponsor=${sponsor.id}`)).episodes).toEqual([]);
  });

  it("when a member of one channel asks for another's board or episode, then it answers 404", async () => {
    const a = await createCrewedChannel(app.db, "A");
    const b = await createCrewedChannel(app.db, "B");
    const inA = await newEpisode(await app.signedIn(a.owner), a.channel.id);
    const agentOfB = await app.signedIn(b.owner);
    await agentOfB.get(`/api/channels/${b.channel.id}/episodes/${inA.id}`).expect(404);
    await agentOfB.send("post", `/api/channels/${b.channel.id}/episodes/${inA.id}/move`, { version: 1, stage: "build" }).expect(404);
    await agentOfB.send("patch", `/api/channels/${b.channel.id}/episodes/${inA.id}`, { version: 1, title: "Mine now" }).expect(404);
    await agentOfB.send("post", `/api/channels/${b.channel.id}/episodes/${inA.id}/comments`, { body: "hello" }).expect(404);
    expect((await episodeRow(inA.id)).title).toBe(inA.title);
  });

  it("when people are listed for the owner picker, then crew sees names but no addresses", async () => {
    const { channel, crew } = await createCrewedChannel(app.db);
    const extra = await createUser(app.db, { name: "Zed Extra" });
    await addMember(app.db, channel.id, extra, "crew");
    const people = await (await app.signedIn(crew)).get(`/api/channels/${channel.id}/slate/people`).expect(200);
    expect(people.body.people.map((p: { name: string }) => p.name)).toEqual(["Cato Crew", "Edda Editor", "Olive Owner", "Pim Producer", "Zed Extra"]);
    expect(Object.keys(people.body.people[0]).sort()).toEqual(["id", "name"]);
  });
});

describe("the episode titles", () => {
  it("when a member asks for them, then every episode that isn't archived comes by title, with its stage, and no other channel's", async () => {
    const { channel, crew } = await createCrewedChannel(app.db);
    const other = await createCrewedChannel(app.db);
    const bravo = await createEpisode(app.db, channel.id, { title: "Bravo rotor", stage: "build" });
    const alpha = await createEpisode(app.db, channel.id, { title: "Alpha glider", stage: "publish" });
    await createEpisode(app.db, channel.id, { title: "Archived kite", archivedAt: new Date() });
    await createEpisode(app.db, other.channel.id, { title: "Another channel's episode" });
    const agent = await app.signedIn(crew);
    const response = await agent.get(`/api/channels/${channel.id}/episode-titles`).expect(200);
    expect(episodeTitlesResponseSchema.parse(response.body)).toEqual({
      episodes: [
        { id: alpha.id, title: "Alpha glider", stage: "publish" },
        { id: bravo.id, title: "Bravo rotor", stage: "build" },
      ],
    });
  });
});

describe("what crew may do", () => {
  it("when crew reads the board and an episode, then it may; when it moves or edits, then 403 and nothing changes", async () => {
    const { channel, owner, crew } = await createCrewedChannel(app.db);
    const made = await newEpisode(await app.signedIn(owner), channel.id);
    const agent = await app.signedIn(crew);
    await agent.get(`/api/channels/${channel.id}/episodes`).expect(200);
    const detail = await agent.get(`/api/channels/${channel.id}/episodes/${made.id}`).expect(200);
    // The stage under way started today, the day it was made, whatever the plan counts back to.
    expect(detail.body.stageEnteredOn).toBe(detail.body.today);
    await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/move`, { version: 1, stage: "test_plan" }).expect(403);
    await agent.send("patch", `/api/channels/${channel.id}/episodes/${made.id}`, { version: 1, title: "Crew's title" }).expect(403);
    await agent.send("post", `/api/channels/${channel.id}/episodes`, fields()).expect(403);
    await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/build`, { version: 1, dueDate: "2027-01-04" }).expect(403);
    const row = await episodeRow(made.id);
    expect(row).toMatchObject({ stage: "challenge", title: made.title, version: 1 });
    await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/comments`, { body: "I can film this on Tuesday." }).expect(201);
  });
});
