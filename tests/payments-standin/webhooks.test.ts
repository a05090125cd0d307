import Stripe from "stripe";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { createPaymentsAccount, type PaymentsAccount } from "../support/payments";
import { refusal } from "./refusals";
import { startReceiver, type Receiver } from "./receiver";

/**
 * Webhook deliveries, checked with the SDK's own verification: `stripe.webhooks.constructEvent`
 * on the raw body, the Stripe-Signature header and the secret, with its documented tolerance of
 * 300 s (docs.stripe.com/webhooks, "Verify webhook signatures"); retries while the endpoint fails
 * or is down; and the test controls that resend, replay and reorder deliveries.
 */
const TOLERANCE_SECONDS = 300;
const SOON = { timeout: 20_000, interval: 100 };
let account: PaymentsAccount;
let stripe: Stripe;
let receiver: Receiver;

beforeAll(async () => {
  account = await createPaymentsAccount();
  stripe = account.stripe;
  receiver = await startReceiver();
  const endpoint = await stripe.webhookEndpoints.create({ url: receiver.url, enabled_events: ["*"] });
  expect(endpoint).toMatchObject({ object: "webhook_endpoint", status: "enabled", secret: account.webhookSecret });
});
afterEach(async () => {
  // A test that held deliveries must not leave them held for the next one.
  await account.controls.release();
});
afterAll(() => receiver.close());

const signedAt = (header: string) => Number(/^t=(\d+),/.exec(header)![1]);

async function deliveryOf(eventType: string, objectId: string) {
  await expect.poll(() => receiver.received.some((r) => r.body.includes(`"type": "${eventType}"`) && r.body.includes(objectId)), SOON).toBe(true);
  return receiver.received.find((r) => r.body.includes(`"type": "${eventType}"`) && r.body.includes(objectId))!;
}

