import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { linkIn, mailTo, waitForMail } from "../support/mailbox";
import { mailJobsTo, waitForQueueToSettle } from "../support/jobs";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ trustProxy: true });
});
afterAll(() => app.close());

let addressCount = 0;
/** A visitor from an address of its own (the app trusts X-Forwarded-For here), so limits don't cross tests. */
async function viewer(address = `203.0.113.${++addressCount}`) {
  const v = await app.visitor();
  return {
    v,
    submit: (channelId: string, body: object) => v.send("post", `/api/suggestion-pages/${channelId}/suggestions`, body).set("x-forwarded-for", address),
  };
}

async function openChannel(prompt = "What should we build next?") {
  const crewed = await createCrewedChannel(app.db, "Gantry Lab");
  const owner = await app.signedIn(crewed.owner);
  await owner.send("put", `/api/channels/${crewed.channel.id}/intake/page`, { open: true, prompt }).expect(200);
  return { ...crewed, owner, base: `/api/channels/${crewed.channel.id}/intake` };
}

const count = async (table: string, channelId: string) => Number((await app.database.pool.query(`select count(*)::int as n from ${table} where channel_id = $1`, [channelId])).rows[0].n);
const ideas = async (member: Visitor, base: string, query = "") => (await member.get(`${base}/ideas${query}`).expect(200)).body.ideas as { id: string; people: number; suggestions: number; wording: string; combined: Record<string, number | null>; combinedScore: number | null; mine: unknown; status: string; samples: string[] }[];

describe("the public suggestion page", () => {
  it("when the page is closed it answers 404; open, it shows the channel's name and prompt and nothing else", async () => {
    const crewed = await createCrewedChannel(app.db, "Quiet Shop");
    const { v } = await viewer();
    await v.get(`/api/suggestion-pages/${crewed.channel.id}`).expect(404);
    await v.get("/api/suggestion-pages/not-an-id").expect(404);
    const owner = await app.signedIn(crewed.owner);
    await owner.send("put", `/api/channels/${crewed.channel.id}/intake/page`, { open: true, prompt: "Ask us anything mechanical." }).expect(200);
    const page = (await v.get(`/api/suggestion-pages/${crewed.channel.id}`).expect(200)).body;
    expect(page).toEqual({ page: { name: "Quiet Shop", prompt: "Ask us anything mechanical." } });
  });

  it("when one address floods the page, then the sixth suggestion in the window answers 429 and another address still gets through", async () => {
    const { channel } = await openChannel();
    const flood = await viewer("198.51.100.7");
    for (let i = 0; i < 5; i++) await flood.submit(channel.id, { text: `Idea number ${i}: a ${i}-wheeled robot` }).expect(201);
    const refused = await flood.submit(channel.id, { text: "One more please" }).expect(429);
    expect(refused.body.error.code).toBe("rate_limited");
    expect(await count("intake_suggestions", channel.id)).toBe(5);
    await (await viewer("198.51.100.8")).submit(channel.id, { text: "A kite that lifts a camera" }).expect(201);
  });

  it("when the hidden trap field is filled, then the answer looks the same and nothing is stored or counted", async () => {
    const { channel } = await openChannel();
    const bot = await viewer();
    const human = await viewer();
    const trapped = await bot.submit(channel.id, { text: "Buy cheap watches", nickname: "bot", email: "spam@example.com", consent: true }).expect(201);
    const kept = await human.submit(channel.id, { text: "Can a drill power a go-kart?" }).expect(201);
    expect(trapped.body).toEqual(kept.body);
    expect(await count("intake_suggestions", channel.id)).toBe(1);
    expect(await count("intake_contacts", channel.id)).toBe(0);
    // The trap is checked before anything else: even a malformed trapped body looks accepted.
    await bot.submit(channel.id, { text: "", nickname: "bot" }).expect(201);
  });

  it("when the text is too long, holds invisible characters, or an address comes without consent, then 400 and nothing is stored", async () => {
    const { channel } = await openChannel();
    const { submit } = await viewer();
    const long = await submit(channel.id, { text: "x".repeat(601) }).expect(400);
    expect(long.body.error.fields.text).toMatch(/under 600/);
    const hidden = await submit(channel.id, { text: "free\u200Bmoney" }).expect(400);
    expect(hidden.body.error.fields.text).toMatch(/invisible/);
    await submit(channel.id, { text: "\u200B\u200B" }).expect(400);
    await submit(channel.id, { text: "right\u202Eleft" }).expect(400);
    const noConsent = await submit(channel.id, { text: "A hovercraft from a leaf blower", email: uniqueEmail("viewer") }).expect(400);
    expect(noConsent.body.error.fields.consent).toBeDefined();
    // Emoji joined into one picture are not hidden text.
    await submit(channel.id, { text: "Build a robot family 👩\u200D👩\u200D👧" }).expect(201);
    expect(await count("intake_suggestions", channel.id)).toBe(1);
  });
});

