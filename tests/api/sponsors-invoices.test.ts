import { randomUUID } from "node:crypto";
import type Stripe from "stripe";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import type { InvoiceView } from "../../shared/sponsors/invoices";
import { remindOverdueInvoices } from "../../server/sponsors/invoice-reminders";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { mailJobsTo, waitForJobStates } from "../support/jobs";
import { waitForMail } from "../support/mailbox";
import { createPaymentsAccount, type PaymentsAccount } from "../support/payments";
import { refuseWritesTo, tableFingerprints, changedTables } from "../support/rows-snapshot";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
let account: PaymentsAccount;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
let producer: Visitor;
let faults: { restore: () => Promise<void> }[] = [];

beforeAll(async () => {
  // A payments account of this file's own, whose events go to this file's app.
  account = await createPaymentsAccount();
  app = await startTestApp({ payments: account });
  const port = (app.server.address() as { port: number }).port;
  await account.stripe.webhookEndpoints.create({ url: `http://127.0.0.1:${port}/api/payments/webhook`, enabled_events: ["*"] });
  world = await createCrewedChannel(app.db, "Invoice Bench");
  producer = await app.signedIn(world.producer);
});
afterEach(async () => {
  for (const fault of faults) await fault.restore();
  faults = [];
});
afterAll(async () => {
  await app.close();
});

const api = (path: string) => `/api/channels/${world.channel.id}${path}`;

async function dealFor(fee: string, currency: string) {
  const episode = await createEpisode(app.db, world.channel.id, { title: `Bench ${randomUUID().slice(0, 6)}` });
  const sponsor = await createSponsor(app.db, world.channel.id, { company: `Sponsor ${randomUUID().slice(0, 6)}` });
  const contact = await createContact(app.db, world.channel.id, sponsor.id, { name: "Rafa Ortiz", email: `payables-${randomUUID().slice(0, 6)}@example.com` });
  const made = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, fee, currency });
  return { sponsor, contact, deal: made.deal };
}

const newInvoice = async (dealId: string, body: { label: string; amount: string | null }) =>
  (await producer.send("post", api(`/deals/${dealId}/invoices`), body).expect(201)).body.invoice as InvoiceView;
const act = async (dealId: string, invoiceId: string, action: string) => (await producer.send("post", api(`/deals/${dealId}/invoices/${invoiceId}/${action}`)).expect(200)).body.invoice as InvoiceView;
const listed = async (dealId: string) => (await producer.get(api(`/deals/${dealId}/invoices`)).expect(200)).body.invoices as InvoiceView[];
const row = async (invoiceId: string) => (await app.database.pool.query("select * from deal_invoices where id = $1", [invoiceId])).rows[0];
const itemStatus = async (dealId: string, kind: string) => (await app.database.pool.query("select status from deliverables where deal_id = $1 and kind = $2", [dealId, kind])).rows.map((r) => r.status);

/** Waits on Kerf's own record until the webhook has moved the invoice to `status`. */
const until = (invoiceId: string, status: string) => expect.poll(async () => (await row(invoiceId))?.status, { timeout: 20_000 }).toBe(status);

async function providerEvent(providerId: string, type: string): Promise<Stripe.Event> {
  let found: Stripe.Event | undefined;
  await expect
    .poll(async () => {
      found = (await account.stripe.events.list({ type, limit: 100 })).data.find((e) => (e.data.object as { id?: string }).id === providerId);
      return found !== undefined;
    })
    .toBe(true);
  return found!;
}

