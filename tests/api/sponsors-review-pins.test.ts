import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { playableKey } from "../../server/sponsors/cut.service";
import { PINS_PER_MINUTE, type DealView } from "../../shared/sponsors/schemas";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { uniqueEmail } from "../factories/invitations";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let producer: Visitor;
let editor: Visitor;

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Pin Bench");
  producer = await app.signedIn(world.producer);
  editor = await app.signedIn(world.editor);
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;

/** A clip row as the footage feature records one: 6 s at 25 fps whose first frame is labelled 01:00:00:00. */
async function clipOf(episodeId: string, overrides: { rate?: [number, number] | null; start?: string | null } = {}) {
  const rate = overrides.rate === undefined ? [25, 1] : overrides.rate;
  const { rows } = await app.database.pool.query(
    `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms, frame_rate_numerator, frame_rate_denominator, start_timecode, recorded_at)
     values ($1, $2, $3, 'sponsor-read.mp4', 'video/mp4', 1, 6000, $4, $5, $6, now()) returning id`,
    [world.channel.id, episodeId, `${world.channel.id}/${episodeId}/${randomUUID()}`, rate?.[0] ?? null, rate?.[1] ?? null, overrides.start === undefined ? "01:00:00:00" : overrides.start],
  );
  return rows[0].id as string;
}

/** A deal whose cut is a clip's 2 s–4 s, and a review link for its script approval. */
async function reviewedSegment(timing: object | null = { inTimecode: "01:00:02:00", outTimecode: "01:00:04:00", frameRate: "25", dropFrame: false }) {
  const episode = await createEpisode(app.db, world.channel.id, { title: "Bandsaw fence" });
  const sponsor = await createSponsor(app.db, world.channel.id, { company: "Kestrel Blades" });
  const contact = await createContact(app.db, world.channel.id, sponsor.id, { name: "Ada Voss", email: uniqueEmail("ada") });
  const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, script: "Kestrel Blades sponsors this video." });
  const clipId = await clipOf(episode.id);
  await editor.send("put", api(`/deals/${made.deal.id}/cut`), { clipId, timing, version: 1 }).expect(200);
  const item = made.items.find((i) => i.kind === "script_approval")!;
  const sent = await producer.send("post", api(`/deals/${made.deal.id}/review-links`), { deliverableId: item.id, contactId: contact.id, expiresInDays: 7 }).expect(201);
  return { episode, deal: made.deal, item, clipId, link: sent.body.link as { id: string }, token: (sent.body.url as string).split("/review/")[1]! };
}

const pinCount = async (linkId: string) => (await app.database.pool.query("select count(*)::int as n from review_pins where link_id = $1", [linkId])).rows[0].n as number;

