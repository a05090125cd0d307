import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { reportTokens } from "../../server/sponsors/review-token";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

async function setting() {
  const crewed = await createCrewedChannel(app.db, "Report Bench");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Three packs", stage: "publish" });
  const sponsor = await createSponsor(app.db, crewed.channel.id, { company: "Ohmwright Cells" });
  const contact = await createContact(app.db, crewed.channel.id, sponsor.id);
  const { deal } = await createDeal(app.db, crewed.channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, publishDate: "2027-03-05", disclosureText: "Paid partnership with Ohmwright Cells." });
  const producer = await app.signedIn(crewed.producer);
  const editor = await app.signedIn(crewed.editor);
  const publish = `/api/channels/${crewed.channel.id}/episodes/${episode.id}/publish`;
  const report = `/api/channels/${crewed.channel.id}/deals/${deal.id}/report`;
  await producer.send("put", publish, { version: 0, titles: ["Which pack lasts?"], chosenTitle: 0, description: "Paid partnership with Ohmwright Cells.\nWhich pack lasts?", chapters: "", timeZone: "UTC", publishAt: null, thumbnailId: null }).expect(200);
  await producer.send("post", `${publish}/go-live`, { videoUrl: "https://video.example/watch?v=abc", publishedAt: "2027-03-05T12:00:00Z", reason: "Test" }).expect(200);
  await producer.send("put", `${publish}/figures/30`, { version: 0, source: "hand", values: { views: 40001, watchHours: 2500.5, linkClicks: 950, codeUses: null } }).expect(200);
  return { deal, contact, producer, editor, report };
}

describe("the sponsor's report", () => {
  it("when the producer makes and sends it, then the contact's link opens it without an account or money, and the report items are done", async () => {
    const { deal, contact, producer, editor, report } = await setting();
    const read = (await producer.get(report).expect(200)).body;
    expect(read.report).toMatchObject({ company: "Ohmwright Cells", liveOn: "2027-03-05", disclosure: { asPublished: "Paid partnership with Ohmwright Cells." }, figures: [{ day: 30, dueOn: "2027-04-04", values: { views: 40001 } }] });
    expect(read.report.money).toBeDefined();
    expect((await editor.get(report).expect(200)).body.report.money).toBeUndefined();
    expect(read.report.deliverables.map((d: { kind: string }) => d.kind)).not.toContain("invoice");

    expect((await producer.send("post", `${report}/send`, {}).expect(409)).body.error.message).toMatch(/Make the PDF first/);
    expect((await producer.send("post", `${report}/pdf`, {}).expect(202)).body.file.state).toBe("queued");
    // The PDF job is proven in the browser journey; here its outcome stands in.
    await app.database.pool.query("update sponsor_reports set state = 'ready', object_key = $2, pages = 1, size_bytes = 10 where deal_id = $1", [deal.id, `${deal.channelId}/reports/x.pdf`]);
    const sent = (await producer.send("post", `${report}/send`, { expiresInDays: 7 }).expect(200)).body;
    expect(sent.file).toMatchObject({ sentTo: contact.email, state: "ready" });
    const items = (await app.database.pool.query("select status from deliverables where deal_id = $1 and kind = 'report'", [deal.id])).rows;
    expect(items.every((i: { status: string }) => i.status === "done")).toBe(true);

    const token = String(sent.url).split("/sponsor-report/")[1]!;
    const visitor = await app.visitor();
    const page = (await visitor.get(`/api/sponsor-report/${token}`).expect(200)).body;
    expect(page.report.money).toBeUndefined();
    expect(page.report.figures[0].values.views).toBe(40001);
    // A link Kerf never signed is not found; one it signed that no longer opens is gone, and says why.
    expect((await visitor.get(`/api/sponsor-report/${token.slice(0, -2)}xx`).expect(404)).body.error.message).toMatch(/not valid/);
    const reportId = (await app.database.pool.query("select id from sponsor_reports where deal_id = $1", [deal.id])).rows[0].id;
    const lapsed = reportTokens(app.deps.env.SESSION_SECRET).link.sign(reportId, new Date(Date.now() - 60_000));
    expect((await visitor.get(`/api/sponsor-report/${lapsed}`).expect(410)).body.error.message).toMatch(/has expired\. Ask the channel for a new link/);
    // Sending again retires the link before.
    await producer.send("post", `${report}/send`, { expiresInDays: 8 }).expect(200);
    expect((await visitor.get(`/api/sponsor-report/${token}`).expect(410)).body.error.message).toMatch(/A newer link to this report was sent/);
  });
});