describe("an invoice's life through the payments provider", () => {
  it("when the producer invoices the whole fee, finalises and sends it and the sponsor pays, then the webhook marks it paid and the deal's items follow", async () => {
    const { deal, sponsor, contact } = await dealFor("1800.50", "EUR");
    const draft = await newInvoice(deal.id, { label: "Sponsored segment", amount: null });
    expect(draft).toMatchObject({ stage: "draft", status: "draft", amountMinor: 180050, currency: "EUR", daysUntilDue: 30, hostedUrl: null });

    // At the provider: a customer for the sponsor (kept), one line in minor units, the deal's terms.
    const kept = (await app.database.pool.query("select payments_customer_id from sponsors where id = $1", [sponsor.id])).rows[0].payments_customer_id;
    const customer = await account.stripe.customers.retrieve(kept);
    expect(customer).toMatchObject({ name: sponsor.company, email: contact.email });
    const { providerId } = { providerId: (await row(draft.id)).provider_id as string };
    const atProvider = await account.stripe.invoices.retrieve(providerId);
    expect(atProvider).toMatchObject({ customer: kept, currency: "eur", collection_method: "send_invoice", total: 180050, status: "draft" });
    const lines = await account.stripe.invoices.listLineItems(providerId);
    expect(lines.data.map((l) => [l.description, l.amount])).toEqual([["Sponsored segment", 180050]]);

    const finalised = await act(deal.id, draft.id, "finalise");
    expect(finalised).toMatchObject({ stage: "finalised", status: "open" });
    expect(finalised.number).toBeTruthy();
    expect(finalised.hostedUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/i\//);
    expect(finalised.dueDate).toBe((await account.stripe.invoices.retrieve(providerId)).due_date && new Date((await account.stripe.invoices.retrieve(providerId)).due_date! * 1000).toISOString().slice(0, 10));

    const sent = await act(deal.id, draft.id, "send");
    expect(sent.stage).toBe("sent");
    expect(await itemStatus(deal.id, "invoice")).toEqual(["done"]);
    const mail = await waitForMail(contact.email);
    expect(mail.text).toContain(finalised.hostedUrl!);
    expect(mail.text).toContain("€1,800.50");

    // Sending does not pay it; only the provider's event does.
    expect((await row(draft.id)).status).toBe("open");
    await account.stripe.invoices.pay(providerId, { paid_out_of_band: true });
    await until(draft.id, "paid");
    const [paid] = await listed(deal.id);
    expect(paid).toMatchObject({ stage: "paid", amountMinor: 180050 });
    expect(paid!.paidAt).toBeTruthy();
    expect(await itemStatus(deal.id, "payment")).toEqual(["done"]);

    // A second deal of the same sponsor invoices the same customer.
    const episode = await createEpisode(app.db, world.channel.id, { title: "Second build" });
    const second = await createDeal(app.db, world.channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, fee: "100.00" });
    const again = await newInvoice(second.deal.id, { label: "Second segment", amount: null });
    expect((await account.stripe.invoices.retrieve((await row(again.id)).provider_id)).customer).toBe(kept);
  });

  it("when a deal is invoiced in instalments, then each asks its part and together never more than the fee", async () => {
    const { deal } = await dealFor("1800.50", "EUR");
    const half = await newInvoice(deal.id, { label: "Half on signing", amount: "900.25" });
    expect(half).toMatchObject({ position: 1, amountMinor: 90025 });
    const tooMuch = await producer.send("post", api(`/deals/${deal.id}/invoices`), { label: "Too much", amount: "1,000" }).expect(400);
    expect(tooMuch.body.error.fields.amount).toBe("That is more than the 900.25 EUR of the fee not yet invoiced.");
    const rest = await newInvoice(deal.id, { label: "Half on go-live", amount: null });
    expect(rest).toMatchObject({ position: 2, amountMinor: 90025 });
    const none = await producer.send("post", api(`/deals/${deal.id}/invoices`), { label: "More", amount: null }).expect(400);
    expect(none.body.error.fields.amount).toBe("The whole fee is already invoiced.");
    // A cancelled instalment frees its part again.
    await act(deal.id, half.id, "void");
    expect((await newInvoice(deal.id, { label: "Half on signing, again", amount: null })).amountMinor).toBe(90025);
  });

  it("when the deal is in JPY or KWD, then the amounts are in that currency's minor unit (ISO 4217: JPY 0, KWD 3)", async () => {
    const yen = await dealFor("180000.00", "JPY");
    const refused = await producer.send("post", api(`/deals/${yen.deal.id}/invoices`), { label: "Part", amount: "1800.50" }).expect(400);
    expect(refused.body.error.fields.amount).toBe("JPY has no minor unit: use whole amounts.");
    const part = await newInvoice(yen.deal.id, { label: "Part", amount: "1,800" });
    expect(part.amountMinor).toBe(1800);
    expect((await account.stripe.invoices.retrieve((await row(part.id)).provider_id)).total).toBe(1800);

    const dinar = await dealFor("1800.50", "KWD");
    const fils = await newInvoice(dinar.deal.id, { label: "Part", amount: "100.125" });
    expect(fils.amountMinor).toBe(100125);
    const rest = await newInvoice(dinar.deal.id, { label: "Rest", amount: null });
    expect(rest.amountMinor).toBe(1800500 - 100125);
  });

  it("when a fee is set in JPY or KWD, then it takes that currency's decimals, no more, and is invoiced whole", async () => {
    const { deal } = await dealFor("100.00", "EUR");
    const setMoney = (fee: string, currency: string, version: number) =>
      producer.send("put", api(`/deals/${deal.id}/money`), { fee, currency, paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null, version });
    const version = (await producer.get(api(`/deals/${deal.id}`)).expect(200)).body.deal.version as number;
    expect((await setMoney("180,000.50", "JPY", version).expect(400)).body.error.fields.fee).toBe("JPY has no minor unit: use whole amounts.");
    expect((await setMoney("1,800.1255", "KWD", version).expect(400)).body.error.fields.fee).toBe("KWD has 3 decimals at most.");
    const saved = (await setMoney("1,800.125", "KWD", version).expect(200)).body.deal;
    expect(saved.money).toMatchObject({ fee: 1800.125, currency: "KWD" });
    expect((await app.database.pool.query("select fee_amount from deals where id = $1", [deal.id])).rows[0].fee_amount).toBe("1800.1250");
    expect((await newInvoice(deal.id, { label: "Whole fee", amount: null })).amountMinor).toBe(1800125);
  });

  it("when an invoice is cancelled or written off, then the provider says so and a cancelled one can't change again", async () => {
    const { deal } = await dealFor("500.00", "EUR");
    const one = await newInvoice(deal.id, { label: "Part one", amount: "200" });
    await act(deal.id, one.id, "finalise");
    expect(await act(deal.id, one.id, "write-off")).toMatchObject({ status: "uncollectible", stage: "uncollectible" });
    expect(await act(deal.id, one.id, "void")).toMatchObject({ status: "void", stage: "void" });
    const again = await producer.send("post", api(`/deals/${deal.id}/invoices/${one.id}/send`)).expect(409);
    expect(again.body.error.message).toBe("This invoice is cancelled: it can't change any more.");
    const draft = await newInvoice(deal.id, { label: "Part two", amount: "100" });
    expect((await producer.send("post", api(`/deals/${deal.id}/invoices/${draft.id}/send`)).expect(409)).body.error.message).toBe("Finalise the invoice first.");
    // Another deal's path does not reach this invoice.
    const other = await dealFor("10.00", "EUR");
    await producer.send("post", api(`/deals/${other.deal.id}/invoices/${draft.id}/finalise`)).expect(404);
  });
});

