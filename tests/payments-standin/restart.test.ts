import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { startPaymentsStandIn, type PaymentsStandIn } from "../../dev-services/payments/server";
import { newSecretKey, newWebhookSecret } from "../../dev-services/payments/store";
import { TEST_RETRY } from "../../dev-services/payments/webhooks";
import { standInControls, stripeClient } from "../support/payments";
import { startReceiver } from "./receiver";

/**
 * A stand-in of the test's own, stopped and started again on its data file, as `npm start` is
 * between two sessions: what it made, its idempotent answers and its unfinished webhook deliveries
 * are all still there.
 */
let dataDir: string;
let running: PaymentsStandIn | undefined;
const keys = { secretKey: newSecretKey(), webhookSecret: newWebhookSecret() };

beforeAll(() => {
  dataDir = mkdtempSync(path.join(os.tmpdir(), "kerf-payments-restart-"));
});
afterEach(async () => {
  await running?.stop();
  running = undefined;
});
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

async function start(file: string) {
  running = await startPaymentsStandIn({ port: 0, dataFile: path.join(dataDir, file), ...keys, retry: TEST_RETRY });
  return { standIn: running, stripe: stripeClient(running.url, keys.secretKey), controls: standInControls(running.url, keys.secretKey) };
}

describe("when the stand-in restarts", () => {
  it("then its customers, invoices, events and idempotent answers are still there, and invoice pages move to its new address", async () => {
    const before = await start("kept.json");
    const key = randomUUID();
    const customer = await before.stripe.customers.create({ name: "Kept Sponsor" }, { idempotencyKey: key });
    const invoice = await before.stripe.invoices.create({ customer: customer.id, currency: "eur", collection_method: "send_invoice", days_until_due: 30 });
    await before.stripe.invoiceItems.create({ customer: customer.id, invoice: invoice.id, amount: 4200 });
    const open = await before.stripe.invoices.finalizeInvoice(invoice.id);
    await before.standIn.stop();
    running = undefined;

    const after = await start("kept.json");
    expect(after.standIn.url).not.toBe(before.standIn.url);
    const again = await after.stripe.invoices.retrieve(invoice.id);
    expect(again).toMatchObject({ status: "open", number: open.number, amount_due: 4200 });
    expect(again.hosted_invoice_url).toBe(open.hosted_invoice_url!.replace(before.standIn.url, after.standIn.url));
    expect((await fetch(again.hosted_invoice_url!)).status).toBe(200);
    expect((await after.stripe.customers.create({ name: "Kept Sponsor" }, { idempotencyKey: key })).id).toBe(customer.id);
    expect((await after.stripe.events.list({ limit: 100 })).data.map((event) => event.type)).toEqual(["invoice.finalized", "invoiceitem.created", "invoice.created", "customer.created"]);
  });

  it("then a delivery its endpoint never took is sent once the endpoint is back", async () => {
    const endpoint = await startReceiver();
    const port = endpoint.port;
    await endpoint.close();
    const before = await start("pending.json");
    await before.stripe.webhookEndpoints.create({ url: `http://127.0.0.1:${port}/webhook`, enabled_events: ["customer.created"] });
    const customer = await before.stripe.customers.create({ name: "Delivered Later" });
    const [event] = (await before.stripe.events.list({ limit: 1 })).data;
    await expect.poll(async () => (await before.controls.deliveries(event!.id))[0]?.attempts.length ?? 0, { timeout: 10_000 }).toBeGreaterThanOrEqual(1);
    await before.standIn.stop();
    running = undefined;

    const back = await startReceiver(port);
    try {
      const after = await start("pending.json");
      await expect.poll(async () => (await after.controls.deliveries(event!.id))[0]?.state, { timeout: 10_000 }).toBe("delivered");
      expect(back.received).toHaveLength(1);
      expect(after.stripe.webhooks.constructEvent(back.received[0]!.body, back.received[0]!.signature, keys.webhookSecret)).toMatchObject({
        id: event!.id,
        data: { object: { id: customer.id } },
      });
    } finally {
      await back.close();
    }
  });
});
