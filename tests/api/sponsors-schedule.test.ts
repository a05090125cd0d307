import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { slatePlugs } from "../../server/app";
import { gateProblems } from "../../server/seams/stage-gates";
import { collectFlags } from "../../server/seams/board-flags";
import { followPublishDate } from "../../server/sponsors/schedule.service";
import { shiftDate } from "../../shared/sponsors/dates";
import type { DealView, DeskView } from "../../shared/sponsors/schemas";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let producer: Visitor;
let editor: Visitor;

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Schedule Bench");
  producer = await app.signedIn(world.producer);
  editor = await app.signedIn(world.editor);
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;
const today = () => new Date().toISOString().slice(0, 10);

async function datesOf(dealId: string, who: Visitor = producer) {
  const deal = (await who.get(api(`/deals/${dealId}`)).expect(200)).body.deal as DealView;
  return Object.fromEntries(deal.deliverables.map((d) => [d.kind, d.dueDate]));
}

describe("when the publish date moves", () => {
  it("then open items follow their offsets, and done and approved items stay", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2027-03-02" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    // Items in template order: 0 script draft (done), 1 script approval (approved), the rest open.
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-03-02", statuses: { 0: "done", 1: "approved" } });
    await app.database.pool.query("update episodes set target_publish_date = '2027-04-05' where id = $1", [episode.id]);
    const moved = await followPublishDate(app.db, { channelId: world.channel.id, episodeId: episode.id, actorId: world.producer.id });
    expect(moved.moved).toBe(6);
    expect(await datesOf(made.deal.id)).toEqual({
      script_draft: "2027-02-09", // done: stays at 2 Mar − 21
      script_approval: "2027-02-16", // approved: stays at 2 Mar − 14
      draft_cut: "2027-03-29", // 5 Apr − 7 = 29 Mar
      final_approval: "2027-04-02", // 5 Apr − 3
      go_live: "2027-04-05",
      report: "2027-05-05", // 5 Apr + 30: April has 30 days
      invoice: "2027-04-06",
      payment: "2027-05-06", // 5 Apr + 31
    });
    const deal = (await producer.get(api(`/deals/${made.deal.id}`)).expect(200)).body.deal as DealView;
    expect(deal.deliverables.find((d) => d.kind === "draft_cut")!.history[0]).toMatchObject({
      what: "due_moved",
      actorName: "Pim Producer",
      fromDate: "2027-02-23",
      toDate: "2027-03-29",
      note: "Publish date moved to 2027-04-05",
    });
    // Called again (a second instance, a retry): nothing moves twice.
    expect((await followPublishDate(app.db, { channelId: world.channel.id, episodeId: episode.id })).moved).toBe(0);
  });

  it("then a date changed behind Kerf's back is caught up when the deal is next read", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2028-03-01" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2028-03-01" });
    expect((await datesOf(made.deal.id)).final_approval).toBe("2028-02-27"); // 1 Mar 2028 − 3: 29, 28, 27 Feb (leap year)
    await app.database.pool.query("update episodes set target_publish_date = '2027-12-31' where id = $1", [episode.id]);
    const after = await datesOf(made.deal.id, editor);
    expect(after.final_approval).toBe("2027-12-28"); // 31 Dec − 3
    expect(after.report).toBe("2028-01-30"); // 31 Dec + 30
  });

  it("then the slate's publish-date edit moves them too", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2027-01-31" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-01-31" });
    const current = await producer.get(`/api/channels/${world.channel.id}/episodes/${episode.id}`).expect(200);
    const version = current.body.episode?.version ?? current.body.version;
    await producer.send("patch", `/api/channels/${world.channel.id}/episodes/${episode.id}`, { version, targetPublishDate: "2027-02-28" }).expect(200);
    const rows = await app.database.pool.query("select kind::text, due_date::text from deliverables where deal_id = $1 and kind in ('draft_cut', 'report') order by kind::text", [made.deal.id]);
    expect(rows.rows).toEqual([
      { kind: "draft_cut", due_date: "2027-02-21" }, // 28 Feb − 7
      { kind: "report", due_date: "2027-03-30" }, // 28 Feb + 30: 28 Feb + 28 = 28 Mar, + 2 = 30 Mar
    ]);
  });

  it("then items counted from a go-live date of the deal's own stay put", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2027-03-02" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-03-02" });
    await producer.send("patch", api(`/deals/${made.deal.id}`), { goLiveDate: "2027-03-10", version: 1 }).expect(200);
    expect((await datesOf(made.deal.id)).report).toBe("2027-04-09"); // 10 Mar + 30: 10 Mar + 21 = 31 Mar, + 9 = 9 Apr
    await app.database.pool.query("update episodes set target_publish_date = '2027-03-20' where id = $1", [episode.id]);
    await followPublishDate(app.db, { channelId: world.channel.id, episodeId: episode.id });
    const dates = await datesOf(made.deal.id);
    expect(dates.report).toBe("2027-04-09");
    expect(dates.draft_cut).toBe("2027-03-13"); // 20 Mar − 7
  });
});

