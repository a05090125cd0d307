import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { DealView, SponsorDetail } from "../../shared/sponsors/schemas";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createSponsor, createTemplate } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

// A deal signed before its episode exists: recorded against the sponsor, tied to the episode later.

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let other: Awaited<ReturnType<typeof createCrewedChannel>>;
let producer: Visitor;

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Waiting Deals");
  other = await createCrewedChannel(app.db, "Other Bench");
  producer = await app.signedIn(world.producer);
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;
const segment = { state: "signed", placement: "middle", segmentSeconds: 60, link: null, promoCode: null, disclosureText: null, exclusivityNotes: null, descriptionCopy: null, contactId: null, hostId: null, goLiveDate: null };
const money = { fee: 900, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null };

async function recordWaitingDeal(): Promise<DealView> {
  const sponsor = await createSponsor(app.db, world.channel.id);
  const template = await createTemplate(app.db, world.channel.id);
  const body = { sponsorId: sponsor.id, templateId: template.id, ...segment, money };
  return (await producer.send("post", api("/deals"), body).expect(201)).body.deal as DealView;
}

const datesOf = (deal: DealView) => Object.fromEntries(deal.deliverables.map((d) => [d.kind, d.dueDate]));

describe("a deal recorded against its sponsor before its episode", () => {
  it("is made without an episode, and its items wait for a publish date", async () => {
    const deal = await recordWaitingDeal();
    expect(deal).toMatchObject({ episodeId: null, episodeTitle: null, publishDate: null });
    expect(deal.deliverables.length).toBeGreaterThan(0);
    expect(deal.deliverables.every((d) => d.dueDate === null)).toBe(true);
    const sponsor = (await producer.get(api(`/sponsors/${deal.sponsor.id}`)).expect(200)).body.sponsor as SponsorDetail;
    expect(sponsor.deals).toEqual([expect.objectContaining({ id: deal.id, episodeId: null, episodeTitle: null, version: deal.version })]);
  });

  it("takes its dates from the episode it is tied to, then follows that episode's publish date", async () => {
    const deal = await recordWaitingDeal();
    const episode = await createEpisode(app.db, world.channel.id, { title: "Gantry frame", targetPublishDate: "2027-03-02" });
    const tied = (await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: episode.id, version: deal.version }).expect(200)).body.deal as DealView;
    expect(tied).toMatchObject({ episodeId: episode.id, episodeTitle: "Gantry frame", publishDate: "2027-03-02" });
    // Calendar arithmetic from 2 Mar 2027: 21 and 7 days before, 30 days after (1 Apr).
    expect(datesOf(tied)).toMatchObject({ script_draft: "2027-02-09", draft_cut: "2027-02-23", go_live: "2027-03-02", report: "2027-04-01" });
    expect(tied.deliverables.find((d) => d.kind === "draft_cut")!.history[0]).toMatchObject({ what: "due_moved", fromDate: null, toDate: "2027-02-23", note: 'Tied to the episode "Gantry frame"' });
    expect((await producer.get(api(`/episodes/${episode.id}/deals`)).expect(200)).body.deals.map((d: DealView) => d.id)).toEqual([deal.id]);
    await app.database.pool.query("update episodes set target_publish_date = '2027-04-05' where id = $1", [episode.id]);
    const after = (await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal as DealView;
    expect(datesOf(after).draft_cut).toBe("2027-03-29"); // 5 Apr − 7
  });

  it("keeps waiting when tied to an episode that has no publish date yet", async () => {
    const deal = await recordWaitingDeal();
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: null });
    const tied = (await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: episode.id, version: deal.version }).expect(200)).body.deal as DealView;
    expect(tied.episodeId).toBe(episode.id);
    expect(tied.deliverables.every((d) => d.dueDate === null)).toBe(true);
    await app.database.pool.query("update episodes set target_publish_date = '2027-03-02' where id = $1", [episode.id]);
    expect(datesOf((await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal).go_live).toBe("2027-03-02");
  });

  it("refuses another channel's episode, at creation and when tying, and changes nothing", async () => {
    const theirs = await createEpisode(app.db, other.channel.id, { targetPublishDate: "2027-03-02" });
    const deal = await recordWaitingDeal();
    const refused = await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: theirs.id, version: deal.version }).expect(400);
    expect(refused.body.error.fields).toEqual({ episodeId: "Pick an episode of this channel." });
    const sponsor = await createSponsor(app.db, world.channel.id);
    await producer.send("post", api("/deals"), { episodeId: theirs.id, sponsorId: sponsor.id, templateId: null, ...segment, money }).expect(400);
    const still = (await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal as DealView;
    expect(still).toMatchObject({ episodeId: null, version: deal.version });
    // Another channel's deal is not there at all.
    const outsider = await app.signedIn(other.producer);
    await outsider.send("put", `/api/channels/${other.channel.id}/deals/${deal.id}/episode`, { episodeId: theirs.id, version: deal.version }).expect(404);
  });

  it("is tied once: a second tie, a stale version and a bad body are refused", async () => {
    const deal = await recordWaitingDeal();
    const first = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2027-03-02" });
    const second = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2027-05-02" });
    await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: first.id, version: deal.version + 1 }).expect(409);
    await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: "not-an-id", version: deal.version }).expect(400);
    const tied = (await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: first.id, version: deal.version }).expect(200)).body.deal as DealView;
    const again = await producer.send("put", api(`/deals/${deal.id}/episode`), { episodeId: second.id, version: tied.version }).expect(409);
    expect(again.body.error.message).toMatch(/already tied/);
  });

  it("sends no review link while it waits: the sponsor reviews the episode's segment", async () => {
    const deal = await recordWaitingDeal();
    const contact = await createContact(app.db, world.channel.id, deal.sponsor.id);
    const item = deal.deliverables.find((d) => d.kind === "script_approval")!;
    const refused = await producer.send("post", api(`/deals/${deal.id}/review-links`), { deliverableId: item.id, contactId: contact.id, expiresInDays: 7 }).expect(409);
    expect(refused.body.error.message).toMatch(/Tie this deal to its episode first/);
  });
});
