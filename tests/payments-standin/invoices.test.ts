import Stripe from "stripe";
import { beforeAll, describe, expect, it } from "vitest";
import { createPaymentsAccount, type PaymentsAccount } from "../support/payments";
import { refusal } from "./refusals";

/**
 * An invoice's life through the provider's SDK, and the state rules of the provider's "Status
 * transitions and finalization" page (docs.stripe.com/invoicing/integration/workflow-transitions):
 * draft → open → paid, open → void or uncollectible, uncollectible → paid or void; drafts are
 * deleted, never voided; items change only on drafts.
 */
const DAY = 86_400;
let account: PaymentsAccount;
let stripe: Stripe;

beforeAll(async () => {
  account = await createPaymentsAccount();
  stripe = account.stripe;
});

const sponsor = (name = "Ferrule Tools") => stripe.customers.create({ name, email: `${name.toLowerCase().replace(/\W+/g, ".")}@sponsor.test` });

async function draft(customer: string, extra: Partial<Stripe.InvoiceCreateParams> = {}) {
  return stripe.invoices.create({ customer, currency: "eur", collection_method: "send_invoice", days_until_due: 30, ...extra });
}

async function openInvoice(amount = 180050) {
  const customer = await sponsor();
  const invoice = await draft(customer.id);
  await stripe.invoiceItems.create({ customer: customer.id, invoice: invoice.id, amount, currency: "eur", description: "Sponsor read" });
  return stripe.invoices.finalizeInvoice(invoice.id);
}

describe("an invoice's life", () => {
  it("when a deal is invoiced, finalized, sent and paid outside the provider, then each step shows as the provider shows it, with its events", async () => {
    const customer = await sponsor();
    const created = await draft(customer.id, { description: "Dovetail jig episode: integration", metadata: { deal_id: "deal-42", instalment: "1/2" } });
    expect(created).toMatchObject({
      object: "invoice",
      livemode: false,
      status: "draft",
      customer: customer.id,
      currency: "eur",
      collection_method: "send_invoice",
      number: null,
      hosted_invoice_url: null,
      metadata: { deal_id: "deal-42", instalment: "1/2" },
      amount_due: 0,
    });
    expect(created.id).toMatch(/^in_/);
    expect(created.due_date).toBe(created.created + 30 * DAY);

    const item = await stripe.invoiceItems.create({ customer: customer.id, invoice: created.id, amount: 90025, currency: "eur", description: "Half on signing" });
    expect(item).toMatchObject({ object: "invoiceitem", amount: 90025, invoice: created.id, quantity: 1 });
    expect(item.id).toMatch(/^ii_/);
    // 450.125 minor units × 2 = 900.25, rounded to 900 minor units.
    const byUnit = await stripe.invoiceItems.create({ customer: customer.id, invoice: created.id, unit_amount_decimal: Stripe.Decimal.from("450.125"), quantity: 2, description: "Props" });
    expect(byUnit.amount).toBe(900);
    expect(String(byUnit.pricing?.unit_amount_decimal)).toBe("450.125");

    const finalized = await stripe.invoices.finalizeInvoice(created.id);
    expect(finalized).toMatchObject({ status: "open", amount_due: 90925, amount_paid: 0, amount_remaining: 90925, total: 90925, subtotal: 90925 });
    expect(finalized.number).toBe(`${customer.invoice_prefix}-0001`);
    expect(finalized.hosted_invoice_url).toMatch(new RegExp(`^${account.apiUrl}/i/[A-Za-z0-9]{40}$`));
    expect(finalized.status_transitions.finalized_at).toBeGreaterThanOrEqual(created.created);
    expect(finalized.lines).toMatchObject({ object: "list", has_more: false, total_count: 2 });
    expect(finalized.lines.data.map((line) => [line.object, line.amount, line.description])).toEqual([
      ["line_item", 90025, "Half on signing"],
      ["line_item", 900, "Props"],
    ]);
    expect(finalized.lines.data[0]!.id).toMatch(/^il_/);

    expect((await stripe.invoices.sendInvoice(created.id)).status).toBe("open");
    const paid = await stripe.invoices.pay(created.id, { paid_out_of_band: true });
    expect(paid).toMatchObject({ status: "paid", amount_paid: 90925, amount_remaining: 0 });
    expect(paid.status_transitions.paid_at).toBeGreaterThanOrEqual(finalized.status_transitions.finalized_at!);

    const events = await stripe.events.list({ limit: 100 });
    const mine = events.data.filter((event) => (event.data.object as { id?: string; invoice?: string }).id === created.id || (event.data.object as { invoice?: string }).invoice === created.id);
    expect(mine.map((event) => event.type).reverse()).toEqual(["invoice.created", "invoiceitem.created", "invoiceitem.created", "invoice.finalized", "invoice.sent", "invoice.paid"]);
    for (const event of mine) expect(event).toMatchObject({ object: "event", livemode: false });
  });

  it("when a customer's invoices are finalized, then they are numbered in turn with the customer's prefix, and a number given is kept", async () => {
    const customer = await sponsor("Numbered Co");
    const first = await stripe.invoices.finalizeInvoice((await draft(customer.id)).id);
    const own = await stripe.invoices.finalizeInvoice((await draft(customer.id, { number: "GLW-2027-014" })).id);
    const second = await stripe.invoices.finalizeInvoice((await draft(customer.id)).id);
    expect([first.number, own.number, second.number]).toEqual([`${customer.invoice_prefix}-0001`, "GLW-2027-014", `${customer.invoice_prefix}-0002`]);
  });

  it("when an invoice has nothing to pay, then finalizing it pays it at once", async () => {
    const customer = await sponsor("Nothing Due");
    const finalized = await stripe.invoices.finalizeInvoice((await draft(customer.id)).id);
    expect(finalized).toMatchObject({ status: "paid", amount_due: 0, amount_paid: 0 });
  });

  it("when pending items are included, then the new draft takes all of the customer's in its currency; by default it takes none", async () => {
    const customer = await sponsor("Pending Parts");
    await stripe.invoiceItems.create({ customer: customer.id, amount: 1500, currency: "eur", description: "Travel" });
    await stripe.invoiceItems.create({ customer: customer.id, amount: 2500, currency: "eur", description: "Rental" });
    expect((await draft(customer.id)).lines.data).toHaveLength(0);
    const sweeping = await draft(customer.id, { pending_invoice_items_behavior: "include" });
    expect(sweeping.lines.data.map((line) => line.amount)).toEqual([1500, 2500]);
    expect((await stripe.invoiceItems.list({ customer: customer.id, pending: true })).data).toHaveLength(0);
  });

  it("when invoices are listed by customer and status, then only those come back, and the customer expands on request", async () => {
    const customer = await sponsor("Listed Ltd");
    const open = await openInvoice();
    const kept = await draft(customer.id);
    const byCustomer = await stripe.invoices.list({ customer: customer.id, expand: ["data.customer"] });
    expect(byCustomer.data.map((invoice) => invoice.id)).toEqual([kept.id]);
    expect(byCustomer.data[0]!.customer).toMatchObject({ object: "customer", name: "Listed Ltd" });
    const openOnes = await stripe.invoices.list({ status: "open", limit: 100 });
    expect(openOnes.data.map((invoice) => invoice.id)).toContain(open.id);
    expect(openOnes.data.every((invoice) => invoice.status === "open")).toBe(true);
    expect(await refusal(stripe.invoices.list({ status: "late" as Stripe.InvoiceListParams.Status }))).toMatchObject({
      status: 400,
      param: "status",
      message: "Invalid status: must be one of draft, open, void, paid, or uncollectible",
    });
  });
});

