import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createDeal, createSponsor, createTemplate } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { suggestedTemplateItems } from "../../shared/sponsors/deliverables";
import type { DealView } from "../../shared/sponsors/schemas";

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
const as: Record<"owner" | "producer" | "editor" | "crew", Visitor> = {} as never;

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Sponsor Bench");
  for (const role of ["owner", "producer", "editor", "crew"] as const) as[role] = await app.signedIn(world[role]);
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;

const newDeal = (episodeId: string, sponsorId: string, extra: Record<string, unknown> = {}) => ({
  episodeId,
  sponsorId,
  templateId: null,
  state: "signed",
  placement: "middle",
  segmentSeconds: 60,
  talkingPoints: ["Holds 0.1 mV ripple", "Free shipping over 50 euros"],
  link: "https://northbeam.example/gantry",
  promoCode: "GANTRY10",
  disclosureText: null,
  exclusivityNotes: "No other bench-supply sponsor for 30 days",
  descriptionCopy: null,
  script: "",
  contactId: null,
  hostId: null,
  goLiveDate: null,
  money: { fee: 4321.5, currency: "eur", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null },
  ...extra,
});

/** Every key anywhere in a JSON body: the fee must not hide under another name either. */
function keysOf(value: unknown, into = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => keysOf(v, into));
  else if (value && typeof value === "object") {
    for (const [key, inner] of Object.entries(value)) {
      into.add(key);
      keysOf(inner, into);
    }
  }
  return into;
}

const moneyKeys = ["money", "fee", "feeAmount", "currency", "paymentTermsDays", "paymentTermsFrom", "invoiceNumber", "invoicedOn", "paidOn"];

function expectNoMoney(body: unknown) {
  const keys = keysOf(body);
  for (const key of moneyKeys) expect(keys.has(key), `the body carries "${key}"`).toBe(false);
  const text = JSON.stringify(body);
  // The fee as a value (4321 or "4321.00"), not as digits inside some id.
  expect(text).not.toMatch(/[:"]4321(\.0+)?[,}"]/);
  expect(text).not.toMatch(/"kind":"(invoice|payment)"/);
}

describe("sponsors and contacts", () => {
  it("when the producer adds a sponsor and a contact, then everyone in the channel reads them", async () => {
    const made = await as.producer.send("post", api("/sponsors"), { company: "Northbeam Tools", website: "https://northbeam.example", notes: "Bench supplies" }).expect(201);
    const sponsorId = made.body.sponsor.id;
    await as.producer.send("post", api(`/sponsors/${sponsorId}/contacts`), { name: "Rosa Lindgren", email: "Rosa@Northbeam.example", role: "Partnerships" }).expect(201);

    const listed = await as.crew.get(api("/sponsors")).expect(200);
    const sponsor = listed.body.sponsors.find((s: { id: string }) => s.id === sponsorId);
    expect(sponsor).toMatchObject({ company: "Northbeam Tools", website: "https://northbeam.example", dealCount: 0 });
    expect(sponsor.contacts).toEqual([expect.objectContaining({ name: "Rosa Lindgren", email: "rosa@northbeam.example" })]);
  });

  it("when the input is bad, then each field says why and nothing is stored", async () => {
    const before = (await as.producer.get(api("/sponsors")).expect(200)).body.sponsors.length;
    const bad = await as.producer.send("post", api("/sponsors"), { company: " ", website: "northbeam", notes: null }).expect(400);
    expect(bad.body.error.fields).toMatchObject({ company: "Name the company.", website: expect.stringContaining("https://") });
    // PostgreSQL text can't hold NUL: a clear message rather than a failed insert.
    const nul = await as.producer.send("post", api("/sponsors"), { company: "Null\u0000Co", website: null, notes: "a\u0000b" }).expect(400);
    expect(nul.body.error.fields.company).toMatch(/NUL/);
    const sponsor = await createSponsor(app.db, world.channel.id);
    const badContact = await as.producer.send("post", api(`/sponsors/${sponsor.id}/contacts`), { name: "", email: "not-an-address", role: "" }).expect(400);
    expect(Object.keys(badContact.body.error.fields).sort()).toEqual(["email", "name"]);
    expect((await as.producer.get(api("/sponsors")).expect(200)).body.sponsors.length).toBe(before + 1);
  });

  it("when another channel's sponsor id is used, then it answers 404", async () => {
    const elsewhere = await createCrewedChannel(app.db, "Elsewhere");
    const theirs = await createSponsor(app.db, elsewhere.channel.id);
    await as.producer.get(api(`/sponsors/${theirs.id}`)).expect(404);
    await as.producer.send("patch", api(`/sponsors/${theirs.id}`), { company: "Mine now", website: null, notes: null, version: 1 }).expect(404);
    const kept = await app.database.pool.query("select company from sponsors where id = $1", [theirs.id]);
    expect(kept.rows).toEqual([{ company: theirs.company }]);
  });
});

