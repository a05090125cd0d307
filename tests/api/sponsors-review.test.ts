import { randomUUID } from "node:crypto";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import { Readable } from "node:stream";
import { afterAll, beforeAll, describe, expect, it, onTestFinished } from "vitest";
import { reviewTokens } from "../../server/sponsors/review-token";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { uniqueEmail } from "../factories/invitations";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { mailJobsTo } from "../support/jobs";
import { linkIn, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import type { DealView } from "../../shared/sponsors/schemas";

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let producer: Visitor;

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Review Bench");
  producer = await app.signedIn(world.producer);
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;
const SCRIPT = "This video is sponsored by Northbeam Tools. Their supply holds 0.1 mV ripple. Use code GANTRY10.";

/** A deal with a contact, and a review link for its script approval sent through the API. */
async function sentLink(options: { contactEmail?: string } = {}) {
  const episode = await createEpisode(app.db, world.channel.id, { title: "Ripple test", targetPublishDate: "2027-07-15" });
  const sponsor = await createSponsor(app.db, world.channel.id, { company: "Northbeam Tools" });
  const contact = await createContact(app.db, world.channel.id, sponsor.id, { name: "Rosa Lindgren", email: options.contactEmail ?? uniqueEmail("rosa") });
  const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, publishDate: "2027-07-15", script: SCRIPT, fee: "9876.00" });
  const item = made.items.find((i) => i.kind === "script_approval")!;
  const sent = await producer.send("post", api(`/deals/${made.deal.id}/review-links`), { deliverableId: item.id, contactId: contact.id, expiresInDays: 7 }).expect(201);
  const token = (sent.body.url as string).split("/review/")[1]!;
  return { episode, sponsor, contact, deal: made.deal, items: made.items, item, link: sent.body.link, url: sent.body.url as string, token };
}

async function itemStatus(id: string): Promise<string> {
  return (await app.database.pool.query("select status::text from deliverables where id = $1", [id])).rows[0].status;
}

describe("sending a review link", () => {
  it("when the producer sends it, then the contact gets the link by e-mail and the item waits on the sponsor", async () => {
    const email = uniqueEmail("rosa");
    const sent = await sentLink({ contactEmail: email });
    const mail = await waitForMail(email);
    expect(mail.subject).toBe("Review Bench asks you to review: Sponsor approves the script");
    expect(linkIn(mail, /https?:\/\/\S+\/review\/\S+/)).toBe(sent.url);
    expect(await itemStatus(sent.item.id)).toBe("sent");
    const deal = (await producer.get(api(`/deals/${sent.deal.id}`)).expect(200)).body.deal as DealView;
    expect(deal.reviewLinks![0]).toMatchObject({ state: "open", contactName: "Rosa Lindgren", deliverableTitle: "Sponsor approves the script" });
    expect(deal.deliverables.find((d) => d.id === sent.item.id)!.history[0]).toMatchObject({ what: "review_sent", toStatus: "sent" });
  });

  it("when the sender adds words of their own, then it is refused, and the mail to the sponsor carries only Kerf's words and the names", async () => {
    const email = uniqueEmail("rosa");
    const sent = await sentLink({ contactEmail: email });
    const withMessage = await producer
      .send("post", api(`/deals/${sent.deal.id}/review-links`), { deliverableId: sent.item.id, contactId: sent.contact.id, message: "Urgent: pay the invoice at http://elsewhere.example" })
      .expect(400);
    expect(withMessage.body.error.code).toBe("validation_failed");
    expect(await app.database.pool.query("select 1 from review_links where deal_id = $1", [sent.deal.id])).toHaveProperty("rowCount", 1);

    const mail = await waitForMail(email);
    expect(mail.text).toBe(
      [
        "Hello Rosa Lindgren,",
        "",
        `Pim Producer of Review Bench asks you to review "Sponsor approves the script" for Northbeam Tools's segment in "Ripple test".`,
        "",
        "Open this link to read the script (and watch the cut, if one is attached), then approve it or ask for changes. You don't need an account:",
        sent.url,
        "",
        `The link is for this one deal, works for one decision, and expires on ${formatInstantNamingZone(sent.link.expiresAt, "UTC")}.`,
        "",
      ].join("\n"),
    );
  });

  it("when the item is a money item or the contact is someone else's, then it is refused and nothing is sent", async () => {
    const sent = await sentLink();
    const invoice = sent.items.find((i) => i.kind === "invoice")!;
    const money = await producer.send("post", api(`/deals/${sent.deal.id}/review-links`), { deliverableId: invoice.id, contactId: sent.contact.id }).expect(400);
    expect(money.body.error.fields).toEqual({ deliverableId: "Pick one of this deal's items for the sponsor to review." });
    const other = await createSponsor(app.db, world.channel.id);
    const stranger = await createContact(app.db, world.channel.id, other.id);
    const wrong = await producer.send("post", api(`/deals/${sent.deal.id}/review-links`), { deliverableId: sent.item.id, contactId: stranger.id }).expect(400);
    expect(wrong.body.error.fields).toEqual({ contactId: "Pick one of this sponsor's contacts." });
    // A refused request queued no mail (mail is queued before the answer, so none can follow it).
    expect(await mailJobsTo(app.database.pool, stranger.email)).toEqual([]);
    expect(await mailJobsTo(app.database.pool, sent.contact.email)).toHaveLength(1);
  });

  it("when the editor or crew try to send one, then it is refused", async () => {
    const sent = await sentLink();
    for (const person of [world.editor, world.crew]) {
      const agent = await app.signedIn(person);
      await agent.send("post", api(`/deals/${sent.deal.id}/review-links`), { deliverableId: sent.item.id, contactId: sent.contact.id }).expect(403);
    }
    // Only the producer's own link exists, and only its mail was queued.
    expect((await app.database.pool.query("select count(*)::int as n from review_links where deal_id = $1", [sent.deal.id])).rows[0].n).toBe(1);
    expect(await mailJobsTo(app.database.pool, sent.contact.email)).toHaveLength(1);
  });
});