describe("grouping", () => {
  it("when viewers ask the same thing in other words, misspelt or reordered, then it is one idea counting distinct people; a different ask is another idea", async () => {
    const { channel, owner, base } = await openChannel();
    await (await viewer()).submit(channel.id, { text: "Can a cordless drill power a go-kart up a steep hill?" }).expect(201);
    await (await viewer()).submit(channel.id, { text: "Please try to power a go-kart with a cordless drill up a steep hill!" }).expect(201);
    await (await viewer()).submit(channel.id, { text: "cordless dril powering a gokart up a steep hil" }).expect(201);
    await (await viewer()).submit(channel.id, { text: "Make a paper bridge that holds a brick" }).expect(201);
    const list = await ideas(owner, base);
    expect(list).toHaveLength(2);
    expect(list[0]).toMatchObject({ people: 3, suggestions: 3, wording: "Can a cordless drill power a go-kart up a steep hill?" });
    expect(list[0]!.samples).toHaveLength(3);
    expect(list[1]).toMatchObject({ people: 1 });
  });
});

describe("grouping after members regroup", () => {
  it("when ideas are merged and suggestions split off, then later asks in the same words follow them to their new idea", async () => {
    const { owner, base } = await openChannel();
    const add = async (text: string) => (await owner.send("post", `${base}/suggestions`, { text }).expect(201)).body as { ideaId: string; joined: boolean };
    const hover = await add("A hovercraft made from a leaf blower");
    const cushion = await add("Ride on an air cushion you built from garden tools");
    expect(cushion.joined).toBe(false);
    await owner.send("post", `${base}/ideas/${hover.ideaId}/merge`, { otherIdeaId: cushion.ideaId }).expect(200);
    // The folded idea's words now belong to the kept idea.
    expect(await add("ride on an air cushion you built from garden tools!")).toEqual({ ideaId: hover.ideaId, joined: true });

    const detail = (await owner.get(`${base}/ideas/${hover.ideaId}`).expect(200)).body;
    const cushionIds: string[] = detail.suggestions.filter((s: { text: string }) => /cushion/i.test(s.text)).map((s: { id: string }) => s.id);
    const splits: string[] = [];
    for (const id of cushionIds) splits.push((await owner.send("post", `${base}/suggestions/${id}/split`).expect(201)).body.idea.id);
    await owner.send("post", `${base}/ideas/${splits[0]}/merge`, { otherIdeaId: splits[1] }).expect(200);
    // Split away, the words no longer lead to the hovercraft.
    expect(await add("Ride on an air cushion you built from garden tools?")).toEqual({ ideaId: splits[0], joined: true });
    expect(await add("A hovercraft made from a leaf blower!")).toEqual({ ideaId: hover.ideaId, joined: true });
  });

  it("when a file repeats an ask, then its rows join one idea as if filed one by one; rows of asking words only each open their own", async () => {
    const { owner, base } = await openChannel();
    const rows = [
      "Comment ID,Author,Comment",
      "r1,Ann,Can a cordless drill power a go-kart up a steep hill?",
      "r2,Ben,Please try to make a paper bridge that holds a brick",
      "r3,Cat,Can a cordless drill power a go-kart up a steep hill?",
      "r4,Dan,Please make a video!",
      "r5,Eve,cordless dril powering a gokart up a steep hil",
      "r6,Fay,Please make a video!",
    ].join("\r\n");
    const mapping = { text: "Comment", author: "Author", commentId: "Comment ID" };
    expect((await owner.send("post", `${base}/imports`, { csv: rows, mapping }).expect(201)).body).toEqual({ added: 6, skipped: 0 });
    const list = await ideas(owner, base);
    expect(list.map((i) => [i.wording, i.people])).toEqual(
      expect.arrayContaining([
        ["Can a cordless drill power a go-kart up a steep hill?", 3],
        ["Please try to make a paper bridge that holds a brick", 1],
        ["Please make a video!", 1],
        ["Please make a video!", 1],
      ]),
    );
    expect(list).toHaveLength(4);

    // A later file: words an idea already holds join it, in one go with the rest.
    const later = ["Comment ID,Author,Comment", "r7,Gus,Can a cordless drill power a go-kart up a steep hill!!", "r8,Hal,Please make a video!", "r9,Ivy,A paper bridge that holds a brick?"].join("\r\n");
    expect((await owner.send("post", `${base}/imports`, { csv: later, mapping }).expect(201)).body).toEqual({ added: 3, skipped: 0 });
    const after = await ideas(owner, base);
    expect(after).toHaveLength(5);
    expect(after.map((i) => i.people).sort()).toEqual([1, 1, 1, 2, 4]);
  });
});