describe("a deal made from a template", () => {
  it("when the producer picks a template, then the items are dated from the publish date and go-live", async () => {
    const episode = await createEpisode(app.db, world.channel.id, { title: "Bench supply shoot-out", targetPublishDate: "2027-03-02" });
    const sponsor = await createSponsor(app.db, world.channel.id, { company: "Northbeam Tools" });
    const template = await as.producer
      .send("post", api("/deal-templates"), { name: "Mid-roll read", items: suggestedTemplateItems })
      .expect(201);
    const made = await as.producer.send("post", api("/deals"), newDeal(episode.id, sponsor.id, { templateId: template.body.template.id })).expect(201);
    const deal: DealView = made.body.deal;
    const dates = Object.fromEntries(deal.deliverables.map((d) => [d.kind, d.dueDate]));
    // Publish 2 March 2027 (2027 has no 29 February):
    expect(dates).toEqual({
      script_draft: "2027-02-09", // − 21: 2 Mar − 2 = 28 Feb, − 19 more = 9 Feb
      script_approval: "2027-02-16", // − 14
      draft_cut: "2027-02-23", // − 7
      final_approval: "2027-02-27", // − 3
      go_live: "2027-03-02", // go-live is the publish date, + 0
      report: "2027-04-01", // + 30: 2 Mar + 29 = 31 Mar, + 1 = 1 Apr
      invoice: "2027-03-03", // + 1
      payment: "2027-04-02", // + 31
    });
    // The template names who usually does each item: the editor owns the draft cut.
    expect(deal.deliverables.find((d) => d.kind === "draft_cut")?.ownerName).toBe("Edda Editor");
    expect(deal.deliverables.find((d) => d.kind === "script_draft")?.ownerName).toBe("Pim Producer");
    expect(deal.deliverables[0]!.history[0]).toMatchObject({ what: "created", actorName: "Pim Producer", note: 'From the template "Mid-roll read"' });
    expect(deal.money).toEqual({ fee: 4321.5, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null });
  });

  it("when the fee is sent as typed, 1,800.50, then it is understood; words are not", async () => {
    const episode = await createEpisode(app.db, world.channel.id);
    const sponsor = await createSponsor(app.db, world.channel.id);
    const money = { fee: "1,800.50", currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null };
    const made = await as.producer.send("post", api("/deals"), newDeal(episode.id, sponsor.id, { money })).expect(201);
    expect(made.body.deal.money.fee).toBe(1800.5);
    const words = await as.producer.send("post", api("/deals"), newDeal(episode.id, sponsor.id, { money: { ...money, fee: "lots" } })).expect(400);
    expect(words.body.error.fields).toEqual({ "money.fee": "Write the fee as a number, e.g. 1800.50 or 1,800.50." });
  });

  it("when the deal's input is bad, then each field says why and no deal is made", async () => {
    const episode = await createEpisode(app.db, world.channel.id);
    const sponsor = await createSponsor(app.db, world.channel.id);
    const body = newDeal(episode.id, sponsor.id, {
      segmentSeconds: 2,
      link: "northbeam dot example",
      promoCode: "TWO WORDS",
      money: { fee: -5, currency: "euro", paymentTermsDays: 30.5, paymentTermsFrom: "never", invoiceNumber: null, invoicedOn: "31/02/2027", paidOn: null },
    });
    const bad = await as.producer.send("post", api("/deals"), body).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(
      ["link", "money.currency", "money.fee", "money.invoicedOn", "money.paymentTermsDays", "money.paymentTermsFrom", "promoCode", "segmentSeconds"].sort(),
    );
    expect(bad.body.error.fields["money.fee"]).toBe("The fee must be zero or more.");
    const other = await createCrewedChannel(app.db, "Other");
    const theirEpisode = await createEpisode(app.db, other.channel.id);
    const wrongEpisode = await as.producer.send("post", api("/deals"), newDeal(theirEpisode.id, sponsor.id)).expect(400);
    expect(wrongEpisode.body.error.fields).toEqual({ episodeId: "Pick an episode of this channel." });
    const rows = await app.database.pool.query("select count(*)::int as n from deals where episode_id in ($1, $2)", [episode.id, theirEpisode.id]);
    expect(rows.rows[0].n).toBe(0);
  });
});

