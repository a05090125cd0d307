import { randomUUID } from "node:crypto";
import Stripe from "stripe";
import { beforeAll, describe, expect, it } from "vitest";
import { createPaymentsAccount, stripeClient, type PaymentsAccount } from "../support/payments";
import { refusal } from "./refusals";

/**
 * The secret key and Idempotency-Key, as the provider documents them: a wrong key is a 401; a
 * retried request with the same key and parameters gets the first answer again; the same key with
 * other parameters is an idempotency error (docs.stripe.com/api/idempotent_requests).
 */
let account: PaymentsAccount;
let stripe: Stripe;

beforeAll(async () => {
  account = await createPaymentsAccount();
  stripe = account.stripe;
});

describe("the secret key", () => {
  it("when the key is wrong, then the SDK throws StripeAuthenticationError and the answer is a 401 in the provider's shape", async () => {
    const wrong = stripeClient(account.apiUrl, "sk_test_thisisnotakeyanyoneknows");
    const refused = await refusal(wrong.customers.list());
    expect(refused.error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(refused).toMatchObject({ status: 401, type: "invalid_request_error", message: `Invalid API Key provided: sk_test_${"*".repeat(20)}nows` });
  });

  it("when no key is sent, then the answer is a 401 that says how to send one", async () => {
    const response = await fetch(`${account.apiUrl}/v1/customers`);
    expect(response.status).toBe(401);
    expect(response.headers.get("request-id")).toMatch(/^req_/);
    expect(await response.json()).toEqual({
      error: {
        type: "invalid_request_error",
        message: "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
      },
    });
  });

  it("when two accounts use the stand-in, then neither sees the other's customers", async () => {
    const other = await createPaymentsAccount();
    const theirs = await other.stripe.customers.create({ name: "Someone Else's" });
    expect(await refusal(stripe.customers.retrieve(theirs.id))).toMatchObject({ status: 404, code: "resource_missing" });
    expect((await stripe.customers.list({ limit: 100 })).data.map((customer) => customer.id)).not.toContain(theirs.id);
  });

  it("when a path is not part of the API, then it is refused as the provider refuses unknown URLs", async () => {
    const response = await fetch(`${account.apiUrl}/v1/subscriptions`, { headers: { authorization: `Bearer ${account.secretKey}` } });
    expect(response.status).toBe(404);
    expect(await response.json()).toEqual({ error: { type: "invalid_request_error", message: "Unrecognized request URL (GET: /v1/subscriptions)." } });
  });
});

describe("idempotent retries", () => {
  it("when a create is retried with the same key and parameters, then the first answer comes back, marked as replayed, and nothing is made twice", async () => {
    const key = randomUUID();
    const first = await stripe.customers.create({ name: "Retried Once", metadata: { sponsor_id: "sp-9" } }, { idempotencyKey: key });
    const again = await stripe.customers.create({ name: "Retried Once", metadata: { sponsor_id: "sp-9" } }, { idempotencyKey: key });
    expect(again.id).toBe(first.id);
    expect(again.lastResponse.headers["idempotent-replayed"]).toBe("true");
    expect(first.lastResponse.headers["idempotent-replayed"]).toBeUndefined();
    expect((await stripe.customers.list({ limit: 100 })).data.filter((customer) => customer.name === "Retried Once")).toHaveLength(1);
    const created = (await stripe.events.list({ type: "customer.created", limit: 100 })).data.filter((event) => (event.data.object as { id: string }).id === first.id);
    expect(created).toHaveLength(1);
    expect(created[0]!.request).toEqual({ id: first.lastResponse.requestId, idempotency_key: key });
  });

  it("when the same key comes with other parameters or to another endpoint, then the SDK throws StripeIdempotencyError", async () => {
    const key = randomUUID();
    await stripe.customers.create({ name: "Keyed" }, { idempotencyKey: key });
    const other = await refusal(stripe.customers.create({ name: "Keyed, but different" }, { idempotencyKey: key }));
    expect(other.error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(other).toMatchObject({
      status: 400,
      type: "idempotency_error",
      message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
    });
    const elsewhere = await refusal(stripe.invoiceItems.create({ customer: "cus_x", amount: 1, currency: "eur" }, { idempotencyKey: key }));
    expect(elsewhere.error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it("when a state refusal is retried with its key, then the saved refusal comes back even after the state changed; a refusal of its parameters is not saved", async () => {
    const customer = await stripe.customers.create({ name: "Saved Refusal" });
    const draft = await stripe.invoices.create({ customer: customer.id, currency: "eur", collection_method: "send_invoice", days_until_due: 7 });
    const key = randomUUID();
    expect(await refusal(stripe.invoices.voidInvoice(draft.id, {}, { idempotencyKey: key }))).toMatchObject({ status: 400 });
    await stripe.invoiceItems.create({ customer: customer.id, invoice: draft.id, amount: 700, currency: "eur" });
    await stripe.invoices.finalizeInvoice(draft.id);
    const replayed = await refusal(stripe.invoices.voidInvoice(draft.id, {}, { idempotencyKey: key }));
    expect(replayed).toMatchObject({ status: 400, message: "You can only pass in open invoices. This invoice isn't open." });
    expect(replayed.error.headers?.["idempotent-replayed"]).toBe("true");
    expect((await stripe.invoices.retrieve(draft.id)).status).toBe("open");

    const validationKey = randomUUID();
    expect(await refusal(stripe.invoices.create({ customer: customer.id, currency: "eur", collection_method: "send_invoice" }, { idempotencyKey: validationKey }))).toMatchObject({ status: 400 });
    const retried = await stripe.invoices.create({ customer: customer.id, currency: "eur", collection_method: "send_invoice", days_until_due: 7 }, { idempotencyKey: validationKey });
    expect(retried.status).toBe("draft");
  });
});