describe("importing exported comments", () => {
  const csv = [
    "Comment ID,Author,Comment,Published,Link",
    'c1,Ada,"Can you make a drill-powered go-kart climb a steep hill?",2026-11-02T10:00:00Z,https://video.example/c1',
    'c2,Bo,"Drill powered go kart up a steep hill please!",2026-11-03T10:00:00Z,https://video.example/c2',
    'c3,Cy,"A trebuchet that throws a pumpkin, ""really"" far",2026-11-04T10:00:00Z,https://video.example/c3',
  ].join("\r\n");
  const mapping = { text: "Comment", author: "Author", link: "Link", postedAt: "Published", commentId: "Comment ID" };

  it("when a file is previewed, then nothing is written and the columns are guessed; importing it twice adds nothing the second time", async () => {
    const { channel, owner, base } = await openChannel();
    const preview = (await owner.send("post", `${base}/imports/preview`, { csv }).expect(200)).body.preview;
    expect(preview).toMatchObject({ headers: ["Comment ID", "Author", "Comment", "Published", "Link"], mapping, mappingSaved: false, total: 3, alreadyImported: 0 });
    expect(preview.rows[2]).toMatchObject({ line: 4, text: 'A trebuchet that throws a pumpkin, "really" far', author: "Cy" });
    expect(await count("intake_suggestions", channel.id)).toBe(0);

    expect((await owner.send("post", `${base}/imports`, { csv, mapping }).expect(201)).body).toEqual({ added: 3, skipped: 0 });
    expect((await owner.send("post", `${base}/imports`, { csv, mapping }).expect(201)).body).toEqual({ added: 0, skipped: 3 });
    expect(await count("intake_suggestions", channel.id)).toBe(3);
    const again = (await owner.send("post", `${base}/imports/preview`, { csv }).expect(200)).body.preview;
    expect(again).toMatchObject({ mappingSaved: true, alreadyImported: 3 });
    const list = await ideas(owner, base);
    expect(list.map((i) => i.people)).toEqual([2, 1]);
  });

  it("when one row is malformed, then its line is named and nothing of the file is written", async () => {
    const { channel, owner, base } = await openChannel();
    const ragged = `${csv}\r\nc4,Di,"Only three cells",2026-11-05T10:00:00Z\r\nc5,Ed,"Fine row",2026-11-05T10:00:00Z,https://video.example/c5`;
    const refused = await owner.send("post", `${base}/imports`, { csv: ragged, mapping }).expect(422);
    expect(refused.body.error.message).toMatch(/^Line 5 of the file is malformed/);
    const badLink = `${csv}\r\nc4,Di,"A fine ask",2026-11-05T10:00:00Z,not a link`;
    expect((await owner.send("post", `${base}/imports`, { csv: badLink, mapping }).expect(422)).body.error.message).toMatch(/^Line 5 .*not a web address/);
    const hidden = `${csv}\r\nc4,Di,"free\u200Bstuff",2026-11-05T10:00:00Z,https://video.example/c4`;
    expect((await owner.send("post", `${base}/imports/preview`, { csv: hidden }).expect(422)).body.error.message).toMatch(/^Line 5 .*invisible/);
    expect(await count("intake_suggestions", channel.id)).toBe(0);
    expect(await count("intake_ideas", channel.id)).toBe(0);
  });
});