describe("the fee is for owner and producer only", () => {
  let episodeId: string;
  let dealId: string;
  let sponsorId: string;
  beforeAll(async () => {
    const episode = await createEpisode(app.db, world.channel.id, { title: "Fee secrecy", targetPublishDate: "2027-05-31" });
    const sponsor = await createSponsor(app.db, world.channel.id, { company: "Quietfee Ltd" });
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-05-31", fee: "4321.00" });
    episodeId = episode.id;
    dealId = made.deal.id;
    sponsorId = sponsor.id;
  });

  it("when the editor opens the deal, then they see length, talking points, link and code, and no fee, terms or invoice", async () => {
    const body = (await as.editor.get(api(`/deals/${dealId}`)).expect(200)).body;
    expect(body.deal).toMatchObject({ segmentSeconds: 60, talkingPoints: ["Holds 0.1 mV ripple"], link: "https://northbeam.example/gantry", promoCode: "GANTRY10" });
    expect(body.deal.deliverables.map((d: { kind: string }) => d.kind)).not.toContain("invoice");
    expectNoMoney(body);
  });

  it("when crew read the deal, the episode's deals, the sponsor and the desk, then no answer carries money", async () => {
    for (const who of [as.crew, as.editor]) {
      expectNoMoney((await who.get(api(`/deals/${dealId}`)).expect(200)).body);
      expectNoMoney((await who.get(api(`/episodes/${episodeId}/deals`)).expect(200)).body);
      expectNoMoney((await who.get(api(`/sponsors/${sponsorId}`)).expect(200)).body);
      expectNoMoney((await who.get(api(`/desk`)).expect(200)).body);
    }
  });

  it("when the owner or producer read it, then the fee and the money items are there", async () => {
    for (const who of [as.owner, as.producer]) {
      const body = (await who.get(api(`/deals/${dealId}`)).expect(200)).body;
      expect(body.deal.money.fee).toBe(4321);
      expect(body.deal.deliverables.map((d: { kind: string }) => d.kind)).toEqual(expect.arrayContaining(["invoice", "payment"]));
      const sponsor = (await who.get(api(`/sponsors/${sponsorId}`)).expect(200)).body.sponsor;
      expect(sponsor.deals[0].money).toEqual({ fee: 4321, currency: "EUR" });
    }
  });

  it("when the editor tries to change the fee or reach an invoice item, then it is refused and nothing changes", async () => {
    await as.editor.send("put", api(`/deals/${dealId}/money`), { fee: 1, currency: "EUR", paymentTermsDays: 0, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null, version: 1 }).expect(403);
    const invoice = await app.database.pool.query("select id from deliverables where deal_id = $1 and kind = 'invoice'", [dealId]);
    const refused = await as.editor.send("patch", api(`/deliverables/${invoice.rows[0].id}`), { status: "done", version: 1 }).expect(404);
    expect(JSON.stringify(refused.body)).not.toContain("invoice");
    const after = await app.database.pool.query("select fee_amount, (select status from deliverables where id = $2) as status from deals where id = $1", [dealId, invoice.rows[0].id]);
    expect(after.rows[0]).toEqual({ fee_amount: "4321.0000", status: "not_started" });
  });
});