describe("the provider's webhook", () => {
  async function paidInvoice() {
    const { deal } = await dealFor("300.00", "EUR");
    const invoice = await newInvoice(deal.id, { label: "Whole fee", amount: null });
    await act(deal.id, invoice.id, "finalise");
    return { deal, invoice, providerId: (await row(invoice.id)).provider_id as string };
  }

  const post = (body: string, header: string) =>
    app.visitor().then((v) => v.agent.post("/api/payments/webhook").set("content-type", "application/json").set("stripe-signature", header).send(body));

  it("when an event has a bad signature, an old timestamp or a changed body, then it answers 400 and changes nothing", async () => {
    const { invoice, providerId } = await paidInvoice();
    const object = { ...(await account.stripe.invoices.retrieve(providerId)), status: "paid" };
    const payload = JSON.stringify({ id: `evt_forged_${randomUUID()}`, object: "event", type: "invoice.paid", created: Math.floor(Date.now() / 1000), data: { object } });
    const sign = (body: string, options: { secret?: string; timestamp?: number } = {}) =>
      account.stripe.webhooks.generateTestHeaderString({ payload: body, secret: options.secret ?? account.webhookSecret, timestamp: options.timestamp });
    const before = await tableFingerprints(app);

    const badSecret = await post(payload, sign(payload, { secret: "whsec_not_the_one" }));
    // 301 s: one past the provider's documented default tolerance of 300 s.
    const old = await post(payload, sign(payload, { timestamp: Math.floor(Date.now() / 1000) - 301 }));
    const changed = await post(payload.replace('"paid"', '"void"'), sign(payload));
    const unsigned = await post(payload, "");
    for (const answer of [badSecret, old, changed, unsigned]) {
      expect(answer.status).toBe(400);
      expect(answer.body.error.code).toBe("validation_failed");
    }
    expect(changedTables(before, await tableFingerprints(app)).filter((t) => t !== "session")).toEqual([]);
    expect((await row(invoice.id)).status).toBe("open");

    // The same event, rightly signed, is taken.
    expect((await post(payload, sign(payload))).status).toBe(200);
    expect((await row(invoice.id)).status).toBe("paid");
  });

  it("when events come twice and out of order, then one correct state is left and each event is recorded once", async () => {
    const { deal, invoice, providerId } = await paidInvoice();
    await account.controls.hold();
    await account.stripe.invoices.pay(providerId, { paid_out_of_band: true });
    // The late "finalized" comes after "paid"; then "paid" again.
    await account.controls.release("reverse");
    await until(invoice.id, "paid");
    const paidEvent = await providerEvent(providerId, "invoice.paid");
    const finalized = await providerEvent(providerId, "invoice.finalized");
    await expect.poll(async () => (await account.controls.deliveries(finalized.id)).some((d) => d.state === "delivered")).toBe(true);
    expect((await row(invoice.id)).status).toBe("paid");

    const settled = await row(invoice.id);
    await account.controls.resend(paidEvent.id);
    await expect.poll(async () => (await account.controls.deliveries(paidEvent.id)).filter((d) => d.state === "delivered").length).toBe(2);
    const after = await row(invoice.id);
    expect(after.version).toBe(settled.version);
    expect(after.status).toBe("paid");
    const recorded = await app.database.pool.query("select event_id from payment_events where event_id = $1", [paidEvent.id]);
    expect(recorded.rowCount).toBe(1);
    expect(await itemStatus(deal.id, "payment")).toEqual(["done"]);
    const history = await app.database.pool.query("select count(*)::int as n from deliverable_events e join deliverables d on d.id = e.deliverable_id where d.deal_id = $1 and d.kind = 'payment' and e.to_status = 'done'", [deal.id]);
    expect(history.rows[0].n).toBe(1);
  });

  it("when Kerf fails between the provider's 'paid' and its own commit, then the redelivered event marks it paid once", async () => {
    const { deal, invoice, providerId } = await paidInvoice();
    // The handler verifies the event, then its write is refused: the transaction rolls back, event row and all.
    faults.push(await refuseWritesTo(app, "deal_invoices"));
    await account.stripe.invoices.pay(providerId, { paid_out_of_band: true });
    const paidEvent = await providerEvent(providerId, "invoice.paid");
    await expect.poll(async () => (await account.controls.deliveries(paidEvent.id)).some((d) => d.attempts.some((a) => a.status === 500)), { timeout: 20_000 }).toBe(true);
    expect((await row(invoice.id)).status).toBe("open");
    expect((await app.database.pool.query("select 1 from payment_events where event_id = $1", [paidEvent.id])).rowCount).toBe(0);

    await faults.pop()!.restore();
    await account.controls.resend(paidEvent.id);
    await until(invoice.id, "paid");
    await account.controls.resend(paidEvent.id);
    await expect.poll(async () => (await account.controls.deliveries(paidEvent.id)).filter((d) => d.state === "delivered").length).toBeGreaterThanOrEqual(2);
    const history = await app.database.pool.query("select count(*)::int as n from deliverable_events e join deliverables d on d.id = e.deliverable_id where d.deal_id = $1 and d.kind = 'payment' and e.to_status = 'done'", [deal.id]);
    expect(history.rows[0].n).toBe(1);
    expect((await app.database.pool.query("select outcome from payment_events where event_id = $1", [paidEvent.id])).rows).toEqual([{ outcome: "applied" }]);
  });

  it("when an event is about an object Kerf doesn't hold, then it is recorded and ignored", async () => {
    const customer = await account.stripe.customers.create({ name: "Not a sponsor of any channel" });
    const created = await providerEvent(customer.id, "customer.created");
    await expect.poll(async () => (await app.database.pool.query("select outcome, channel_id from payment_events where event_id = $1", [created.id])).rows).toEqual([{ outcome: "ignored", channel_id: null }]);
  });
});