describe("the publish gate", () => {
  it("when a paid episode enters publish with open items and no disclosure, then it lists each problem", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { stage: "sponsor_read", targetPublishDate: "2027-09-30" });
    const sponsor = await createSponsor(app.db, world.channel.id, { company: "Gatewright" });
    await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-09-30", statuses: { 0: "done", 1: "approved", 2: "approved" }, script: "Great tools, check them out." });
    const problems = await gateProblems(slatePlugs.stageGates, { db: app.db, channelId: world.channel.id, episodeId: episode.id, from: "sponsor_read", to: "publish" });
    expect(problems.map((p) => p.code).sort()).toEqual(["sponsors.no_disclosure_in_description", "sponsors.no_disclosure_in_segment", "sponsors.unapproved_item"].sort());
    expect(problems.find((p) => p.code === "sponsors.unapproved_item")!.message).toBe('Gatewright: "Sponsor\'s final approval" has not been started; it must be approved or done before publishing.');
  });

  it("when everything due before publish is approved and the disclosure is in both places, then the move is clear", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { stage: "edit", targetPublishDate: "2027-09-30" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    await createDeal(app.db, world.channel.id, episode.id, {
      sponsorId: sponsor.id,
      publishDate: "2027-09-30",
      statuses: { 0: "done", 1: "approved", 2: "approved", 3: "approved" },
      script: "This segment is sponsored by Gatewright.",
      descriptionCopy: "#ad Gatewright sponsored this video: gatewright.example",
    });
    expect(await gateProblems(slatePlugs.stageGates, { db: app.db, channelId: world.channel.id, episodeId: episode.id, from: "edit", to: "publish" })).toEqual([]);
  });

  it("when the move doesn't reach publish, goes backward, or the deal is cancelled, then the sponsor gates stay quiet", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { stage: "edit", targetPublishDate: "2027-09-30" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-09-30" });
    expect(await gateProblems(slatePlugs.stageGates, { db: app.db, channelId: world.channel.id, episodeId: episode.id, from: "edit", to: "sponsor_read" })).toEqual([]);
    expect(await gateProblems(slatePlugs.stageGates, { db: app.db, channelId: world.channel.id, episodeId: episode.id, from: "publish", to: "edit" })).toEqual([]);
    const unpaid = await createEpisode(app.db, world.channel.id, { stage: "sponsor_read" });
    await createDeal(app.db, world.channel.id, unpaid.id, { sponsorId: sponsor.id, state: "cancelled" });
    const unpaidProblems = await gateProblems(slatePlugs.stageGates, { db: app.db, channelId: world.channel.id, episodeId: unpaid.id, from: "sponsor_read", to: "publish" });
    expect(unpaidProblems.filter((p) => p.code.startsWith("sponsors."))).toEqual([]);
  });
});

