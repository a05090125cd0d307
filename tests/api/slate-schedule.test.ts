import { addDays, formatISO } from "date-fns";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { EpisodeDetail } from "../../shared/slate/schemas";
import { defaultStageLengths } from "../../shared/slate/schedule";
import { createCrewedChannel } from "../factories/accounts";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { board, cardOf, newEpisode } from "./slate-support";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

async function detail(agent: Visitor, channelId: string, episodeId: string): Promise<EpisodeDetail> {
  return (await agent.get(`/api/channels/${channelId}/episodes/${episodeId}`).expect(200)).body;
}
const dues = (d: EpisodeDetail) => Object.fromEntries(d.schedule!.map((r) => [r.stage, r.due]));

describe("the episode's schedule", () => {
  it("when an episode has a target date, then its page counts every stage back from it", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id, { targetPublishDate: "2027-03-05" });
    const page = await detail(agent, channel.id, made.id);
    expect(page.stageLengths).toEqual(defaultStageLengths);
    // Derived by hand in shared/slate/schedule.test.ts for Fri 5 Mar 2027 with the default lengths.
    expect(dues(page)).toEqual({
      challenge: "2027-01-26",
      test_plan: "2027-02-01",
      build: "2027-02-15",
      shoot: "2027-02-18",
      edit: "2027-03-01",
      sponsor_read: "2027-03-04",
      publish: "2027-03-05",
    });
  });

  it("when the publish date moves a week later, then every due date moves with it", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id, { targetPublishDate: "2027-03-05" });
    await agent.send("patch", `/api/channels/${channel.id}/episodes/${made.id}`, { version: 1, targetPublishDate: "2027-03-12" }).expect(200);
    // Five working days are a calendar week: each date is 7 days later.
    expect(dues(await detail(agent, channel.id, made.id))).toMatchObject({ challenge: "2027-02-02", build: "2027-02-22", edit: "2027-03-08", publish: "2027-03-12" });
  });

  it("when an episode has no target date, then there is no schedule and nothing to override", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id);
    expect((await detail(agent, channel.id, made.id)).schedule).toBeNull();
    const refused = await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/build`, { version: 1, dueDate: "2027-02-26" }).expect(422);
    expect(refused.body.error.message).toMatch(/target publish date first/);
  });
});

describe("overriding one due date", () => {
  it("when the producer moves build's due date, then only that date changes, and clearing it restores the count", async () => {
    const { channel, owner, producer } = await createCrewedChannel(app.db);
    const made = await newEpisode(await app.signedIn(owner), channel.id, { targetPublishDate: "2027-03-05" });
    const agent = await app.signedIn(producer);
    const set = await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/build`, { version: 1, dueDate: "2027-02-26" }).expect(200);
    expect(set.body.episode.version).toBe(2);
    const page = await detail(agent, channel.id, made.id);
    expect(page.schedule!.find((r) => r.stage === "build")).toMatchObject({ due: "2027-02-26", countedDue: "2027-02-15", overridden: true });
    expect(dues(page)).toMatchObject({ shoot: "2027-02-18", test_plan: "2027-02-01" });

    await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/build`, { version: 1, dueDate: "2027-02-27" }).expect(409);
    await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/build`, { version: 2, dueDate: null }).expect(200);
    expect((await detail(agent, channel.id, made.id)).schedule!.find((r) => r.stage === "build")).toMatchObject({ due: "2027-02-15", overridden: false });
  });

  it("when the publish stage or a made-up date is given, then it says what to do instead", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id, { targetPublishDate: "2027-03-05" });
    const publish = await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/publish`, { version: 1, dueDate: "2027-03-09" }).expect(400);
    expect(publish.body.error.fields.stage).toMatch(/target publish date/);
    const badDate = await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/edit`, { version: 1, dueDate: "2027-02-31" }).expect(400);
    expect(badDate.body.error.fields).toEqual({ dueDate: "That date doesn't exist." });
    await agent.send("put", `/api/channels/${channel.id}/episodes/${made.id}/due-dates/lunch`, { version: 1, dueDate: "2027-02-26" }).expect(404);
  });
});

describe("stage lengths as channel settings", () => {
  it("when the owner sets new lengths, then due dates follow; the producer reads them; editor and crew may not", async () => {
    const { channel, owner, producer, editor, crew } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id, { targetPublishDate: "2027-03-05" });
    const lengths = { ...defaultStageLengths, sponsor_read: 1 };
    await agent.send("put", `/api/channels/${channel.id}/slate/settings`, { stageLengths: lengths }).expect(200);
    // Sponsor read now takes only Thu 4 Mar, so edit is due Wed 3 Mar 2027.
    expect(dues(await detail(agent, channel.id, made.id))).toMatchObject({ sponsor_read: "2027-03-04", edit: "2027-03-03" });

    const read = await (await app.signedIn(producer)).get(`/api/channels/${channel.id}/slate/settings`).expect(200);
    expect(read.body).toEqual({ stageLengths: lengths, custom: true });
    await (await app.signedIn(producer)).send("put", `/api/channels/${channel.id}/slate/settings`, { stageLengths: defaultStageLengths }).expect(403);
    await (await app.signedIn(editor)).get(`/api/channels/${channel.id}/slate/settings`).expect(403);
    await (await app.signedIn(crew)).get(`/api/channels/${channel.id}/slate/settings`).expect(403);
    // Everyone still sees the dates, through the episode.
    expect(dues(await detail(await app.signedIn(crew), channel.id, made.id)).edit).toBe("2027-03-03");
  });

  it("when a length is out of range, then that stage's field says so and nothing changes", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const bad = await agent.send("put", `/api/channels/${channel.id}/slate/settings`, { stageLengths: { ...defaultStageLengths, build: 0, shoot: 500 } }).expect(400);
    expect(bad.body.error.fields).toEqual({ "stageLengths.build": "Build needs at least 1 working day.", "stageLengths.shoot": "Shoot: at most 120 working days." });
    expect((await agent.get(`/api/channels/${channel.id}/slate/settings`).expect(200)).body).toEqual({ stageLengths: defaultStageLengths, custom: false });
  });
});

describe("at risk", () => {
  it("when a new episode's publish date is too close for its stages, then the plan starts in the past", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    // Three days out, the countback puts challenge's due date weeks before today, when it didn't exist yet.
    const soon = formatISO(addDays(new Date(), 3), { representation: "date" });
    const made = await newEpisode(agent, channel.id, { title: "Rushed", targetPublishDate: soon });
    const roomy = await newEpisode(agent, channel.id, { title: "Roomy", targetPublishDate: formatISO(addDays(new Date(), 200), { representation: "date" }) });

    const page = await detail(agent, channel.id, made.id);
    expect(page.risks).toEqual([expect.objectContaining({ code: "plan_in_past", stage: "challenge" })]);
    const b = await board(agent, channel.id, "?risk=1");
    expect(b.episodes.map((e) => e.title)).toEqual(["Rushed"]);
    expect(cardOf(b, made.id).flags[0]).toMatchObject({ code: "slate.plan_in_past", label: "At risk: plan starts in the past", tone: "alarm" });
    expect((await detail(agent, channel.id, roomy.id)).risks).toEqual([]);
  });
});
