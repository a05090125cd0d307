import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildDescription } from "../../shared/publish/description";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createClip } from "../factories/rushes";
import { clipMarks } from "../../server/db/schema/rushes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { png } from "../support/png";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());


const upload = (who: Visitor, path: string, name: string, bytes: Buffer) =>
  who.agent.post(path).set("x-csrf-token", who.csrf).field("size", String(bytes.length)).attach("file", bytes, { filename: name, contentType: "image/png" });

const chapters = "0:00 Why this test\n0:30 Building the rig\n1:00 Verdict";

async function settingWithCrew() {
  const found = await setting();
  return { ...found, crewed: { crewAgent: await app.signedIn(found.crew) } };
}

async function setting() {
  const crewed = await createCrewedChannel(app.db, "Publish Bench");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Three packs", stage: "publish" });
  const sponsor = await createSponsor(app.db, crewed.channel.id, { company: "Ohmwright Cells" });
  // Every item counted back from the publish date is approved, so only the package decides the gate.
  const { deal, items } = await createDeal(app.db, crewed.channel.id, episode.id, {
    sponsorId: sponsor.id,
    publishDate: "2027-03-05",
    disclosureText: "Paid partnership with Ohmwright Cells.",
    link: "https://ohmwright.example/bench",
    statuses: { 0: "approved", 1: "approved", 2: "approved", 3: "approved" },
  });
  const editor = await app.signedIn(crewed.editor);
  const base = `/api/channels/${crewed.channel.id}/episodes/${episode.id}/publish`;
  return { ...crewed, episode, deal, items, editor, base };
}

const item = async (dealId: string, kind: string) =>
  (await app.database.pool.query("select status, due_date::text as due from deliverables where deal_id = $1 and kind = $2", [dealId, kind])).rows[0] as { status: string; due: string };

describe("the publish package", () => {
  it("when the editor builds a complete package and marks it published, then the gate passes and the sponsor's after-go-live dates start", async () => {
    const { editor, base, deal } = await setting();
    const empty = (await editor.get(base).expect(200)).body.package;
    expect(empty.version).toBe(0);
    expect(empty.gate.map((p: { code: string }) => p.code)).toContain("publish.no_title");
    expect(empty.sources.mentions).toEqual([{ company: "Ohmwright Cells", disclosure: "Paid partnership with Ohmwright Cells.", link: "https://ohmwright.example/bench", code: "GANTRY10" }]);

    const good = (await upload(editor, `${base}/thumbnails`, "cover.png", png(1280, 720)).expect(201)).body.thumbnail;
    expect(good).toMatchObject({ width: 1280, height: 720, problems: [] });
    const square = (await upload(editor, `${base}/thumbnails`, "square.png", png(1000, 1000)).expect(201)).body.thumbnail;
    expect(square.problems).toEqual(["The picture is 1000 × 1000, not 16:9 (1280 × 720 is best)."]);

    const description = buildDescription({ ...empty.sources, summary: "Which pack lasts longest?", chapters: [] });
    const saved = await editor.send("put", base, { version: 0, titles: ["Which pack lasts?", "Three packs, one bench"], chosenTitle: 0, description, chapters, timeZone: "Europe/Oslo", publishAt: "2027-03-05T16:00:00Z", thumbnailId: good.id })
      .expect(200);
    expect(saved.body.package).toMatchObject({ version: 1, chosenTitle: 0, timeZone: "Europe/Oslo", publishAt: "2027-03-05T16:00:00.000Z", gate: [] });

    const live = await editor.send("post", `${base}/go-live`, { videoUrl: "https://video.example/watch/abc", publishedAt: "2027-03-05T23:30:00Z" }).expect(200);
    expect(live.body.package).toMatchObject({ publishedAt: "2027-03-05T23:30:00.000Z", videoUrl: "https://video.example/watch/abc", goLiveReason: null });
    // 23:30 UTC is already 6 March in Oslo (UTC+1): the package's zone names the day.
    const dealRow = (await app.database.pool.query("select go_live_date::text as d from deals where id = $1", [deal.id])).rows[0];
    expect(dealRow.d).toBe("2027-03-06");
    expect(await item(deal.id, "go_live")).toMatchObject({ status: "done" });
    // The starter template's report is due 30 days after go-live (shared/sponsors/deliverables.ts).
    expect(await item(deal.id, "report")).toMatchObject({ due: "2027-04-05" });
  });

  it("when essentials are missing, then going live asks for a reason and records it", async () => {
    const { editor, base } = await setting();
    const refused = await editor.send("post", `${base}/go-live`, { videoUrl: "https://video.example/watch/x" }).expect(422);
    expect(refused.body.problems.map((p: { code: string }) => p.code)).toEqual(
      expect.arrayContaining(["publish.no_title", "publish.no_disclosure", "publish.no_sponsor_link", "publish.chapters", "publish.no_thumbnail"]),
    );
    expect((await editor.get(base).expect(200)).body.package.publishedAt).toBeNull();
    const forced = await editor.send("post", `${base}/go-live`, { videoUrl: "https://video.example/watch/x", reason: "Sponsor agreed by phone" }).expect(200);
    expect(forced.body.package.goLiveReason).toBe("Sponsor agreed by phone");
  });

  it("when two people save from the same version, then the second gets the package as it is now and saves nothing", async () => {
    const { editor, base } = await setting();
    const body = { version: 0, titles: ["First"], chosenTitle: 0, description: "", chapters: "", timeZone: "UTC", publishAt: null, thumbnailId: null };
    await editor.send("put", base, body).expect(200);
    const stale = await editor.send("put", base, { ...body, titles: ["Second"] }).expect(409);
    expect(stale.body.current.titles).toEqual(["First"]);
  });

  it("when the input is bad, then it is refused with a message per field and nothing changes", async () => {
    const { editor, base, channel } = await setting();
    const other = await createEpisode(app.db, channel.id, { title: "Other", stage: "publish" });
    const thumbnail = (await upload(editor, `/api/channels/${channel.id}/episodes/${other.id}/publish/thumbnails`, "c.png", png(1280, 720)).expect(201)).body.thumbnail;
    const body = { version: 0, titles: ["T"], chosenTitle: 0, description: "", chapters: "", timeZone: "UTC", publishAt: null, thumbnailId: thumbnail.id };
    expect((await editor.send("put", base, body).expect(400)).body.error.fields).toEqual({ thumbnailId: "Choose one of this episode's thumbnails." });
    expect((await editor.send("put", base, { ...body, thumbnailId: null, chosenTitle: 3 }).expect(400)).body.error.fields.chosenTitle).toBe("Choose one of the titles.");
    expect((await editor.send("put", base, { ...body, thumbnailId: null, timeZone: "Mars/Base" }).expect(400)).body.error.fields.timeZone).toBeTruthy();
    expect((await upload(editor, `${base}/thumbnails`, "c.webp", png(1280, 720)).expect(415)).body.error.message).toMatch(/\.jpg, \.jpeg, \.png or \.gif/);
    expect((await editor.get(base).expect(200)).body.package.version).toBe(0);
  });

  it("when the footage has marks, then the package offers them laid end to end for chapters", async () => {
    const { editor, base, channel, episode } = await setting();
    const first = await createClip(app.db, channel.id, episode.id, { frameRateNumerator: 25, frameRateDenominator: 1, recordedAt: new Date("2027-01-01T10:00:00Z") });
    const second = await createClip(app.db, channel.id, episode.id, { frameRateNumerator: 25, frameRateDenominator: 1, recordedAt: new Date("2027-01-01T11:00:00Z") });
    const mark = (clipId: string, inFrame: number, outFrame: number, note: string) => ({ channelId: channel.id, clipId, inFrame, outFrame, inLabel: "", outLabel: "", note });
    await app.db.insert(clipMarks).values([mark(second.id, 0, 500, "Results"), mark(first.id, 100, 350, "Cold open"), mark(first.id, 400, 650, "")]);
    const pkg = (await editor.get(base).expect(200)).body.package;
    expect(pkg.marks).toEqual([
      { frames: 250, rate: { numerator: 25, denominator: 1 }, note: "Cold open" },
      { frames: 250, rate: { numerator: 25, denominator: 1 }, note: "" },
      { frames: 500, rate: { numerator: 25, denominator: 1 }, note: "Results" },
    ]);
  });
});