describe("signed deliveries", () => {
  it("when something changes, then the event arrives signed as documented and the SDK's constructEvent accepts it as the same event /v1/events has", async () => {
    const customer = await stripe.customers.create({ name: "Signed Sponsor" });
    const delivery = await deliveryOf("customer.created", customer.id);
    expect(delivery.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = stripe.webhooks.constructEvent(delivery.body, delivery.signature, account.webhookSecret);
    expect(event).toMatchObject({ object: "event", type: "customer.created", livemode: false, data: { object: { id: customer.id, name: "Signed Sponsor" } } });
    expect(event.id).toMatch(/^evt_/);
    const listed = await stripe.events.retrieve(event.id);
    expect(listed).toMatchObject({ id: event.id, type: "customer.created", data: { object: { id: customer.id } } });
    await expect.poll(async () => (await stripe.events.retrieve(event.id)).pending_webhooks, SOON).toBe(0);
  });

  it("when the body is changed, the secret is another, or the delivery is checked more than 300 s after it was signed, then constructEvent refuses it", async () => {
    const customer = await stripe.customers.create({ name: "Tampered Sponsor" });
    const { body, signature } = await deliveryOf("customer.created", customer.id);
    const t = signedAt(signature);
    expect(() => stripe.webhooks.constructEvent(body.replace("Tampered Sponsor", "Tampered Sponsors"), signature, account.webhookSecret)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => stripe.webhooks.constructEvent(body, signature, "whsec_someoneelsessecret")).toThrow(Stripe.errors.StripeSignatureVerificationError);
    // receivedAt (ms) as if the request were checked later: 300 s old passes, 301 s old does not.
    expect(stripe.webhooks.constructEvent(body, signature, account.webhookSecret, TOLERANCE_SECONDS, undefined, (t + 300) * 1000).id).toEqual(expect.stringMatching(/^evt_/));
    expect(() => stripe.webhooks.constructEvent(body, signature, account.webhookSecret, TOLERANCE_SECONDS, undefined, (t + 301) * 1000)).toThrow(/tolerance/i);
  });
});

describe("retries", () => {
  it("when the endpoint answers 500 and then a redirect, then the event is tried again, freshly signed, until a 2xx", async () => {
    receiver.answerNext(500, 302);
    const customer = await stripe.customers.create({ name: "Retried Sponsor" });
    const [event] = (await stripe.events.list({ type: "customer.created", limit: 1 })).data;
    await expect.poll(async () => (await account.controls.deliveries(event!.id))[0]?.state, SOON).toBe("delivered");
    const [delivery] = await account.controls.deliveries(event!.id);
    expect(delivery!.attempts.map((attempt) => attempt.status)).toEqual([500, 302, 200]);
    const copies = receiver.received.filter((r) => r.body.includes(customer.id));
    expect(copies).toHaveLength(3);
    for (const copy of copies) expect(stripe.webhooks.constructEvent(copy.body, copy.signature, account.webhookSecret).id).toBe(event!.id);
  });

  it("when the endpoint is down as the sponsor pays, then invoice.paid is redelivered once it is back on the same address", async () => {
    const own = await createPaymentsAccount();
    const down = await startReceiver();
    await own.stripe.webhookEndpoints.create({ url: down.url, enabled_events: ["invoice.paid"] });
    await down.close();

    const customer = await own.stripe.customers.create({ name: "Paying While Down" });
    const invoice = await own.stripe.invoices.create({ customer: customer.id, currency: "eur", collection_method: "send_invoice", days_until_due: 14 });
    await own.stripe.invoiceItems.create({ customer: customer.id, invoice: invoice.id, amount: 180050 });
    const open = await own.stripe.invoices.finalizeInvoice(invoice.id);
    expect((await fetch(`${open.hosted_invoice_url}/pay`, { method: "POST", redirect: "manual" })).status).toBe(303);
    const [paid] = (await own.stripe.events.list({ type: "invoice.paid" })).data;
    await expect.poll(async () => (await own.controls.deliveries(paid!.id))[0]?.attempts.length ?? 0, SOON).toBeGreaterThanOrEqual(2);
    expect((await own.controls.deliveries(paid!.id))[0]).toMatchObject({ state: "pending", attempts: [{ status: null }, { status: null }] });

    const back = await startReceiver(down.port);
    try {
      await expect.poll(async () => (await own.controls.deliveries(paid!.id))[0]?.state, SOON).toBe("delivered");
      expect(back.received).toHaveLength(1);
      const event = own.stripe.webhooks.constructEvent(back.received[0]!.body, back.received[0]!.signature, own.webhookSecret);
      expect(event).toMatchObject({ id: paid!.id, type: "invoice.paid", data: { object: { id: invoice.id, status: "paid", amount_paid: 180050 } } });
    } finally {
      await back.close();
    }
  });
});

describe("test controls", () => {
  it("when an old event is resent, then it arrives again, freshly signed, as the same event", async () => {
    const customer = await stripe.customers.create({ name: "Resent Sponsor" });
    const first = await deliveryOf("customer.created", customer.id);
    const event = stripe.webhooks.constructEvent(first.body, first.signature, account.webhookSecret);
    const [resent] = await account.controls.resend(event.id);
    expect(resent).toMatchObject({ kind: "resend", state: "delivered", attempts: [{ status: 200 }] });
    const copies = receiver.received.filter((r) => r.body.includes(customer.id));
    expect(copies).toHaveLength(2);
    expect(copies[1]!.body).toBe(copies[0]!.body);
    expect(stripe.webhooks.constructEvent(copies[1]!.body, copies[1]!.signature, account.webhookSecret).id).toBe(event.id);
  });

  it("when an event's first request is replayed, then the same bytes and the same signature arrive, which constructEvent refuses once they are older than its tolerance", async () => {
    const customer = await stripe.customers.create({ name: "Replayed Sponsor" });
    const first = await deliveryOf("customer.created", customer.id);
    const event = stripe.webhooks.constructEvent(first.body, first.signature, account.webhookSecret);
    await account.controls.replay(event.id);
    const copies = receiver.received.filter((r) => r.body.includes(customer.id));
    expect(copies).toHaveLength(2);
    expect(copies[1]).toEqual(copies[0]);
    const later = (signedAt(copies[1]!.signature) + TOLERANCE_SECONDS + 1) * 1000;
    expect(() => stripe.webhooks.constructEvent(copies[1]!.body, copies[1]!.signature, account.webhookSecret, TOLERANCE_SECONDS, undefined, later)).toThrow(/tolerance/i);
  });

  it("when deliveries are held and released in reverse, then the newer event arrives before the older one", async () => {
    await account.controls.hold();
    const customer = await stripe.customers.create({ name: "Out Of Order" });
    await stripe.customers.update(customer.id, { email: "late@order.test" });
    const released = await account.controls.release("reverse");
    expect(released.map((delivery) => delivery.type)).toEqual(["customer.updated", "customer.created"]);
    const arrived = receiver.received.filter((r) => r.body.includes(customer.id)).map((r) => stripe.webhooks.constructEvent(r.body, r.signature, account.webhookSecret).type);
    expect(arrived).toEqual(["customer.updated", "customer.created"]);
  });

  it("when a control names an event of another account, then it is refused as missing", async () => {
    const other = await createPaymentsAccount();
    await other.stripe.customers.create({ name: "Not Yours" });
    const [theirs] = (await other.stripe.events.list({ limit: 1 })).data;
    await expect(account.controls.resend(theirs!.id)).rejects.toThrow(/No such event/);
    expect(await refusal(stripe.events.retrieve(theirs!.id))).toMatchObject({ status: 404, code: "resource_missing" });
  });
});
