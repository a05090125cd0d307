import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dealInvoices } from "../../server/db/schema/sponsors";
import { createCrewedChannel } from "../factories/accounts";
import { createPart } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const jpeg = (size = 2000) => Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(size, 0x5a), Buffer.from([0xff, 0xd9])]);

async function setting(budget: { budgetAmount: string; budgetCurrency: string } | null = { budgetAmount: "250", budgetCurrency: "EUR" }) {
  const crewed = await createCrewedChannel(app.db, "Money Bench");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Ducted fan", ...budget });
  const producer = await app.signedIn(crewed.producer);
  const base = `/api/channels/${crewed.channel.id}`;
  const money = `${base}/episodes/${episode.id}/money`;
  return { ...crewed, episode, producer, base, money };
}

const add = (who: Visitor, money: string, body: { kind: string } & Record<string, unknown>) =>
  who.send("post", `${money}/entries`, { occurredOn: "2027-03-04", ...(body.kind === "hours" ? {} : { rate: "" }), ...body });
const lines = async (table: string, episodeId: string) => Number((await app.database.pool.query(`select count(*) from ${table} where episode_id = $1`, [episodeId])).rows[0].count);

async function paidInvoice(channelId: string, dealId: string, amountMinor: number, currency: string, paidAt = new Date("2027-03-20T10:00:00Z")) {
  await app.db.insert(dealInvoices).values({ channelId, dealId, position: 1, label: "Half on signing", amountMinor, currency, daysUntilDue: 30, providerId: `in_${dealId}`, status: "paid", paidAt });
}

describe("an episode's costs and income", () => {
  it("when the producer records parts, purchases, hours and income, then the margin and the budget add up in the channel's currency", async () => {
    const { channel, crew, episode, producer, base, money } = await setting();
    await producer.send("put", `${base}/money/settings`, { currency: "EUR", hourRate: "40", version: 0 }).expect(200);
    const part = await createPart(app.db, channel.id, { name: "Fan unit", price: { amount: "24.90", currency: "EUR" }, supplier: "Model shop" });
    const sponsor = await createSponsor(app.db, channel.id, { company: "Tidewell Tools" });
    const { deal } = await createDeal(app.db, channel.id, episode.id, { sponsorId: sponsor.id, fee: "1800.50", currency: "EUR", items: [] });
    await paidInvoice(channel.id, deal.id, 90025, "EUR");

    const partLine = await add(producer, money, { kind: "part", partId: part.id, quantity: 3 }).expect(201);
    // 3 × 24.90 EUR = 74.70 EUR, bought where the shelf says.
    expect(partLine.body.entry).toMatchObject({ kind: "part", label: "Fan unit", source: "Model shop", quantity: 3, unitMinor: 2490, amountMinor: 7470, channelMinor: 7470 });
    // 100.00 USD at 0.92 on the day: 92.00 EUR.
    const fare = await add(producer, money, { kind: "purchase", category: "travel", label: "Train to the test field", source: "Rail", amount: "100", currency: "USD", rate: "0.92" }).expect(201);
    expect(fare.body.entry).toMatchObject({ amountMinor: 10000, currency: "USD", rate: "0.92", channelMinor: 9200 });
    // 1.5 h at 40.00 EUR an hour: 60.00 EUR.
    await add(producer, money, { kind: "hours", memberId: crew.id, label: "Wiring", hours: "1.5" }).expect(201);
    await add(producer, money, { kind: "income", label: "Workshop ticket sales", amount: "25", currency: "EUR" }).expect(201);

    const { body } = await producer.get(money).expect(200);
    expect(body.money.entries.find((e: { kind: string }) => e.kind === "hours")).toMatchObject({ memberName: "Cato Crew", minutes: 90, amountMinor: 6000, currency: "EUR" });
    expect(body.money.deals).toEqual([expect.objectContaining({ company: "Tidewell Tools", feeMinor: 180050, invoicedMinor: 90025, paidMinor: 90025 })]);
    expect(body.money.totals).toMatchObject({ partsMinor: 7470, purchasesMinor: 9200, hoursMinor: 6000, costsMinor: 22670, feesMinor: 180050, paidMinor: 90025, otherIncomeMinor: 2500, receivedMinor: 92525, marginMinor: 92525 - 22670, expectedMarginMinor: 180050 + 2500 - 22670, uncounted: 0 });
    expect(body.money.budget).toEqual({ amountMinor: 25000, currency: "EUR", comparable: true, leftMinor: 25000 - 22670 });
    expect(body.money.settings).toMatchObject({ currency: "EUR", hourRateMinor: 4000, currencyChangeable: false });
  });

  it("refuses, and stores nothing for, a foreign amount without its rate, a part with no price, cents of a yen and another channel's part", async () => {
    const { channel, episode, producer, money } = await setting();
    const other = await createCrewedChannel(app.db, "Elsewhere");
    const priceless = await createPart(app.db, channel.id, { price: null });
    const foreign = await createPart(app.db, other.channel.id);
    const refusals = [
      [{ kind: "purchase", category: "rental", label: "Wind tunnel", source: "", amount: "80", currency: "GBP" }, "rate"],
      [{ kind: "part", partId: priceless.id, quantity: 1 }, "partId"],
      [{ kind: "part", partId: foreign.id, quantity: 1 }, "partId"],
      [{ kind: "purchase", category: "materials", label: "Washi tape", source: "", amount: "120.50", currency: "JPY", rate: "0.0062" }, "amount"],
      [{ kind: "hours", memberId: other.owner.id, label: "", hours: "2" }, "memberId"],
      [{ kind: "income", label: "Prints", amount: "10", currency: "EUR", rate: "-1" }, "rate"],
    ] as const;
    for (const [body, field] of refusals) {
      const refused = await add(producer, money, body).expect(400);
      expect(Object.keys(refused.body.error.fields)).toContain(field);
    }
    expect(await lines("money_entries", episode.id)).toBe(0);
  });

  it("leaves a fee in another currency out of the totals until its rate is entered, then counts it at that rate", async () => {
    const { channel, episode, producer, money } = await setting(null);
    const sponsor = await createSponsor(app.db, channel.id);
    const { deal } = await createDeal(app.db, channel.id, episode.id, { sponsorId: sponsor.id, fee: "1000.00", currency: "USD", items: [] });
    await paidInvoice(channel.id, deal.id, 100000, "USD");
    const before = (await producer.get(money).expect(200)).body.money;
    expect(before.deals[0]).toMatchObject({ rate: null, channel: null });
    expect(before.totals).toMatchObject({ feesMinor: 0, uncounted: 1 });

    await producer.send("put", `${money}/deals/${deal.id}/rate`, { rate: "0.9" }).expect(204);
    const after = (await producer.get(money).expect(200)).body.money;
    expect(after.deals[0]).toMatchObject({ rate: "0.9", channel: { feeMinor: 90000, invoicedMinor: 90000, paidMinor: 90000 } });
    expect(after.totals).toMatchObject({ receivedMinor: 90000, uncounted: 0 });
    expect(after.budget).toBeNull();
  });

  it("keeps a receipt still with a purchase, and refuses one for hours", async () => {
    const { crew, producer, money } = await setting();
    const purchase = (await add(producer, money, { kind: "purchase", category: "materials", label: "Carbon tube", source: "", amount: "18", currency: "EUR" }).expect(201)).body.entry;
    const hours = (await add(producer, money, { kind: "hours", memberId: crew.id, label: "", hours: "0:30" }).expect(201)).body.entry;
    const upload = (entryId: string) => producer.agent.post(`${money}/entries/${entryId}/receipt`).set("x-csrf-token", producer.csrf).field("size", "2006").attach("file", jpeg(), { filename: "till.jpg", contentType: "image/jpeg" });
    const sent = await upload(purchase.id).expect(201);
    expect((await fetch(sent.body.receipt.url)).status).toBe(200);
    await upload(hours.id).expect(409);
    const listed = (await producer.get(money).expect(200)).body.money.entries;
    expect(listed[0].receipt).toMatchObject({ fileName: "till.jpg" });
    // Hours with no hourly rate yet count nothing, and say so.
    expect(listed[1]).toMatchObject({ amountMinor: null, channelMinor: null });

    await producer.send("delete", `${money}/entries/${purchase.id}`).expect(204);
    expect((await producer.get(money).expect(200)).body.money.entries).toHaveLength(1);
  });
});