describe("figures after go-live", () => {
  it("when the video is live, then the deal's figure days are dated from go-live and figures are kept per day", async () => {
    const { editor, base, crewed } = await settingWithCrew();
    const figures = `${base}/figures`;
    expect((await editor.send("put", `${figures}/30`, { version: 0, source: "hand", values: { views: 5, watchHours: null, linkClicks: null, codeUses: null } }).expect(409)).body.error.message).toMatch(/mark the video published first/);
    await editor.send("post", `${base}/go-live`, { videoUrl: "https://video.example/watch?v=abc", publishedAt: "2027-03-05T12:00:00Z", reason: "Test" }).expect(200);
    const before = (await editor.get(figures).expect(200)).body.figures;
    // The starter template's figures report is 30 days after go-live.
    expect(before).toMatchObject({ liveOn: "2027-03-05", days: [{ day: 30, dueOn: "2027-04-04", agreed: true, version: 0, values: null }] });
    const values = { views: 40001, watchHours: 2500.5, linkClicks: 950, codeUses: null };
    const saved = (await editor.send("put", `${figures}/30`, { version: 0, source: "export", values }).expect(200)).body.figures;
    expect(saved.days[0]).toMatchObject({ day: 30, version: 1, values, source: "export" });
    await editor.send("put", `${figures}/7`, { version: 0, source: "hand", values: { ...values, views: 9000 } }).expect(200);
    expect((await editor.send("put", `${figures}/30`, { version: 0, source: "hand", values }).expect(409)).body.current.days.map((d: { day: number }) => d.day)).toEqual([7, 30]);
    const refused = await editor.send("put", `${figures}/7`, { version: 1, source: "hand", values: { views: -1, watchHours: null, linkClicks: 1.5, codeUses: null } }).expect(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(["values.views", "values.linkClicks"]);
    await editor.send("put", `${figures}/later`, { version: 0, source: "hand", values }).expect(400);
    expect((await crewed.crewAgent.get(figures).expect(200)).body.figures.days[0].values.views).toBe(9000);
  });

  it("when a channel names its export's columns, then they are kept for every episode", async () => {
    const { editor, channel } = await setting();
    const columns = { video: "Content", views: "Views", watchHours: "Watch time (hours)", linkClicks: null, codeUses: null };
    await editor.send("put", `/api/channels/${channel.id}/publish/figure-columns`, columns).expect(200);
    const other = await createEpisode(app.db, channel.id, { title: "Other", stage: "publish" });
    expect((await editor.get(`/api/channels/${channel.id}/episodes/${other.id}/publish/figures`).expect(200)).body.figures.columns).toEqual(columns);
  });
});
