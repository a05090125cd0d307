import Stripe from "stripe";
import { beforeAll, describe, expect, it } from "vitest";
import { createPaymentsAccount, type PaymentsAccount } from "../support/payments";

/** The invoice page a sponsor pays on in the demo: what it says, and what paying there does. */
let account: PaymentsAccount;
let stripe: Stripe;

beforeAll(async () => {
  account = await createPaymentsAccount();
  stripe = account.stripe;
});

async function openInvoice(locale: string, amount: number, currency = "eur") {
  const customer = await stripe.customers.create({ name: "Ferrule Tools", preferred_locales: [locale] });
  const invoice = await stripe.invoices.create({ customer: customer.id, currency, collection_method: "send_invoice", days_until_due: 30, description: "Dovetail jig episode" });
  await stripe.invoiceItems.create({ customer: customer.id, invoice: invoice.id, amount, description: "Sponsor read <with care>" });
  return stripe.invoices.finalizeInvoice(invoice.id);
}

const payOnPage = (url: string) => fetch(`${url}/pay`, { method: "POST", redirect: "manual" });

describe("the hosted invoice page", () => {
  it("when an open invoice's page is opened, then it says it is a local stand-in with no real money, and shows the invoice and a pay button", async () => {
    const invoice = await openInvoice("en-GB", 180050);
    const response = await fetch(invoice.hosted_invoice_url!);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-security-policy")).toContain("default-src 'none'");
    const html = await response.text();
    expect(html).toContain("Local stand-in, no real money.");
    expect(html).toContain(`Invoice ${invoice.number}`);
    expect(html).toContain("Sponsor read &lt;with care&gt;");
    expect(html).toContain("Pay €1,800.50 as the sponsor");
    expect(html).toContain('name="viewport" content="width=device-width, initial-scale=1"');
  });

  it("when the sponsor pays on the page, then the invoice is paid with an attempt, and invoice.payment_succeeded and invoice.paid are recorded once even if the button is pressed twice", async () => {
    const invoice = await openInvoice("en-GB", 25000);
    const paid = await payOnPage(invoice.hosted_invoice_url!);
    expect(paid.status).toBe(303);
    expect(paid.headers.get("location")).toMatch(/\?paid=1$/);
    expect((await payOnPage(invoice.hosted_invoice_url!)).status).toBe(303);

    const after = await stripe.invoices.retrieve(invoice.id);
    expect(after).toMatchObject({ status: "paid", amount_paid: 25000, amount_remaining: 0, attempted: true, attempt_count: 1 });
    expect(after.status_transitions.paid_at).toEqual(expect.any(Number));
    const events = (await stripe.events.list({ limit: 20 })).data.filter((event) => (event.data.object as { id: string }).id === invoice.id);
    expect(events.map((event) => event.type)).toEqual(["invoice.paid", "invoice.payment_succeeded", "invoice.finalized", "invoice.created"]);
    expect(events[0]!.request).toEqual({ id: null, idempotency_key: null });

    const page = await (await fetch(`${invoice.hosted_invoice_url}?paid=1`)).text();
    expect(page).toContain("Payment recorded.");
    expect(page).toMatch(/Paid on \d{1,2} \w+ \d{4}\. Thank you\./);
    expect(page).not.toContain("<form");
  });

  it("when an invoice is void, then its page says there is nothing to pay and paying there changes nothing", async () => {
    const invoice = await openInvoice("en-GB", 9900);
    await stripe.invoices.voidInvoice(invoice.id);
    const html = await (await fetch(invoice.hosted_invoice_url!)).text();
    expect(html).toContain("Cancelled by the channel: there is nothing to pay.");
    expect(html).not.toContain("<form");
    expect((await payOnPage(invoice.hosted_invoice_url!)).status).toBe(303);
    expect((await stripe.invoices.retrieve(invoice.id)).status).toBe("void");
  });

  it("when the address names no invoice, then the page says so with a 404", async () => {
    const response = await fetch(`${account.apiUrl}/i/notarealinvoicetokenatall`);
    expect(response.status).toBe(404);
    expect(await response.text()).toContain("No invoice here");
  });

  it("when the sponsor reads German or the currency has no or three minor digits, then amounts are written as that locale and ISO 4217 have them", async () => {
    // ISO 4217 (SIX's list one, current currencies), "Minor unit" column: EUR 2, JPY 0, KWD 3.
    // Written forms from Unicode CLDR's currency patterns for de-DE and en-GB, as Node's ICU carries them.
    const german = await (await fetch((await openInvoice("de-DE", 180050)).hosted_invoice_url!)).text();
    expect(german).toContain("1.800,50\u00a0€");
    const yen = await (await fetch((await openInvoice("en-GB", 180050, "jpy")).hosted_invoice_url!)).text();
    expect(yen).toContain("JP¥180,050");
    const dinar = await (await fetch((await openInvoice("en-GB", 180050, "kwd")).hosted_invoice_url!)).text();
    expect(dinar).toContain("KWD\u00a0180.050");
  });
});