describe("who may change a deliverable", () => {
  let dealId: string;
  let itemOf: (kind: string) => string;
  beforeAll(async () => {
    const episode = await createEpisode(app.db, world.channel.id, { targetPublishDate: "2027-06-30" });
    const sponsor = await createSponsor(app.db, world.channel.id);
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-06-30" });
    dealId = made.deal.id;
    itemOf = (kind) => made.items.find((i) => i.kind === kind)!.id;
  });
  /** A change of an item as its editor sends it: against the version the item has now. */
  const change = async (as: Visitor, kind: string, body: object, status: number) => {
    const { version } = (await app.database.pool.query("select version from deliverables where id = $1", [itemOf(kind)])).rows[0];
    return as.send("patch", api(`/deliverables/${itemOf(kind)}`), { ...body, version }).expect(status);
  };

  it("when the editor marks the draft cut sent, then it changes and the history names them", async () => {
    const done = await change(as.editor, "draft_cut", { status: "sent", note: "Uploaded v2" }, 200);
    const item = done.body.deal.deliverables.find((d: { kind: string }) => d.kind === "draft_cut");
    expect(item.status).toBe("sent");
    expect(item.history[0]).toMatchObject({ what: "status", actorName: "Edda Editor", fromStatus: "not_started", toStatus: "sent", note: "Uploaded v2" });
  });

  it("when the editor tries anything else, then it is refused and the item is as it was", async () => {
    await change(as.editor, "draft_cut", { offsetDays: 1 }, 403);
    await change(as.editor, "script_draft", { status: "done" }, 403);
    await change(as.crew, "draft_cut", { status: "done" }, 403);
    const rows = await app.database.pool.query("select kind, status, due_date::text from deliverables where deal_id = $1 and kind in ('draft_cut', 'script_draft') order by kind::text", [dealId]);
    expect(rows.rows).toEqual([
      { kind: "draft_cut", status: "sent", due_date: "2027-06-23" }, // 30 June − 7
      { kind: "script_draft", status: "not_started", due_date: "2027-06-09" }, // 30 June − 21
    ]);
  });

  it("when the producer sets a fixed date, then the item keeps it and says so", async () => {
    const changed = await change(as.producer, "report", { anchor: "fixed", fixedDate: "2027-08-15" }, 200);
    const item = changed.body.deal.deliverables.find((d: { kind: string }) => d.kind === "report");
    expect(item).toMatchObject({ anchor: "fixed", dueDate: "2027-08-15" });
    expect(item.history[0]).toMatchObject({ what: "due_moved", fromDate: "2027-07-30", toDate: "2027-08-15" }); // 30 June + 30 = 30 July
    const bad = await change(as.producer, "report", { status: "later" }, 400);
    expect(bad.body.error.fields).toEqual({ status: "Pick a status." });
  });

  it("when an open item's date has passed, then it reads as late, counted in days", async () => {
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    await change(as.producer, "script_approval", { anchor: "fixed", fixedDate: yesterday }, 200);
    const deal = (await as.producer.get(api(`/deals/${dealId}`)).expect(200)).body.deal as DealView;
    expect(deal.deliverables.find((d) => d.kind === "script_approval")).toMatchObject({ late: true, daysLate: 1 });
    await change(as.producer, "script_approval", { status: "approved" }, 200);
    const after = (await as.producer.get(api(`/deals/${dealId}`)).expect(200)).body.deal as DealView;
    expect(after.deliverables.find((d) => d.kind === "script_approval")).toMatchObject({ late: false, daysLate: 0 });
  });
});

