import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { slatePlugs } from "../../server/app";
import { gateProblems } from "../../server/seams/stage-gates";
import { suggestedTemplateItems } from "../../shared/sponsors/deliverables";
import type { DealView, DeskView } from "../../shared/sponsors/schemas";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let producer: Visitor;

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Approval Bench");
  producer = await app.signedIn(world.producer);
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;
const PUBLISH = "2027-09-30";

/**
 * A paid episode in the sponsor read whose deal comes from the suggested template, with its disclosure
 * in place and the cut items settled: only the script's two items can still hold the publish gate.
 */
async function dealAwaitingScript() {
  const episode = await createEpisode(app.db, world.channel.id, { title: "Clamp shoot-out", stage: "sponsor_read", targetPublishDate: PUBLISH });
  const sponsor = await createSponsor(app.db, world.channel.id, { company: "Quillon Clamps" });
  const contact = await createContact(app.db, world.channel.id, sponsor.id, { name: "Ada Brenner" });
  const made = await createDeal(app.db, world.channel.id, episode.id, {
    sponsorId: sponsor.id,
    contactId: contact.id,
    publishDate: PUBLISH,
    statuses: { 2: "done", 3: "approved" },
    script: "This segment is sponsored by Quillon Clamps.",
    descriptionCopy: "#ad Quillon Clamps sponsored this video.",
  });
  const item = (kind: string) => made.items.find((i) => i.kind === kind)!;
  return { episode, contact, deal: made.deal, draft: item("script_draft"), approval: item("script_approval") };
}

async function sendForReview(dealId: string, deliverableId: string, contactId: string): Promise<string> {
  const sent = await producer.send("post", api(`/deals/${dealId}/review-links`), { deliverableId, contactId, expiresInDays: 7 }).expect(201);
  return (sent.body.url as string).split("/review/")[1]!;
}

async function decide(token: string, decision: "approved" | "changes_asked", comment: string | null = null) {
  const visitor = await app.visitor();
  const { seen } = (await visitor.get(`/api/review/${token}`).expect(200)).body;
  await visitor.send("post", `/api/review/${token}/decision`, { decision, comment, seen }).expect(200);
}

const publishProblems = (episodeId: string) => gateProblems(slatePlugs.stageGates, { db: app.db, channelId: world.channel.id, episodeId, from: "sponsor_read", to: "publish" });

async function itemsOf(dealId: string) {
  const deal = (await producer.get(api(`/deals/${dealId}`)).expect(200)).body.deal as DealView;
  return Object.fromEntries(deal.deliverables.map((d) => [d.kind, d]));
}

describe("a sponsor's decision through a review link", () => {
  it("approving the script draft through its link lets the publish gate pass for that item", async () => {
    const made = await dealAwaitingScript();
    const before = await publishProblems(made.episode.id);
    expect(before.map((p) => p.message)).toEqual([
      'Quillon Clamps: "Script draft to the sponsor" has not been started; it must be approved or done before publishing.',
      'Quillon Clamps: "Sponsor approves the script" has not been started; it must be approved or done before publishing.',
    ]);

    await decide(await sendForReview(made.deal.id, made.draft.id, made.contact.id), "approved");

    expect(await publishProblems(made.episode.id)).toEqual([]);
    const items = await itemsOf(made.deal.id);
    expect(items.script_draft!.status).toBe("approved");
    expect(items.script_approval!.status).toBe("approved");
    // The paired item's history says why it moved, under the contact's name.
    expect(items.script_approval!.history[0]).toMatchObject({ what: "status", actorKind: "sponsor", actorName: "Ada Brenner", fromStatus: "not_started", toStatus: "approved", note: 'Approved with "Script draft to the sponsor"' });
    // Items the template doesn't pair with the script are left as they were.
    expect(items.report!.status).toBe("not_started");
  });

  it("when the sponsor asks for changes to the script draft, then its approval item stays open and the gate still holds", async () => {
    const made = await dealAwaitingScript();
    await decide(await sendForReview(made.deal.id, made.draft.id, made.contact.id), "changes_asked", "Say the jaw width.");

    const items = await itemsOf(made.deal.id);
    expect(items.script_draft!.status).toBe("changes_asked");
    expect(items.script_approval!.status).toBe("not_started");
    expect((await publishProblems(made.episode.id)).map((p) => p.message)).toEqual([
      'Quillon Clamps: "Script draft to the sponsor" came back: changes were asked; it must be approved or done before publishing.',
      'Quillon Clamps: "Sponsor approves the script" has not been started; it must be approved or done before publishing.',
    ]);
  });

  it("when the link was sent for the approval item itself, then the script draft it approves follows", async () => {
    const made = await dealAwaitingScript();
    await decide(await sendForReview(made.deal.id, made.approval.id, made.contact.id), "approved");
    expect((await itemsOf(made.deal.id)).script_draft!.status).toBe("approved");
    expect(await publishProblems(made.episode.id)).toEqual([]);
  });

  it("when a deal is made from a template through the API, then its items are paired as the template says", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: PUBLISH });
    const sponsor = await createSponsor(app.db, world.channel.id);
    const template = await producer.send("post", api("/deal-templates"), { name: "Paired read", items: suggestedTemplateItems }).expect(201);
    expect(template.body.template.items.map((i: { approves: number | null }) => i.approves)).toEqual([null, 0, null, 2, null, null, null, null]);
    const made = await producer
      .send("post", api("/deals"), {
        episodeId: episode.id,
        sponsorId: sponsor.id,
        templateId: template.body.template.id,
        state: "signed",
        placement: "middle",
        segmentSeconds: 60,
        link: null,
        promoCode: null,
        disclosureText: null,
        exclusivityNotes: null,
        descriptionCopy: null,
        contactId: null,
        hostId: null,
        goLiveDate: null,
        money: { fee: 100, currency: "eur", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null },
      })
      .expect(201);
    const rows = await app.database.pool.query<{ kind: string; approves: string | null }>(
      "select d.kind::text, p.kind::text as approves from deliverables d left join deliverables p on p.id = d.approves_id where d.deal_id = $1 and d.approves_id is not null order by d.position",
      [made.body.deal.id],
    );
    expect(rows.rows).toEqual([
      { kind: "script_approval", approves: "script_draft" },
      { kind: "final_approval", approves: "draft_cut" },
    ]);
  });

  it("when a template pairs an item with itself or with a row it doesn't have, then it is refused", async () => {
    const [draft, approval] = suggestedTemplateItems;
    for (const approves of [1, 5]) {
      const refused = await producer.send("post", api("/deal-templates"), { name: "Broken pairs", items: [draft, { ...approval, approves }] }).expect(400);
      expect(refused.body.error.fields).toEqual({ "items.1.approves": "Pick another item of this template for this one to approve." });
    }
  });
});

describe("the desk", () => {
  it("lists an item the sponsor asked changes to among the things to act on now, whatever its due date", async () => {
    const made = await dealAwaitingScript();
    await decide(await sendForReview(made.deal.id, made.draft.id, made.contact.id), "changes_asked", "Shorter, please.");
    const desk = (await producer.get(api(`/desk?episodeId=${made.episode.id}`)).expect(200)).body as DeskView;
    const draft = desk.items.find((i) => i.id === made.draft.id)!;
    // Due 21 days before a publish date months away: by date alone it would wait under "later".
    expect(draft).toMatchObject({ group: "changes_asked", status: "changes_asked", dueDate: "2027-09-09", canEdit: true });
    expect(desk.counts.changes_asked).toBe(1);
  });
});