describe("what each state refuses", () => {
  it("when an item is added to a finalized invoice, then it is refused with invoice_not_editable and the invoice keeps its amount", async () => {
    const open = await openInvoice(5000);
    const refused = await refusal(stripe.invoiceItems.create({ customer: open.customer as string, invoice: open.id, amount: 100, currency: "eur" }));
    expect(refused.error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(refused).toMatchObject({ status: 400, code: "invoice_not_editable", param: "invoice", message: "Invalid invoice: This invoice is no longer editable" });
    expect((await stripe.invoices.retrieve(open.id)).amount_due).toBe(5000);
  });

  it("when a draft is voided, paid twice, deleted once open or finalized twice, then the provider's refusals come back (these carry no code at the provider)", async () => {
    const customer = await sponsor("Refused Inc");
    const aDraft = await draft(customer.id);
    expect(await refusal(stripe.invoices.voidInvoice(aDraft.id))).toMatchObject({ status: 400, type: "invalid_request_error", code: undefined, message: "You can only pass in open invoices. This invoice isn't open." });
    expect(await refusal(stripe.invoices.markUncollectible(aDraft.id))).toMatchObject({ status: 400, message: "You can only pass in open invoices. This invoice isn't open." });

    const open = await openInvoice();
    expect(await refusal(stripe.invoices.finalizeInvoice(open.id))).toMatchObject({ status: 400, message: "This invoice is already finalized, you can't re-finalize a non-draft invoice." });
    expect(await refusal(stripe.invoices.del(open.id))).toMatchObject({ status: 400, message: "You can only delete draft invoices." });
    expect(await refusal(stripe.invoices.update(open.id, { description: "changed" }))).toMatchObject({ status: 400, param: "description", message: "Finalized invoices can't be updated in this way" });
    expect((await stripe.invoices.update(open.id, { metadata: { note: "metadata may change" } })).metadata).toEqual({ note: "metadata may change" });

    await stripe.invoices.pay(open.id, { paid_out_of_band: true });
    expect(await refusal(stripe.invoices.pay(open.id, { paid_out_of_band: true }))).toMatchObject({ status: 400, message: "Invoice is already paid" });
    expect(await refusal(stripe.invoices.voidInvoice(open.id))).toMatchObject({ status: 400, message: "Invoices with `paid` payments cannot be voided." });
    expect((await stripe.invoices.retrieve(open.id)).status).toBe("paid");
  });

  it("when an invoice is marked uncollectible, then it can still be paid or voided, but not marked again", async () => {
    const written = await openInvoice();
    expect((await stripe.invoices.markUncollectible(written.id)).status_transitions.marked_uncollectible_at).toEqual(expect.any(Number));
    expect(await refusal(stripe.invoices.markUncollectible(written.id))).toMatchObject({ status: 400, message: "This invoice has already been marked uncollectible." });
    expect((await stripe.invoices.pay(written.id, { paid_out_of_band: true })).status).toBe("paid");

    const voided = await openInvoice();
    await stripe.invoices.markUncollectible(voided.id);
    const after = await stripe.invoices.voidInvoice(voided.id);
    expect(after.status).toBe("void");
    expect(after.status_transitions.voided_at).toEqual(expect.any(Number));
    expect(await refusal(stripe.invoices.voidInvoice(voided.id))).toMatchObject({ message: "You can only pass in open invoices. This invoice isn't open." });
  });

  it("when a draft is deleted, then it is gone and its invoice.deleted event remains", async () => {
    const customer = await sponsor("Deleted Draft");
    const aDraft = await draft(customer.id);
    expect(await stripe.invoices.del(aDraft.id)).toMatchObject({ id: aDraft.id, object: "invoice", deleted: true });
    expect(await refusal(stripe.invoices.retrieve(aDraft.id))).toMatchObject({ status: 404, code: "resource_missing", param: "invoice" });
    const [event] = (await stripe.events.list({ type: "invoice.deleted", limit: 1 })).data;
    expect(event?.data.object).toMatchObject({ id: aDraft.id, status: "draft" });
  });

  it("when an invoice would be paid through the API without paid_out_of_band, then it is refused: the stand-in holds no cards; the sponsor pays on the hosted page", async () => {
    const open = await openInvoice();
    expect(await refusal(stripe.invoices.pay(open.id))).toMatchObject({ status: 400, message: "This customer has no attached payment source or default payment method." });
    expect((await stripe.invoices.retrieve(open.id)).status).toBe("open");
  });

  it("when a send_invoice invoice has no terms, or an automatic one has them, then the provider's refusals come back and nothing is made", async () => {
    const customer = await sponsor("No Terms");
    expect(await refusal(stripe.invoices.create({ customer: customer.id, currency: "eur", collection_method: "send_invoice" }))).toMatchObject({
      status: 400,
      message: "If invoice collection method is 'send_invoice', you must specify 'due_date' or 'days_until_due'.",
    });
    expect(await refusal(stripe.invoices.create({ customer: customer.id, currency: "eur", days_until_due: 14 }))).toMatchObject({
      status: 400,
      message: "You can only specify 'due_date' or 'days_until_due' if invoice collection method is 'send_invoice'.",
    });
    expect(await refusal(stripe.invoices.create({ customer: "cus_missing", currency: "eur" }))).toMatchObject({ status: 400, code: "resource_missing", param: "customer" });
    expect(await refusal(stripe.invoices.create({ currency: "eur" }))).toMatchObject({ status: 400, code: "parameter_missing", param: "customer", message: "Missing required param: customer." });
    expect((await stripe.invoices.list({ customer: customer.id })).data).toHaveLength(0);
  });

  it("when an item gives both an amount and a unit amount, or another currency than its invoice, then it is refused", async () => {
    const customer = await sponsor("Mixed Items");
    const aDraft = await draft(customer.id);
    const both = { customer: customer.id, invoice: aDraft.id, amount: 100, unit_amount_decimal: Stripe.Decimal.from("100") };
    expect(await refusal(stripe.invoiceItems.create(both))).toMatchObject({ status: 400, code: "parameters_exclusive", param: "amount" });
    expect(await refusal(stripe.invoiceItems.create({ customer: customer.id, invoice: aDraft.id, amount: 100, currency: "gbp" }))).toMatchObject({ status: 400, param: "currency" });
    expect((await stripe.invoices.retrieve(aDraft.id)).lines.data).toHaveLength(0);
  });
});
