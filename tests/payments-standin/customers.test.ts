import Stripe from "stripe";
import { beforeAll, describe, expect, it } from "vitest";
import { createPaymentsAccount, type PaymentsAccount } from "../support/payments";
import { refusal } from "./refusals";

/** Customers (a sponsor each) through the provider's SDK, and list paging as the SDK pages. */
let account: PaymentsAccount;
let stripe: Stripe;

beforeAll(async () => {
  account = await createPaymentsAccount();
  stripe = account.stripe;
});

describe("customers through the SDK", () => {
  it("when a customer is created, then it comes back shaped as the provider's: cus_ id, object, unix-second created, test mode, metadata", async () => {
    const before = Math.floor(Date.now() / 1000);
    const customer = await stripe.customers.create({ name: "Ferrule Tools", email: "sponsors@ferrule.test", metadata: { sponsor_id: "sp-17" }, preferred_locales: ["de-DE"] });
    expect(customer).toMatchObject({ object: "customer", livemode: false, name: "Ferrule Tools", email: "sponsors@ferrule.test", metadata: { sponsor_id: "sp-17" }, preferred_locales: ["de-DE"] });
    expect(customer.id).toMatch(/^cus_[A-Za-z0-9]{24}$/);
    expect(customer.created).toBeGreaterThanOrEqual(before);
    expect(customer.created).toBeLessThanOrEqual(Math.floor(Date.now() / 1000));
    expect(customer.invoice_prefix).toMatch(/^[A-Z0-9]{8}$/);
    expect(await stripe.customers.retrieve(customer.id)).toMatchObject({ id: customer.id, name: "Ferrule Tools" });
  });

  it("when a customer is updated, then only the given fields change, an empty metadata value removes its key, and customer.updated says what was before", async () => {
    const customer = await stripe.customers.create({ name: "Kerfline Saws", metadata: { sponsor_id: "sp-3", region: "north" } });
    const updated = await stripe.customers.update(customer.id, { email: "ap@kerfline.test", metadata: { region: "" } });
    expect(updated).toMatchObject({ name: "Kerfline Saws", email: "ap@kerfline.test", metadata: { sponsor_id: "sp-3" } });
    const [event] = (await stripe.events.list({ type: "customer.updated", limit: 1 })).data;
    expect(event?.data.object).toMatchObject({ id: customer.id, email: "ap@kerfline.test" });
    expect(event?.data.previous_attributes).toEqual({ email: null, metadata: { sponsor_id: "sp-3", region: "north" } });
  });

  it("when a customer does not exist, then the SDK throws StripeInvalidRequestError with resource_missing and 404", async () => {
    const refused = await refusal(stripe.customers.retrieve("cus_nobodyatall"));
    expect(refused.error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(refused).toMatchObject({ status: 404, type: "invalid_request_error", code: "resource_missing", param: "id", message: "No such customer: 'cus_nobodyatall'" });
  });

  it("when a parameter is not one the endpoint takes, then it is refused by name and nothing is made", async () => {
    const before = (await stripe.customers.list({ limit: 100 })).data.length;
    const refused = await refusal(stripe.customers.create({ name: "Typo Ltd", nmae: "x" } as Stripe.CustomerCreateParams));
    expect(refused).toMatchObject({ status: 400, code: "parameter_unknown", param: "nmae", message: "Received unknown parameter: nmae" });
    expect((await stripe.customers.list({ limit: 100 })).data).toHaveLength(before);
  });
});

describe("paging", () => {
  it("when customers are listed a page at a time, then pages follow newest first with has_more, starting_after and ending_before, and the SDK's auto-paging sees each once", async () => {
    const own = await createPaymentsAccount();
    const made: string[] = [];
    for (const name of ["One", "Two", "Three", "Four", "Five"]) made.push((await own.stripe.customers.create({ name })).id);
    const newestFirst = [...made].reverse();

    const first = await own.stripe.customers.list({ limit: 2 });
    expect(first).toMatchObject({ object: "list", has_more: true, url: "/v1/customers" });
    expect(first.data.map((c) => c.id)).toEqual(newestFirst.slice(0, 2));
    const second = await own.stripe.customers.list({ limit: 2, starting_after: first.data[1]!.id });
    expect(second.data.map((c) => c.id)).toEqual(newestFirst.slice(2, 4));
    const last = await own.stripe.customers.list({ limit: 2, starting_after: second.data[1]!.id });
    expect(last.data.map((c) => c.id)).toEqual(newestFirst.slice(4));
    expect(last.has_more).toBe(false);
    const back = await own.stripe.customers.list({ limit: 2, ending_before: second.data[0]!.id });
    expect(back.data.map((c) => c.id)).toEqual(newestFirst.slice(0, 2));

    const all = await own.stripe.customers.list({ limit: 2 }).autoPagingToArray({ limit: 100 });
    expect(all.map((c) => c.id)).toEqual(newestFirst);
  });

  it("when a page size is out of range, then it is refused on the limit parameter", async () => {
    expect(await refusal(stripe.customers.list({ limit: 101 }))).toMatchObject({ status: 400, param: "limit", message: "This value must be less than or equal to 100." });
    expect(await refusal(stripe.customers.list({ limit: 0 }))).toMatchObject({ status: 400, param: "limit" });
  });

  it("when customers are filtered by e-mail, then only theirs come back", async () => {
    const customer = await stripe.customers.create({ name: "Filter Me", email: "only-me@sponsor.test" });
    const found = await stripe.customers.list({ email: "only-me@sponsor.test" });
    expect(found.data.map((c) => c.id)).toEqual([customer.id]);
  });
});