describe("the segment the sponsor reviews", () => {
  it("when the cut is a clip's range, then the page names where the segment runs in the file, at the clip's frame rate", async () => {
    const { token } = await reviewedSegment();
    const page = await (await app.visitor()).get(`/api/review/${token}`).expect(200);
    // In 01:00:02:00 and out 01:00:04:00 of a clip starting at 01:00:00:00, at 25 fps: 50 and 100 frames in, 2 s and 4 s.
    expect(page.body.segment).toEqual({ startSeconds: 2, endSeconds: 4, wholeFile: false, frameRate: "25" });
    expect(page.body.cutUrl).toMatch(/X-Amz-Signature=/);
    expect(page.body.pins).toEqual([]);
  });

  it("when the cut is a whole draft file, then the segment is all of it", async () => {
    const { token } = await reviewedSegment(null);
    const page = await (await app.visitor()).get(`/api/review/${token}`).expect(200);
    expect(page.body.segment).toEqual({ startSeconds: 0, endSeconds: 6, wholeFile: true, frameRate: "25" });
  });

  it("when the editor gives another frame rate than the clip's, or a range outside it, then the cut is refused and stays as it was", async () => {
    const { deal } = await reviewedSegment();
    const put = (timing: object) => editor.send("put", api(`/deals/${deal.id}/cut`), { clipId: undefined, timing, version: 2 });
    const clipId = (await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal.cut.clip.id as string;
    const send = (timing: object) => editor.send("put", api(`/deals/${deal.id}/cut`), { clipId, timing, version: 2 }).expect(400);
    expect((await send({ inTimecode: "01:00:02:00", outTimecode: "01:00:04:00", frameRate: "30", dropFrame: false })).body.error.fields).toEqual({ "timing.frameRate": "This clip runs at 25 fps: the in and out are counted in its frames." });
    expect((await send({ inTimecode: "00:59:59:00", outTimecode: "01:00:04:00", frameRate: "25", dropFrame: false })).body.error.fields).toEqual({ "timing.inTimecode": "The clip starts at 01:00:00:00: the in point can't come before it." });
    expect((await send({ inTimecode: "01:00:02:00", outTimecode: "01:00:07:00", frameRate: "25", dropFrame: false })).body.error.fields).toEqual({ "timing.outTimecode": "The clip ends at 01:00:06:00: the out point can't come after it." });
    expect((await put({})).status).toBe(400);
    const after = (await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal as DealView;
    expect(after.version).toBe(2);
    expect(after.cut.timing).toMatchObject({ inTimecode: "01:00:02:00", outTimecode: "01:00:04:00", frameRate: "25" });
  });
});

describe("comments pinned to a moment of the segment", () => {
  it("when the sponsor pins a comment, then the page lists it and the producer sees it at the clip's timecode", async () => {
    const { token, deal, link } = await reviewedSegment();
    const visitor = await app.visitor();
    const added = await visitor.send("post", `/api/review/${token}/pins`, { atSeconds: 1.2, note: "Show the blade guard\nbefore the cut" }).expect(201);
    expect(added.body.pin).toMatchObject({ atSeconds: 1.2, note: "Show the blade guard\nbefore the cut", contactName: "Ada Voss" });
    const page = await visitor.get(`/api/review/${token}`).expect(200);
    expect(page.body.pins).toEqual([added.body.pin]);

    const seen = (await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal as DealView;
    // 2 s (the in point) + 1.2 s = 3.2 s of the file = frame 80 at 25 fps, labelled 3 s and 5 frames after
    // 01:00:00:00 (non-drop-frame labels count whole frames per second: SMPTE ST 12-1, as restated in
    // OpenTimelineIO's opentime to_timecode; arithmetic done here by hand).
    expect(seen.cut.pins).toEqual([{ ...added.body.pin, timecode: "01:00:03:05", deliverableTitle: "Sponsor approves the script" }]);
    const asEditor = (await editor.get(api(`/deals/${deal.id}`)).expect(200)).body.deal as DealView;
    expect(asEditor.cut.pins).toHaveLength(1);
    const asCrew = (await (await app.signedIn(world.crew)).get(api(`/deals/${deal.id}`)).expect(200)).body.deal as DealView;
    expect(asCrew.cut.pins).toBeUndefined();
    expect(await pinCount(link.id)).toBe(1);
  });

  it("when the link is withdrawn or used, then a pin answers 410 and nothing is stored", async () => {
    const withdrawn = await reviewedSegment();
    await producer.send("delete", api(`/deals/${withdrawn.deal.id}/review-links/${withdrawn.link.id}`)).expect(204);
    const refused = await (await app.visitor()).send("post", `/api/review/${withdrawn.token}/pins`, { atSeconds: 1, note: "Too late?" }).expect(410);
    expect(refused.body.error).toMatchObject({ code: "gone", message: expect.stringMatching(/withdrawn/) });
    expect(await pinCount(withdrawn.link.id)).toBe(0);

    const used = await reviewedSegment();
    const visitor = await app.visitor();
    const seen = (await visitor.get(`/api/review/${used.token}`).expect(200)).body.seen;
    await visitor.send("post", `/api/review/${used.token}/decision`, { decision: "approved", comment: null, seen }).expect(200);
    await visitor.send("post", `/api/review/${used.token}/pins`, { atSeconds: 1, note: "One more thing" }).expect(410);
    expect(await pinCount(used.link.id)).toBe(0);
  });

  it("when the body is bad, then it answers 400 with the field and stores nothing", async () => {
    const { token, link } = await reviewedSegment();
    const visitor = await app.visitor();
    const cases: [object, string][] = [
      [{ atSeconds: 1 }, "note"],
      [{ atSeconds: 1, note: "   " }, "note"],
      [{ atSeconds: -1, note: "Before the in point" }, "atSeconds"],
      [{ atSeconds: "1", note: "A string" }, "atSeconds"],
      [{ atSeconds: 2.5, note: "After the out point" }, "atSeconds"],
      [{ atSeconds: 1, note: "x".repeat(1001) }, "note"],
      [{ atSeconds: 1, note: "Fine", contactName: "Someone else" }, ""],
    ];
    for (const [body, field] of cases) {
      const answer = await visitor.send("post", `/api/review/${token}/pins`, body);
      expect(answer.status, JSON.stringify(body)).toBe(400);
      if (field) expect(Object.keys(answer.body.error.fields ?? {}), JSON.stringify(body)).toContain(field);
    }
    const huge = await visitor.send("post", `/api/review/${token}/pins`, { atSeconds: 1, note: "y".repeat(17 * 1024) });
    expect(huge.status).toBe(413);
    expect(await pinCount(link.id)).toBe(0);
  });

  it("when the token is not a link's, or the deal is another channel's, then it answers 404", async () => {
    const visitor = await app.visitor();
    const forged = await visitor.send("post", `/api/review/${"0".repeat(32)}.9999999999.${"A".repeat(43)}/pins`, { atSeconds: 1, note: "Hello" });
    expect(forged.status).toBe(404);
    const other = await createCrewedChannel(app.db, "Elsewhere Works");
    const otherEpisode = await createEpisode(app.db, other.channel.id);
    const otherSponsor = await createSponsor(app.db, other.channel.id);
    const otherDeal = await createDeal(app.db, other.channel.id, otherEpisode.id, { sponsorId: otherSponsor.id });
    await producer.get(api(`/deals/${otherDeal.deal.id}/cut/player`)).expect(404);
    const { deal } = await reviewedSegment();
    const player = await producer.get(api(`/deals/${deal.id}/cut/player`)).expect(200);
    expect(player.body.segment).toEqual({ startSeconds: 2, endSeconds: 4, wholeFile: false, frameRate: "25" });
  });

  it(`when a link pins more than ${PINS_PER_MINUTE} comments in a minute, then the next is refused with 429`, async () => {
    const { token, link } = await reviewedSegment();
    const visitor = await app.visitor();
    for (let i = 0; i < PINS_PER_MINUTE; i++) await visitor.send("post", `/api/review/${token}/pins`, { atSeconds: i / 10, note: `Comment ${i + 1}` }).expect(201);
    const refused = await visitor.send("post", `/api/review/${token}/pins`, { atSeconds: 1.9, note: "One too many" }).expect(429);
    expect(refused.body.error.message).toMatch(/at most/);
    expect(await pinCount(link.id)).toBe(PINS_PER_MINUTE);
  });
});

describe("which file the segment plays from", () => {
  const clip = { objectKey: "footage/a.mov", contentType: "video/quicktime", proxyKey: "proxies/a.mp4" };
  it("plays the server's web proxy once it is ready, and the clip's own file until then", () => {
    expect(playableKey({ ...clip, mediaState: "ready" })).toEqual({ key: "proxies/a.mp4", contentType: "video/mp4" });
    expect(playableKey({ ...clip, mediaState: "making" })).toEqual({ key: "footage/a.mov", contentType: "video/quicktime" });
    expect(playableKey({ ...clip, mediaState: "ready", proxyKey: null })).toEqual({ key: "footage/a.mov", contentType: "video/quicktime" });
  });
});