describe("the sponsor's review page", () => {
  it("when the contact opens the link without an account, then they see the script and the segment, never the fee", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const page = await visitor.get(`/api/review/${sent.token}`).expect(200);
    expect(page.body).toMatchObject({
      state: "open",
      company: "Northbeam Tools",
      contactName: "Rosa Lindgren",
      episodeTitle: "Ripple test",
      deliverableTitle: "Sponsor approves the script",
      script: SCRIPT,
      segmentSeconds: 60,
      talkingPoints: ["Holds 0.1 mV ripple"],
      promoCode: "GANTRY10",
      cutUrl: null,
    });
    const text = JSON.stringify(page.body);
    expect(text).not.toMatch(/9876|fee|currency|paymentTerms|invoice/i);
  });

  it("when the contact asks for changes, then it needs the page's CSRF token, moves the item, records their name and mails the producer", async () => {
    // The producer reads Kerf in Kolkata (UTC+5:30 all year, no summer time: IANA tz database, zone Asia/Kolkata).
    await app.database.pool.query("update users set time_zone = 'Asia/Kolkata' where id = $1", [world.producer.id]);
    onTestFinished(async () => void (await app.database.pool.query("update users set time_zone = 'UTC' where id = $1", [world.producer.id])));
    const sent = await sentLink();
    const visitor = await app.visitor();
    const noToken = await visitor.agent.post(`/api/review/${sent.token}/decision`).send({ decision: "changes_asked", comment: "Mention the warranty." });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe("csrf_failed");
    expect(await itemStatus(sent.item.id)).toBe("sent");

    const blank = await decideAsSeen(visitor, sent.token, { decision: "changes_asked", comment: "" }, 400);
    expect(blank.body.error.fields).toEqual({ comment: "Say what should change." });

    const decided = await decideAsSeen(visitor, sent.token, { decision: "changes_asked", comment: "Please mention the two-year warranty." }, 200);
    expect(decided.body).toMatchObject({ state: "decided", decision: "changes_asked", contactName: "Rosa Lindgren" });
    expect(await itemStatus(sent.item.id)).toBe("changes_asked");

    const deal = (await producer.get(api(`/deals/${sent.deal.id}`)).expect(200)).body.deal as DealView;
    const event = deal.deliverables.find((d) => d.id === sent.item.id)!.history[0]!;
    expect(event).toMatchObject({ what: "review_decision", actorKind: "sponsor", actorName: "Rosa Lindgren", fromStatus: "sent", toStatus: "changes_asked", note: "Please mention the two-year warranty." });
    expect(Date.now() - new Date(event.at).getTime()).toBeLessThan(60_000);

    const mail = await waitForMail(world.producer.email);
    expect(mail.subject).toBe('Rosa Lindgren of Northbeam Tools asked for changes to "Sponsor approves the script"');
    expect(mail.text).toContain("Please mention the two-year warranty.");
    // The mail writes when the sponsor decided in the producer's own zone, and names it.
    const decidedAt = (await app.database.pool.query("select decided_at from review_links where id = $1", [sent.link.id])).rows[0].decided_at as Date;
    expect(mail.text).toContain(`on ${formatInstantNamingZone(decidedAt, "Asia/Kolkata")}.`);
    expect(mail.text).toMatch(/, \d{2}:\d{2} UTC\+5:30 \(Asia\/Kolkata\)\./);
  });

  it("when a used link is opened or decided again, then it says it was used and changes nothing", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const { seen } = (await visitor.get(`/api/review/${sent.token}`).expect(200)).body;
    await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen }).expect(200);
    expect(await itemStatus(sent.item.id)).toBe("approved");
    const again = await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "changes_asked", comment: "Actually, no.", seen }).expect(410);
    expect(again.body.error.message).toMatch(/already been used/);
    expect(await itemStatus(sent.item.id)).toBe("approved");
    expect((await visitor.get(`/api/review/${sent.token}`).expect(200)).body).toMatchObject({ state: "decided", decision: "approved" });
  });

  it("when two decisions arrive at once, then exactly one is recorded", async () => {
    const sent = await sentLink();
    const [a, b] = await Promise.all([app.visitor(), app.visitor()]);
    const { seen } = (await a.get(`/api/review/${sent.token}`).expect(200)).body;
    const answers = await Promise.all([
      a.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen }),
      b.send("post", `/api/review/${sent.token}/decision`, { decision: "changes_asked", comment: "Shorter, please.", seen }),
    ]);
    expect(answers.map((r) => r.status).sort()).toEqual([200, 410]);
    const events = await app.database.pool.query("select count(*)::int as n from deliverable_events where deliverable_id = $1 and what = 'review_decision'", [sent.item.id]);
    expect(events.rows[0].n).toBe(1);
  });

  it("when the link is revoked, then its page says so and no decision is taken", async () => {
    const sent = await sentLink();
    await producer.send("delete", api(`/deals/${sent.deal.id}/review-links/${sent.link.id}`)).expect(204);
    expect(await itemStatus(sent.item.id)).toBe("not_started");
    const visitor = await app.visitor();
    expect((await visitor.get(`/api/review/${sent.token}`).expect(200)).body).toEqual({ state: "revoked", channelName: "Review Bench" });
    const refused = await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen: "AAAAAAAAAAAAAAAAAAAAAA" }).expect(410);
    expect(refused.body.error.message).toMatch(/withdrawn/);
    expect(await itemStatus(sent.item.id)).toBe("not_started");
  });

  it("when a used link is revoked, then the decision stands", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    await decideAsSeen(visitor, sent.token, { decision: "approved", comment: null }, 200);
    await producer.send("delete", api(`/deals/${sent.deal.id}/review-links/${sent.link.id}`)).expect(409);
    expect(await itemStatus(sent.item.id)).toBe("approved");
  });

  it("when the link has expired, then its page says so and no decision is taken", async () => {
    const sent = await sentLink();
    const past = new Date(Math.floor(Date.now() / 1000) * 1000 - 60_000);
    await app.database.pool.query("update review_links set expires_at = $2 where id = $1", [sent.link.id, past]);
    // The expiry is signed into the token too: re-sign for the row's new expiry, as the server would have.
    const token = reviewTokens(app.deps.env.SESSION_SECRET).sign(sent.link.id, past);
    const visitor = await app.visitor();
    expect((await visitor.get(`/api/review/${token}`).expect(200)).body).toEqual({ state: "expired", channelName: "Review Bench" });
    const refused = await visitor.send("post", `/api/review/${token}/decision`, { decision: "approved", comment: null, seen: "AAAAAAAAAAAAAAAAAAAAAA" }).expect(410);
    expect(refused.body.error.message).toMatch(/expired/);
    expect(await itemStatus(sent.item.id)).toBe("sent");
    // And the old token, whose signed expiry no longer matches the row, is not a link at all.
    await visitor.get(`/api/review/${sent.token}`).expect(404);
  });

  it("when the token is altered, forged or made up, then it is not a link", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const [id, expiry, signature] = sent.token.split(".") as [string, string, string];
    const flipped = signature.slice(0, -1) + (signature.endsWith("A") ? "B" : "A");
    const laterExpiry = `${id}.${Number(expiry) + 86_400}.${signature}`;
    const forged = reviewTokens("some-other-secret-some-other-secret-0000").sign(sent.link.id, new Date(Number(expiry) * 1000));
    const otherId = `${randomUUID().replaceAll("-", "")}.${expiry}.${signature}`;
    for (const token of [`${id}.${expiry}.${flipped}`, laterExpiry, forged, otherId, "nonsense", ""]) {
      const answer = await visitor.get(`/api/review/${encodeURIComponent(token)}`);
      expect(answer.status, token).toBe(404);
      const decision = await visitor.send("post", `/api/review/${encodeURIComponent(token)}/decision`, { decision: "approved", comment: null, seen: "AAAAAAAAAAAAAAAAAAAAAA" });
      expect(decision.status, token).toBe(404);
    }
    expect(await itemStatus(sent.item.id)).toBe("sent");
  });

  it("when a cut is attached, then the page plays it from a short-lived presigned address", async () => {
    const sent = await sentLink();
    const key = `${world.channel.id}/${sent.episode.id}/${randomUUID()}`;
    const bytes = Buffer.from("not really a video, but bytes the store keeps");
    await app.deps.storage.putStream(key, Readable.from(bytes), { contentType: "video/mp4", size: bytes.length });
    const clip = await app.database.pool.query(
      `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms, recorded_at)
       values ($1, $2, $3, 'segment-v2.mp4', 'video/mp4', $4, 62000, now()) returning id`,
      [world.channel.id, sent.episode.id, key, bytes.length],
    );
    const editor = await app.signedIn(world.editor);
    const set = await editor.send("put", api(`/deals/${sent.deal.id}/cut`), { clipId: clip.rows[0].id, timing: null, version: 1 }).expect(200);
    expect(set.body.deal.cut.clip).toEqual({ id: clip.rows[0].id, fileName: "segment-v2.mp4", durationSeconds: 62, frameRate: null });
    expect(set.body.deal.cut.segment).toEqual({ startSeconds: 0, endSeconds: 62, wholeFile: true, frameRate: null });

    const page = await (await app.visitor()).get(`/api/review/${sent.token}`).expect(200);
    const url = new URL(page.body.cutUrl);
    expect(url.searchParams.get("X-Amz-Expires")).toBe("3600");
    expect(url.searchParams.get("X-Amz-Signature")).toMatch(/^[0-9a-f]{64}$/);
    const fetched = await fetch(url);
    expect(fetched.status).toBe(200);
    expect(Buffer.from(await fetched.arrayBuffer()).toString()).toBe(bytes.toString());

    const elsewhere = await createEpisode(app.db, world.channel.id);
    const otherClip = await app.database.pool.query(
      `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, recorded_at) values ($1, $2, $3, 'x.mp4', 'video/mp4', 1, now()) returning id`,
      [world.channel.id, elsewhere.id, `${key}-other`],
    );
    const wrong = await editor.send("put", api(`/deals/${sent.deal.id}/cut`), { clipId: otherClip.rows[0].id, timing: null, version: 2 }).expect(400);
    expect(wrong.body.error.fields).toEqual({ clipId: "Pick a clip of this episode's footage." });
  });
});

