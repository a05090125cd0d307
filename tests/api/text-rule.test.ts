import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createClip } from "../factories/rushes";
import { rowsSnapshot } from "../support/rows-snapshot";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

/*
 * Finding: control characters, CR/LF and direction overrides in names reached mail subjects, CSV, EDL
 * and file names, and a title of zero-width spaces was accepted. One text rule
 * (shared/fields/text.ts) now checks every name and title a request carries; each case below is one
 * of those, sent where it would have landed.
 */
let app: TestApp;
let owner: Visitor;
let base: string;
let episodeId: string;
let clipId: string;

beforeAll(async () => {
  app = await startTestApp();
  const crewed = await createCrewedChannel(app.db, "Text Channel");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Plain title" });
  const clip = await createClip(app.db, crewed.channel.id, episode.id);
  owner = await app.signedIn(crewed.owner);
  base = `/api/channels/${crewed.channel.id}`;
  episodeId = episode.id;
  clipId = clip.id;
});
afterAll(() => app.close());

async function refusedWithoutChange(send: () => Promise<{ status: number; body: { error?: { fields?: Record<string, string> } } }>, field: string, message: RegExp) {
  const before = await rowsSnapshot(app);
  const response = await send();
  expect(response.status, JSON.stringify(response.body)).toBe(400);
  expect(response.body.error?.fields?.[field]).toMatch(message);
  expect(await rowsSnapshot(app)).toBe(before);
}

describe("names and titles", () => {
  it("when an episode's title is only zero-width spaces and joiners, then it answers 400 as blank", async () => {
    await refusedWithoutChange(() => owner.send("post", `${base}/episodes`, { title: "\u200B\u200D\uFEFF", question: "", origin: "idea", originLink: "", whyWorthIt: "", ownerId: "", tags: [], budgetAmount: "", budgetCurrency: "", targetPublishDate: "" }), "title", /working title/);
  });

  it("when a channel's name carries a line break and a mail header, then it answers 400", async () => {
    await refusedWithoutChange(() => owner.send("post", "/api/channels", { name: "Shop\r\nBcc: everyone@example.com" }), "name", /one line/);
  });

  it("when a sponsor's company name carries a direction override, then it answers 400", async () => {
    await refusedWithoutChange(() => owner.send("post", `${base}/sponsors`, { company: "Acme \u202Egnp.exe", website: null, notes: null }), "company", /direction/);
  });

  it("when an upload's file name carries CR/LF, then it answers 400 and no upload starts", async () => {
    await refusedWithoutChange(() => owner.send("post", `${base}/uploads`, { episodeId, fileName: "take1\r\n.mov", size: 100 }), "fileName", /one line/);
  });

  it("when a mark's note (an EDL comment line) carries a line break, then it answers 400", async () => {
    await refusedWithoutChange(() => owner.send("post", `${base}/clips/${clipId}/marks`, { in: "01:00:01;00", out: "01:00:02;00", note: "ok\n* FROM CLIP NAME: forged" }), "note", /one line/);
  });

  it("when a bench part's name holds a bell character, then it answers 400", async () => {
    await refusedWithoutChange(
      () => owner.send("post", `${base}/bench/parts`, { name: "Motor\u0007", kind: "motor", mass: null, ratedVoltage: null, ratedCurrent: null, price: null, supplier: "", notes: "" }),
      "name",
      /control character/,
    );
  });

  it("when a person signs up with an invisible name, then no account is made", async () => {
    const visitor = await app.visitor();
    await refusedWithoutChange(() => visitor.send("post", "/api/auth/sign-up", { name: "\u2060\u2060", email: "invisible@example.com", password: "a-long-enough-password", channelName: "Visible" }), "name", /Enter your name/);
  });
});

describe("notes keep their lines", () => {
  it("when a clip's notes have several lines, then they are kept with \\n line breaks, normalised and trimmed", async () => {
    const response = await owner.send("patch", `${base}/clips/${clipId}`, { notes: "  first line\r\nsecond line: Cafe\u0301  " }).expect(200);
    expect(response.body.clip.notes).toBe("first line\nsecond line: Caf\u00E9");
  });

  it("when notes hold a tab or an escape code, then they answer 400", async () => {
    await refusedWithoutChange(() => owner.send("patch", `${base}/clips/${clipId}`, { notes: "col1\tcol2 \u001B[31mred" }), "notes", /control character/);
  });
});