describe("working the ideas", () => {
  const MOVED = "That suggestion was just moved to another idea; look again and split it from there.";

  it("when the same suggestion is split off twice at once, then one split makes its idea and the other is told it moved, leaving no empty idea", async () => {
    const { channel, owner, base } = await openChannel();
    for (const text of ["Build a trebuchet from bike parts", "A water rocket launched by a foot pump", "Print a gearbox that lifts a car"]) {
      await owner.send("post", `${base}/suggestions`, { text }).expect(201);
    }
    const [first, ...others] = await ideas(owner, base);
    for (const other of others) await owner.send("post", `${base}/ideas/${first!.id}/merge`, { otherIdeaId: other.id }).expect(200);
    const suggestion = (await owner.get(`${base}/ideas/${first!.id}`).expect(200)).body.suggestions[1] as { id: string };

    // Someone holds the idea while both splits ask for it, so both have read where the suggestion was.
    const holder = await app.database.pool.connect();
    try {
      await holder.query("begin");
      await holder.query("select id from intake_ideas where id = $1 for update", [first!.id]);
      const splits = [1, 2].map(() => owner.send("post", `${base}/suggestions/${suggestion.id}/split`).then((answer) => answer));
      const waitingOnLocks = async () => Number((await app.database.pool.query("select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock'")).rows[0].n);
      await expect.poll(waitingOnLocks, { timeout: 10_000, interval: 20 }).toBeGreaterThanOrEqual(2);
      await holder.query("commit");
      const answers = await Promise.all(splits);
      expect(answers.map((answer) => answer.status).sort()).toEqual([201, 409]);
      expect(answers.find((answer) => answer.status === 409)!.body.error.message).toBe(MOVED);
    } finally {
      holder.release();
    }
    expect((await ideas(owner, base)).map((idea) => idea.suggestions).sort()).toEqual([1, 2]);
    expect(await count("intake_ideas", channel.id)).toBe(2);
  });

  it("when a suggestion is split off while its idea is being folded into another, then the split is told it moved, not that its idea is missing", async () => {
    const { channel, owner, base } = await openChannel();
    for (const text of ["Build a trebuchet from bike parts", "A water rocket launched by a foot pump", "Print a gearbox that lifts a car"]) {
      await owner.send("post", `${base}/suggestions`, { text }).expect(201);
    }
    const [kept, folded, third] = await ideas(owner, base);
    await owner.send("post", `${base}/ideas/${folded!.id}/merge`, { otherIdeaId: third!.id }).expect(200);
    const suggestion = (await owner.get(`${base}/ideas/${folded!.id}`).expect(200)).body.suggestions[1] as { id: string };

    // Someone holds the idea to be folded; the merge asks for it first, then the split, so the merge goes first.
    const holder = await app.database.pool.connect();
    const waitingOnLocks = async () => Number((await app.database.pool.query("select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock'")).rows[0].n);
    try {
      await holder.query("begin");
      await holder.query("select id from intake_ideas where id = $1 for update", [folded!.id]);
      const merge = owner.send("post", `${base}/ideas/${kept!.id}/merge`, { otherIdeaId: folded!.id }).then((answer) => answer);
      await expect.poll(waitingOnLocks, { timeout: 10_000, interval: 20 }).toBe(1);
      const split = owner.send("post", `${base}/suggestions/${suggestion.id}/split`).then((answer) => answer);
      await expect.poll(waitingOnLocks, { timeout: 10_000, interval: 20 }).toBe(2);
      await holder.query("commit");
      expect((await merge).status).toBe(200);
      const refused = await split;
      expect(refused.status).toBe(409);
      expect(refused.body.error.message).toBe(MOVED);
    } finally {
      holder.release();
    }
    expect((await ideas(owner, base)).map((idea) => idea.suggestions)).toEqual([3]);
    expect(await count("intake_ideas", channel.id)).toBe(1);
  });

  it("when members merge, split, weigh, set aside and turn down ideas, then the list follows, sorted by what they chose", async () => {
    const { channel, owner, producer, crew, base } = await openChannel();
    const member = await app.signedIn(crew);
    await member.send("post", `${base}/suggestions`, { text: "A hovercraft made from a leaf blower", author: "Meetup visitor" }).expect(201);
    await member.send("post", `${base}/suggestions`, { text: "Ride on an air cushion you built from garden tools" }).expect(201);
    await member.send("post", `${base}/suggestions`, { text: "Make a paper bridge that holds a brick" }).expect(201);
    let list = await ideas(owner, base);
    expect(list).toHaveLength(3);
    const [hover, cushion] = [list.find((i) => i.wording.startsWith("A hovercraft"))!, list.find((i) => i.wording.startsWith("Ride on"))!];

    const merged = (await member.send("post", `${base}/ideas/${hover.id}/merge`, { otherIdeaId: cushion.id }).expect(200)).body.idea;
    expect(merged).toMatchObject({ people: 2, suggestions: 2 });
    await member.send("post", `${base}/ideas/${hover.id}/merge`, { otherIdeaId: hover.id }).expect(400);
    const detail = (await owner.get(`${base}/ideas/${hover.id}`).expect(200)).body;
    const cushionWords = detail.suggestions.find((s: { text: string }) => s.text.startsWith("Ride on"));
    const split = (await member.send("post", `${base}/suggestions/${cushionWords.id}/split`).expect(201)).body.idea;
    expect(split).toMatchObject({ people: 1, wording: "Ride on an air cushion you built from garden tools" });
    await member.send("post", `${base}/suggestions/${cushionWords.id}/split`).expect(409);

    await member.send("put", `${base}/ideas/${hover.id}/judgement`, { draw: 3, reach: 2, spend: 2, danger: 3 }).expect(200);
    const judged = (await (await app.signedIn(producer)).send("put", `${base}/ideas/${hover.id}/judgement`, { draw: 2, reach: 3, spend: 1, danger: 2 }).expect(200)).body.idea;
    // Means per dimension; the combined figure turns spend and danger round: (2.5 + 2.5 + (4−1.5) + (4−2.5)) / 4 = 2.25 → 2.3.
    expect(judged.combined).toEqual({ draw: 2.5, reach: 2.5, spend: 1.5, danger: 2.5 });
    expect(judged.combinedScore).toBe(2.3);
    await member.send("put", `${base}/ideas/${hover.id}/judgement`, { draw: 4, reach: 2, spend: 2, danger: 3 }).expect(400);
    list = await ideas(owner, base, "?sort=combined");
    expect(list[0]!.id).toBe(hover.id);
    await owner.get(`${base}/ideas?sort=loudest`).expect(400);

    await member.send("post", `${base}/ideas/${split.id}/park`).expect(200);
    const bridge = (await ideas(owner, base)).find((i) => i.wording.startsWith("Make a paper"))!;
    await member.send("post", `${base}/ideas/${bridge.id}/decline`, { reason: "" }).expect(400);
    expect((await member.send("post", `${base}/ideas/${bridge.id}/decline`, { reason: "Done it in episode 4" }).expect(200)).body.idea).toMatchObject({ status: "declined", declineReason: "Done it in episode 4" });
    expect((await ideas(owner, base)).map((i) => i.id)).toEqual([hover.id]);
    expect((await ideas(owner, base, "?status=parked")).map((i) => i.id)).toEqual([split.id]);
    expect(await count("intake_ideas", channel.id)).toBe(3);
  });
});

