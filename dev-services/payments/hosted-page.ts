import { formatMinorUnits } from "./money";
import type { AccountState, InvoiceRecord } from "./records";
import { invoiceAmounts, invoiceItemsOf } from "./views";

/**
 * The page behind hosted_invoice_url, where a person in the demo pays an invoice as the sponsor
 * would. Kerf's own plain look (plywood, graphite, a cut-line amber and rust), readable on a phone,
 * no script. It says plainly that it is a local stand-in and that no money moves.
 */
const DEFAULT_LOCALE = "en-GB";

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (character) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[character]!);

export function invoicePage(account: AccountState, invoice: InvoiceRecord, options: { justPaid: boolean; payPath: string }): string {
  const customer = account.customers[invoice.customer];
  const locale = readableLocale(customer?.preferredLocales ?? []);
  const money = (amount: number | string) => formatMinorUnits(amount, invoice.currency, locale);
  const date = (unix: number) => new Intl.DateTimeFormat(locale, { dateStyle: "long", timeZone: "UTC" }).format(unix * 1000);
  const amounts = invoiceAmounts(account, invoice);
  const lines = invoiceItemsOf(account, invoice)
    .map((item) => {
      const detail = item.quantity === 1 ? "" : `<span class="detail">${item.quantity} × ${escapeHtml(money(item.unitAmountDecimal))}</span>`;
      return `<li><span class="what">${escapeHtml(item.description ?? "Item")}${detail}</span><span class="amount">${escapeHtml(money(item.amount))}</span></li>`;
    })
    .join("");
  const payable = invoice.status === "open" || invoice.status === "uncollectible";
  const title = `Invoice ${invoice.number ?? ""}`.trim();
  return page(
    title,
    `
    ${options.justPaid ? `<p class="banner" role="status">Payment recorded. The channel is told through its webhook.</p>` : ""}
    <article class="sheet" aria-labelledby="title">
      <p class="from">From <strong>${escapeHtml(account.name)}</strong> to <strong>${escapeHtml(customer?.name ?? customer?.email ?? "the sponsor")}</strong></p>
      <h1 id="title">${escapeHtml(title)}</h1>
      ${invoice.description ? `<p>${escapeHtml(invoice.description)}</p>` : ""}
      <p class="state state-${invoice.status}">${statusInWords(invoice, date)}</p>
      <h2>What it is for</h2>
      ${lines ? `<ul class="lines">${lines}</ul>` : `<p>No items.</p>`}
      <dl class="totals">
        <div><dt>Total</dt><dd class="amount">${escapeHtml(money(amounts.total))}</dd></div>
        <div><dt>Paid</dt><dd class="amount">${escapeHtml(money(invoice.amountPaid))}</dd></div>
        <div class="left"><dt>Left to pay</dt><dd class="amount">${escapeHtml(money(Math.max(amounts.amountRemaining, 0)))}</dd></div>
      </dl>
      ${
        payable
          ? `<form method="post" action="${escapeHtml(options.payPath)}"><button type="submit">Pay ${escapeHtml(money(amounts.amountRemaining))} as the sponsor</button></form>`
          : ""
      }
      ${invoice.footer ? `<p class="footer">${escapeHtml(invoice.footer)}</p>` : ""}
    </article>`,
  );
}

export function notFoundPage(): string {
  return page("No invoice here", `<article class="sheet"><h1>No invoice here</h1><p>This link names no invoice that can be shown: it may have been mistyped, or the invoice is still a draft or was deleted.</p></article>`);
}

export function indexPage(): string {
  return page(
    "Payments stand-in",
    `<article class="sheet"><h1>Payments stand-in</h1><p>Kerf talks to this server through the payments provider's own SDK: its API answers under <code>/v1</code>. Each finalized invoice has a page here (its <code>hosted_invoice_url</code>, under <code>/i/</code>) where the sponsor can pay it.</p></article>`,
  );
}

/** The customer's first preferred locale the runtime can write in (the provider doesn't check them either). */
function readableLocale(preferred: string[]): string {
  for (const candidate of preferred) {
    try {
      if (Intl.NumberFormat.supportedLocalesOf([candidate]).length > 0) return candidate;
    } catch {
      // not a well-formed language tag
    }
  }
  return DEFAULT_LOCALE;
}