describe("the read", () => {
  it("when the script is written, then words, read time at the host's rate, points, link and code are checked", async () => {
    const episode = await createEpisode(app.db, world.channel.id);
    const sponsor = await createSponsor(app.db, world.channel.id);
    const contact = await createContact(app.db, world.channel.id, sponsor.id);
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, talkingPoints: ["Holds 0.1 mV ripple", "Two-year warranty"] });
    await as.producer.send("put", api(`/speaking-rates/${world.owner.id}`), { wordsPerMinute: 120 }).expect(200);
    const script = "This video is sponsored by Northbeam. Their supply holds 0.1 mV ripple. Get ten percent off at northbeam.example/gantry with code GANTRY10.";
    const changed = await as.producer.send("patch", api(`/deals/${made.deal.id}`), { script, hostId: world.owner.id, contactId: contact.id, version: 1 }).expect(200);
    const deal: DealView = changed.body.deal;
    // 6 + 6 + 9 = 21 words at the host's 120 words a minute: 21 ÷ 120 × 60 = 10.5 s, against 60 s contracted.
    expect(deal.read).toMatchObject({ words: 21, wordsPerMinute: 120, estimatedSeconds: 10.5, contractedSeconds: 60, overBySeconds: -49.5, pointsCovered: 1, linkInScript: true, codeInScript: true });
    expect(deal.read.points.map((p) => p.covered)).toEqual(["phrase", null]);
    expect(deal.disclosure).toMatchObject({ inSegment: true, inDescription: false });
    expect(deal.host).toEqual({ id: world.owner.id, name: "Olive Owner", wordsPerMinute: 120 });

    const badRate = await as.producer.send("put", api(`/speaking-rates/${world.owner.id}`), { wordsPerMinute: 10 }).expect(400);
    expect(badRate.body.error.fields.wordsPerMinute).toMatch(/at least 60/);
  });

  it("when the editor enters the segment's in and out in the cut, then its real length is measured", async () => {
    const episode = await createEpisode(app.db, world.channel.id);
    const sponsor = await createSponsor(app.db, world.channel.id);
    const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id });
    // 29.97 DF: 00:10:00;00 to 00:11:00;02 is 1800 frames, as 00:00:00;00 to 00:01:00;02 is (OpenTimelineIO,
    // tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps: 30 × 59 + 30 = 1800); 1800 × 1001 / 30000 = 60.06 s.
    const set = await as.editor
      .send("put", api(`/deals/${made.deal.id}/cut`), { clipId: null, timing: { inTimecode: "00:10:00;00", outTimecode: "00:11:00;02", frameRate: "29.97", dropFrame: true }, version: 1 })
      .expect(200);
    expect(set.body.deal.cut.timing.measuredSeconds).toBeCloseTo(60.06, 6);
    const bad = await as.editor
      .send("put", api(`/deals/${made.deal.id}/cut`), { clipId: null, timing: { inTimecode: "00:01:00;00", outTimecode: "00:00:10;00", frameRate: "29.97", dropFrame: true }, version: 2 })
      .expect(400);
    // 00:01:00;00 is a label drop-frame skips (minute 1 is not divisible by ten).
    expect(bad.body.error.fields).toEqual({ "timing.inTimecode": expect.stringMatching(/.+/) });
    await as.crew.send("put", api(`/deals/${made.deal.id}/cut`), { clipId: null, timing: null, version: 2 }).expect(403);
    const kept = await app.database.pool.query("select cut_in, cut_out from deals where id = $1", [made.deal.id]);
    expect(kept.rows[0]).toEqual({ cut_in: "00:10:00;00", cut_out: "00:11:00;02" });
  });
});

describe("templates and settings", () => {
  it("when a template is saved with bad items, then each item field says why", async () => {
    const bad = await as.producer
      .send("post", api("/deal-templates"), { name: "", items: [{ kind: "script_draft", title: "", anchor: "before_publish", offsetDays: -1, ownerRole: null }] })
      .expect(400);
    expect(bad.body.error.fields).toMatchObject({ name: "Name the template.", "items.0.title": "Name the item.", "items.0.offsetDays": "Use 0 or more days." });
  });

  it("when the producer sets the reminder lead, then the settings keep it", async () => {
    const saved = await as.producer.send("put", api("/sponsor-settings"), { reminderDaysBefore: 3 }).expect(200);
    expect(saved.body.settings.reminderDaysBefore).toBe(3);
    const read = await as.crew.get(api("/sponsor-settings")).expect(200);
    expect(read.body.settings.hosts.find((h: { userId: string }) => h.userId === world.crew.id)).toMatchObject({ wordsPerMinute: 150, isDefault: true });
  });

  it("when a template is deleted, then deals made from it keep their items", async () => {
    const template = await createTemplate(app.db, world.channel.id);
    const episode = await createEpisode(app.db, world.channel.id);
    const sponsor = await createSponsor(app.db, world.channel.id);
    const made = await as.producer.send("post", api("/deals"), newDeal(episode.id, sponsor.id, { templateId: template.id })).expect(201);
    await as.producer.send("delete", api(`/deal-templates/${template.id}`)).expect(204);
    const deal = (await as.producer.get(api(`/deals/${made.body.deal.id}`)).expect(200)).body.deal;
    expect(deal.deliverables).toHaveLength(suggestedTemplateItems.length);
  });
});