describe("promoting an idea and telling the viewers", () => {
  it("when an idea goes on the slate and its video goes live, then each confirmed consenting asker gets exactly one mail, once", async () => {
    const { channel, owner, crew, base } = await openChannel();
    const consenting = uniqueEmail("asker");
    const unconfirmed = uniqueEmail("unconfirmed");
    const leaving = uniqueEmail("leaving");
    await (await viewer()).submit(channel.id, { text: "Can a drill power a go-kart up a hill?", email: consenting, consent: true }).expect(201);
    await (await viewer()).submit(channel.id, { text: "Drill-powered go-kart up a hill, please!", email: unconfirmed, consent: true }).expect(201);
    await (await viewer()).submit(channel.id, { text: "go kart powered by a drill, up a hill", email: leaving, consent: true }).expect(201);
    await (await viewer()).submit(channel.id, { text: "Would love to see a drill power a go-kart up a hill" }).expect(201);

    // Only the confirmation goes to a new address; its link confirms it.
    const confirmation = await waitForMail(consenting);
    expect(confirmation.subject).toBe("Confirm your address for Gantry Lab");
    const visitor = await app.visitor();
    for (const address of [consenting, leaving]) {
      const token = linkIn(await waitForMail(address), /\/suggest\/confirm\/\S+/).split("/").pop()!;
      await visitor.send("post", "/api/suggestion-addresses/confirm", { token }).expect(200);
      await visitor.send("post", "/api/suggestion-addresses/confirm", { token }).expect(404);
    }

    const [idea] = await ideas(owner, base);
    expect(idea).toMatchObject({ people: 4 });
    await (await app.signedIn(crew)).send("post", `${base}/ideas/${idea!.id}/promote`).expect(403);
    const promoted = (await owner.send("post", `${base}/ideas/${idea!.id}/promote`).expect(201)).body;
    expect(promoted.idea.status).toBe("promoted");
    const episode = (await owner.get(`/api/channels/${channel.id}/episodes/${promoted.episodeId}`).expect(200)).body.episode;
    expect(episode).toMatchObject({ stage: "challenge", origin: "viewer", title: "Can a drill power a go-kart up a hill?", originLink: `http://kerf.test/c/${channel.id}/intake/${idea!.id}` });
    expect(episode.whyWorthIt).toMatch(/^Asked by 4 viewers on \d{4}-\d\d-\d\d \(4 suggestions\)\./);
    await owner.send("post", `${base}/ideas/${idea!.id}/promote`).expect(409);

    // One asker stops the news before the video is out.
    await waitForQueueToSettle(app.database.pool);
    const goLive = { videoUrl: "https://video.example/watch/kart", reason: "Test: package checked elsewhere" };
    const stopToken = (await import("../../server/intake/news-token")).newsTokens(app.deps.env.SESSION_SECRET);
    const leavingId = (await app.database.pool.query("select id from intake_contacts where email = $1", [leaving])).rows[0].id as string;
    await visitor.send("post", "/api/suggestion-addresses/stop", { token: stopToken.make(leavingId) }).expect(200);
    await visitor.send("post", "/api/suggestion-addresses/stop", { token: `${leavingId}.forged` }).expect(404);

    await owner.send("post", `/api/channels/${channel.id}/episodes/${promoted.episodeId}/publish/go-live`, goLive).expect(200);
    const news = await waitForMail(consenting, { count: 2 });
    expect(news.subject).toBe("Gantry Lab made the video you asked for");
    expect(news.text).toContain("https://video.example/watch/kart");
    expect(news.text).toMatch(/\/suggest\/stop\/\S+/);

    // A second go-live of the same episode mails nobody again.
    const again = await owner.send("post", `/api/channels/${channel.id}/episodes/${promoted.episodeId}/publish/go-live`, goLive);
    expect([200, 409]).toContain(again.status);
    await waitForQueueToSettle(app.database.pool);
    expect(await mailTo(consenting)).toHaveLength(2);
    expect(await mailTo(unconfirmed)).toHaveLength(1);
    expect(await mailTo(leaving)).toHaveLength(1);
    expect((await mailJobsTo(app.database.pool, consenting)).length).toBe(2);
    expect(await count("intake_news", channel.id)).toBe(1);
  });
});