describe("the desk and the board", () => {
  let channel: Awaited<ReturnType<typeof createCrewedChannel>>;
  let desk: Visitor;
  let late: { episodeId: string; sponsorId: string };
  beforeAll(async () => {
    channel = await createCrewedChannel(app.db, "Desk Channel");
    desk = await app.signedIn(channel.producer);
    const t = today();
    const one = await createSponsor(app.db, channel.channel.id, { company: "Alder Optics" });
    const two = await createSponsor(app.db, channel.channel.id, { company: "Birchwire" });
    const lateEpisode = await createEpisode(app.db, channel.channel.id, { title: "Late one", targetPublishDate: shiftDate(t, 2) });
    const laterEpisode = await createEpisode(app.db, channel.channel.id, { title: "Later one", targetPublishDate: shiftDate(t, 60) });
    const items = [
      { kind: "script_draft" as const, title: "Script draft", anchor: "before_publish" as const, offsetDays: 5, ownerRole: null }, // due 3 days ago: overdue
      { kind: "draft_cut" as const, title: "Draft cut", anchor: "before_publish" as const, offsetDays: 0, ownerRole: null }, // due in 2 days
      { kind: "script_approval" as const, title: "Approval", anchor: "before_publish" as const, offsetDays: 1, ownerRole: null }, // sent: waiting
      { kind: "invoice" as const, title: "Invoice", anchor: "before_publish" as const, offsetDays: 4, ownerRole: null }, // overdue money item
    ];
    await createDeal(app.db, channel.channel.id, lateEpisode.id, { sponsorId: one.id, publishDate: shiftDate(t, 2), items, statuses: { 2: "sent" } });
    await createDeal(app.db, channel.channel.id, laterEpisode.id, { sponsorId: two.id, publishDate: shiftDate(t, 60), items: items.slice(0, 2) });
    late = { episodeId: lateEpisode.id, sponsorId: one.id };
  });

  it("groups open items as overdue, due in 7 days, waiting on the sponsor and later, with counts", async () => {
    const view = (await desk.get(`/api/channels/${channel.channel.id}/desk`).expect(200)).body as DeskView;
    expect(view.counts).toEqual({ overdue: 2, changes_asked: 0, due_soon: 1, waiting: 1, later: 2 });
    expect(view.items.filter((i) => i.group === "overdue").map((i) => [i.title, i.daysLate])).toEqual([
      ["Script draft", 3],
      ["Invoice", 2],
    ]);
    expect(view.sponsors.map((s) => s.company)).toEqual(["Alder Optics", "Birchwire"]);
  });

  it("filters by sponsor and by episode, and leaves the money items to fee roles", async () => {
    const bySponsor = (await desk.get(`/api/channels/${channel.channel.id}/desk?sponsorId=${late.sponsorId}`).expect(200)).body as DeskView;
    expect(bySponsor.items.every((i) => i.company === "Alder Optics")).toBe(true);
    const byEpisode = (await desk.get(`/api/channels/${channel.channel.id}/desk?episodeId=${late.episodeId}`).expect(200)).body as DeskView;
    expect(byEpisode.items.map((i) => i.episodeTitle)).toEqual(["Late one", "Late one", "Late one", "Late one"]);
    await desk.get(`/api/channels/${channel.channel.id}/desk?episodeId=not-an-id`).expect(400);
    const crew = await app.signedIn(channel.crew);
    const crewView = (await crew.get(`/api/channels/${channel.channel.id}/desk`).expect(200)).body as DeskView;
    expect(crewView.counts.overdue).toBe(1);
    expect(crewView.items.map((i) => i.kind)).not.toContain("invoice");
  });

  it("flags the episode card when an item is late or due soon, never for money items", async () => {
    const flags = await collectFlags(slatePlugs.boardFlags, app.db, channel.channel.id, [late.episodeId]);
    expect(flags[late.episodeId]!.map((f) => f.label)).toEqual(["Sponsor item late", "Sponsor item due"]);
    expect(flags[late.episodeId]![0]!.detail).not.toContain("Invoice");
  });
});