describe("the channel's money", () => {
  it("keeps its currency once money is recorded, and a stale save changes nothing", async () => {
    const { producer, base, money } = await setting();
    const saved = (await producer.send("put", `${base}/money/settings`, { currency: "GBP", hourRate: "", version: 0 }).expect(200)).body.settings;
    expect(saved).toMatchObject({ currency: "GBP", hourRateMinor: null, version: 1 });
    await producer.send("put", `${base}/money/settings`, { currency: "GBP", hourRate: "30", version: 0 }).expect(409);
    await add(producer, money, { kind: "income", label: "Prints", amount: "10", currency: "GBP" }).expect(201);
    const refused = await producer.send("put", `${base}/money/settings`, { currency: "EUR", hourRate: "", version: 1 }).expect(400);
    expect(refused.body.error.fields.currency).toMatch(/GBP/);
  });

  it("adds up each month and each episode, and exports every line as CSV", async () => {
    const { channel, episode, producer, base, money } = await setting();
    const sponsor = await createSponsor(app.db, channel.id, { company: "Tidewell Tools" });
    const { deal } = await createDeal(app.db, channel.id, episode.id, { sponsorId: sponsor.id, fee: "1800.50", currency: "EUR", items: [] });
    await paidInvoice(channel.id, deal.id, 180050, "EUR", new Date("2027-05-02T09:00:00Z"));
    await add(producer, money, { kind: "purchase", category: "materials", label: "=SUM(A1)", source: "Timber, yard", amount: "120", currency: "EUR", occurredOn: "2027-03-10" }).expect(201);

    const { body } = await producer.get(`${base}/money`).expect(200);
    expect(body.money.months).toEqual([
      { month: "2027-03", incomeMinor: 0, costsMinor: 12000, marginMinor: -12000 },
      { month: "2027-04", incomeMinor: 0, costsMinor: 0, marginMinor: 0 },
      { month: "2027-05", incomeMinor: 180050, costsMinor: 0, marginMinor: 180050 },
    ]);
    expect(body.money.episodes).toEqual([{ episodeId: episode.id, title: "Ducted fan", costsMinor: 12000, receivedMinor: 180050, marginMinor: 168050 }]);

    const csv = await producer.get(`${base}/money.csv`).expect(200);
    expect(csv.headers["content-type"]).toMatch(/^text\/csv/);
    const records = parse(csv.text) as string[][];
    expect(records).toHaveLength(3);
    expect(records[1]).toEqual(["2027-03-10", "Ducted fan", "cost", "Other purchase", "'=SUM(A1)", "Timber, yard", "", "120.00", "EUR", "", "120.00"]);
    expect(records[2]).toEqual(["2027-05-02", "Ducted fan", "income", "Sponsor payment", "Half on signing", "Tidewell Tools", "", "1800.50", "EUR", "", "1800.50"]);
  });
});