describe("overdue invoices", () => {
  it("when an invoice is past its terms, then the desk lists it and its maker is reminded once", async () => {
    const { deal } = await dealFor("750.00", "EUR");
    const invoice = await newInvoice(deal.id, { label: "Whole fee", amount: null });
    await act(deal.id, invoice.id, "finalise");
    await app.database.pool.query("update deal_invoices set due_date = current_date - 3 where id = $1", [invoice.id]);
    const overdue = (await producer.get(api("/invoices/overdue")).expect(200)).body.invoices as { id: string; daysLate: number }[];
    expect(overdue.find((o) => o.id === invoice.id)?.daysLate).toBe(3);
    expect((await listed(deal.id))[0]!.overdue).toBe(true);

    const deps = { db: app.db, jobs: app.deps.jobs, appUrl: "http://kerf.test" };
    expect((await remindOverdueInvoices(deps)).sent).toBeGreaterThanOrEqual(1);
    await remindOverdueInvoices(deps);
    const jobs = await mailJobsTo(app.database.pool, world.producer.email);
    // The only mail to the producer in this file: the one reminder.
    expect(jobs).toHaveLength(1);
    await waitForJobStates(app.database.pool, jobs.map((j) => j.id));
    const mail = await waitForMail(world.producer.email);
    expect(mail.subject).toContain("Overdue");
  });
});
