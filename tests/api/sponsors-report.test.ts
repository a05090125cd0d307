import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { type ReportJob, settleGivenUpReport } from "../../server/sponsors/report-pdf";
import { SPONSOR_REPORT_GIVEN_UP_QUEUE, SPONSOR_REPORT_QUEUE } from "../../server/sponsors/reports.service";
import { reportTokens } from "../../server/sponsors/review-token";
import { settledJobs } from "../support/jobs";
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

  /*
   * A PDF whose server stopped during both its runs. The test plays that server with pg-boss's own
   * calls: it takes each run (`fetch`) and lets pg-boss give up on it as its shutdown does (`fail`).
   * Only the worker that settles given-up jobs runs, so nothing else takes the PDF's jobs.
   */
  it("when its server stops during both runs of the PDF, then the report fails, saying so, instead of waiting for good", async () => {
    const { deal, producer, report } = await setting();
    await app.jobs.boss.work<ReportJob>(SPONSOR_REPORT_GIVEN_UP_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, ([job]) => settleGivenUpReport({ db: app.db, jobs: app.jobs }, job!.data));
    await producer.send("post", `${report}/pdf`, {}).expect(202);
    const reportId = (await app.database.pool.query("select id from sponsor_reports where deal_id = $1", [deal.id])).rows[0].id as string;
    const ours = (job: { data: Record<string, unknown> }) => job.data.reportId === reportId;
    for (let run = 1; run <= 2; run++) {
      let job: { id: string } | undefined;
      await expect.poll(async () => (job = (await app.jobs.boss.fetch<ReportJob>(SPONSOR_REPORT_QUEUE, { batchSize: 20 })).find(ours)), { timeout: 10_000, interval: 50 }).toBeDefined();
      await app.jobs.boss.fail(SPONSOR_REPORT_QUEUE, job!.id, { message: "pg-boss shut down while active" });
    }
    const [copy] = await settledJobs(app.database.pool, SPONSOR_REPORT_GIVEN_UP_QUEUE, ours, 1);
    expect(copy).toMatchObject({ state: "completed", output: { outcome: "failed" } });
    expect((await producer.get(report).expect(200)).body.file).toMatchObject({
      state: "failed",
      failure: "The server stopped twice before it finished the PDF; make it again, and tell whoever runs Kerf if it happens again.",
    });
  });
});