function statusInWords(invoice: InvoiceRecord, date: (unix: number) => string): string {
  switch (invoice.status) {
    case "paid":
      return `Paid on ${date(invoice.paidAt!)}. Thank you.`;
    case "void":
      return "Cancelled by the channel: there is nothing to pay.";
    case "uncollectible":
      return "The channel no longer expects this payment, but it can still be paid.";
    default: {
      if (invoice.dueDate === null) return "Waiting for payment.";
      const overdue = invoice.dueDate * 1000 < Date.now();
      return `${overdue ? "Overdue: it was due by" : "Waiting for payment, due by"} ${date(invoice.dueDate)}.`;
    }
  }
}

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Kerf payments stand-in</title>
<style>${STYLE}</style>
</head>
<body>
<header><p class="mark">Kerf</p><p class="tag">Payments stand-in</p></header>
<main>
  <p class="notice"><strong>Local stand-in, no real money.</strong> This page takes the place of the payments provider's invoice page on this computer. Nothing asks for a card and nothing is charged: paying here only marks the invoice paid in the stand-in, which then tells Kerf, as the provider would.</p>
  ${body}
</main>
</body>
</html>`;
}

const STYLE = `
:root { color-scheme: light; --ply-50: #fbf9f5; --ply-100: #f5f1e8; --ply-300: #d8cfbd; --graphite-500: #5b6567; --graphite-700: #344043; --graphite-900: #1f2a2c; --amber-cut: #f2b33d; --rust-600: #a9481f; --rust-700: #8c3a17; --moss-600: #3d6b4f; }
* { box-sizing: border-box; }
body { margin: 0; background: var(--ply-100); color: var(--graphite-900); font: 1rem/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; }
header { display: flex; align-items: baseline; gap: .75rem; padding: .75rem 1rem; background: var(--graphite-900); color: var(--ply-50); }
header p { margin: 0; }
.mark { font-weight: 700; font-size: 1.25rem; border-bottom: 3px solid var(--amber-cut); }
.tag { color: var(--ply-300); }
main { max-width: 34rem; margin: 0 auto; padding: 1rem; }
.notice { border-left: 4px solid var(--amber-cut); background: var(--ply-50); padding: .75rem 1rem; margin: 0 0 1rem; }
.banner { background: var(--moss-600); color: #fff; padding: .75rem 1rem; border-radius: 6px; }
.sheet { background: var(--ply-50); border: 1px solid var(--ply-300); border-radius: 6px; padding: 1.25rem; }
h1 { font-size: 1.5rem; margin: .25rem 0 .5rem; overflow-wrap: anywhere; }
h2 { font-size: 1rem; margin: 1.25rem 0 .25rem; color: var(--graphite-700); }
.from { margin: 0; color: var(--graphite-700); overflow-wrap: anywhere; }
.state { font-weight: 600; }
.state-paid { color: var(--moss-600); }
.state-void, .state-uncollectible { color: var(--rust-700); }
.lines { list-style: none; margin: 0; padding: 0; }
.lines li { display: flex; justify-content: space-between; gap: 1rem; padding: .5rem 0; border-bottom: 1px dashed var(--ply-300); }
.what { overflow-wrap: anywhere; }
.detail { display: block; color: var(--graphite-500); font-size: .9rem; }
.amount { font-variant-numeric: tabular-nums; white-space: nowrap; }
.totals { margin: 1rem 0; }
.totals div { display: flex; justify-content: space-between; gap: 1rem; padding: .15rem 0; }
.totals dt, .totals dd { margin: 0; }
.totals .left { font-weight: 700; font-size: 1.1rem; border-top: 2px solid var(--graphite-900); padding-top: .4rem; margin-top: .3rem; }
button { width: 100%; min-height: 3rem; border: 0; border-radius: 6px; background: var(--rust-600); color: #fff; font: inherit; font-weight: 700; cursor: pointer; }
button:hover { background: var(--rust-700); }
:focus-visible { outline: 3px solid var(--amber-cut); outline-offset: 2px; }
.footer { color: var(--graphite-500); font-size: .9rem; margin-bottom: 0; }
`;