/** The decision as the page sends it: with what the page showed when it was read. */
async function decideAsSeen(visitor: Visitor, token: string, body: { decision: string; comment: string | null }, status: number) {
  const page = await visitor.get(`/api/review/${token}`).expect(200);
  return visitor.send("post", `/api/review/${token}/decision`, { ...body, seen: page.body.seen }).expect(status);
}

async function linkRow(id: string) {
  return (await app.database.pool.query("select decided_at, decision from review_links where id = $1", [id])).rows[0];
}

describe("a review link closes with what it belongs to", () => {
  const closings: [string, (sent: Awaited<ReturnType<typeof sentLink>>) => Promise<unknown>, RegExp][] = [
    ["the contact is deleted", (sent) => producer.send("delete", api(`/sponsors/${sent.sponsor.id}/contacts/${sent.contact.id}`)).expect(204), /no longer lists you/],
    ["the deal is cancelled", (sent) => app.database.pool.query("update deals set state = 'cancelled' where id = $1", [sent.deal.id]), /deal was cancelled/],
    ["the item is removed", (sent) => producer.send("delete", api(`/deliverables/${sent.item.id}`)).expect(204), /item .* was removed/],
    ["the item is marked done", (sent) => app.database.pool.query("update deliverables set status = 'done' where id = $1", [sent.item.id]), /already settled/],
  ];

  it.each(closings)("when %s, then the link's page says it closed, a decision answers 410 and nothing is used up or changed", async (_when, close, reason) => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const opened = await visitor.get(`/api/review/${sent.token}`).expect(200);
    await close(sent);
    const statusBefore = (await app.database.pool.query("select status::text from deliverables where id = $1", [sent.item.id])).rows[0]?.status ?? null;

    const page = await visitor.get(`/api/review/${sent.token}`).expect(200);
    expect(page.body).toMatchObject({ state: "closed", channelName: "Review Bench", reason: expect.stringMatching(reason) });
    const refused = await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen: opened.body.seen }).expect(410);
    expect(refused.body.error).toMatchObject({ code: "gone", message: expect.stringMatching(reason) });
    expect(await linkRow(sent.link.id)).toMatchObject({ decided_at: null, decision: null });
    const statusAfter = (await app.database.pool.query("select status::text from deliverables where id = $1", [sent.item.id])).rows[0]?.status ?? null;
    expect(statusAfter).toBe(statusBefore);
    expect((await app.database.pool.query("select count(*)::int as n from deliverable_events where deliverable_id = $1 and what = 'review_decision'", [sent.item.id])).rows[0].n).toBe(0);
  });

  it("when the deal is cancelled, then the producer sees the link closed and can't send a new one", async () => {
    const sent = await sentLink();
    await app.database.pool.query("update deals set state = 'cancelled' where id = $1", [sent.deal.id]);
    const deal = (await producer.get(api(`/deals/${sent.deal.id}`)).expect(200)).body.deal as DealView;
    expect(deal.reviewLinks![0]).toMatchObject({ id: sent.link.id, state: "closed" });
    const refused = await producer.send("post", api(`/deals/${sent.deal.id}/review-links`), { deliverableId: sent.item.id, contactId: sent.contact.id }).expect(409);
    expect(refused.body.error.message).toBe("This deal is cancelled: there is nothing left for the sponsor to review.");
  });

  it("when the item is already done, then no link is sent for it", async () => {
    const sent = await sentLink();
    await app.database.pool.query("update deliverables set status = 'done' where id = $1", [sent.item.id]);
    const refused = await producer.send("post", api(`/deals/${sent.deal.id}/review-links`), { deliverableId: sent.item.id, contactId: sent.contact.id }).expect(400);
    expect(refused.body.error.fields).toEqual({ deliverableId: "This item is already settled (Done); pick one still open." });
    expect((await app.database.pool.query("select count(*)::int as n from review_links where deal_id = $1", [sent.deal.id])).rows[0].n).toBe(1);
  });
});

describe("a decision applies to what the sponsor saw", () => {
  it("when the script changes after the page was read, then the decision answers 409 with the page as it is now and changes nothing", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const seen = (await visitor.get(`/api/review/${sent.token}`).expect(200)).body.seen as string;
    expect(seen).toMatch(/^[A-Za-z0-9_-]{16,}$/);
    await app.database.pool.query("update deals set script = $2 where id = $1", [sent.deal.id, `${SCRIPT} Now with a lifetime warranty.`]);

    const stale = await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen }).expect(409);
    expect(stale.body.error).toMatchObject({ code: "conflict", message: "The channel changed this review after you opened it. Read it again below, then decide." });
    expect(stale.body.page).toMatchObject({ state: "open", script: `${SCRIPT} Now with a lifetime warranty.` });
    expect(stale.body.page.seen).not.toBe(seen);
    expect(await linkRow(sent.link.id)).toMatchObject({ decided_at: null });
    expect(await itemStatus(sent.item.id)).toBe("sent");

    await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen: stale.body.page.seen }).expect(200);
    expect(await itemStatus(sent.item.id)).toBe("approved");
  });

  it("when the item's status was changed after the page was read, then the old page's decision does not flip it", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const seen = (await visitor.get(`/api/review/${sent.token}`).expect(200)).body.seen as string;
    await app.database.pool.query("update deliverables set status = 'changes_asked' where id = $1", [sent.item.id]);
    await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null, seen }).expect(409);
    expect(await itemStatus(sent.item.id)).toBe("changes_asked");
  });

  it("when the decision names no page it saw, then it is refused", async () => {
    const sent = await sentLink();
    const visitor = await app.visitor();
    const refused = await visitor.send("post", `/api/review/${sent.token}/decision`, { decision: "approved", comment: null }).expect(400);
    expect(refused.body.error.fields).toEqual({ seen: "Reload the page, then decide." });
    expect(await itemStatus(sent.item.id)).toBe("sent");
  });
});
