import express, { type ErrorRequestHandler, type Response } from "express";
import { apiRoute, sendJson, type ApiDeps } from "./api-route";
import type { Handler } from "./context";
import { mountControls } from "./controls";
import { createCustomer, listCustomers, retrieveCustomer, updateCustomer } from "./customers";
import { listEvents, recordEvent, retrieveEvent } from "./events";
import { indexPage, invoicePage, notFoundPage } from "./hosted-page";
import { finalizeInvoice, markInvoiceUncollectible, markPaid, payInvoice, sendInvoice, voidInvoice } from "./invoice-actions";
import { createInvoiceItem, deleteInvoiceItem, listInvoiceItems, retrieveInvoiceItem } from "./invoice-items";
import { createInvoice, deleteInvoice, listInvoiceLines, listInvoices, retrieveInvoice, updateInvoice } from "./invoices";
import type { Store } from "./store";
import { createWebhookEndpoint, deleteWebhookEndpoint, listWebhookEndpoints, retrieveWebhookEndpoint, updateWebhookEndpoint } from "./webhook-endpoints";
import type { WebhookSender } from "./webhooks";

/** Every route of the stand-in: the provider's API subset, the test controls and the invoice pages. */
const API: [method: "get" | "post" | "delete", path: string, handler: Handler][] = [
  ["post", "/v1/customers", createCustomer],
  ["get", "/v1/customers", listCustomers],
  ["get", "/v1/customers/:id", retrieveCustomer],
  ["post", "/v1/customers/:id", updateCustomer],
  ["post", "/v1/invoiceitems", createInvoiceItem],
  ["get", "/v1/invoiceitems", listInvoiceItems],
  ["get", "/v1/invoiceitems/:id", retrieveInvoiceItem],
  ["delete", "/v1/invoiceitems/:id", deleteInvoiceItem],
  ["post", "/v1/invoices", createInvoice],
  ["get", "/v1/invoices", listInvoices],
  ["get", "/v1/invoices/:id", retrieveInvoice],
  ["post", "/v1/invoices/:id", updateInvoice],
  ["delete", "/v1/invoices/:id", deleteInvoice],
  ["get", "/v1/invoices/:id/lines", listInvoiceLines],
  ["post", "/v1/invoices/:id/finalize", finalizeInvoice],
  ["post", "/v1/invoices/:id/send", sendInvoice],
  ["post", "/v1/invoices/:id/pay", payInvoice],
  ["post", "/v1/invoices/:id/void", voidInvoice],
  ["post", "/v1/invoices/:id/mark_uncollectible", markInvoiceUncollectible],
  ["get", "/v1/events", listEvents],
  ["get", "/v1/events/:id", retrieveEvent],
  ["post", "/v1/webhook_endpoints", createWebhookEndpoint],
  ["get", "/v1/webhook_endpoints", listWebhookEndpoints],
  ["get", "/v1/webhook_endpoints/:id", retrieveWebhookEndpoint],
  ["post", "/v1/webhook_endpoints/:id", updateWebhookEndpoint],
  ["delete", "/v1/webhook_endpoints/:id", deleteWebhookEndpoint],
];

// The pages need no script and post only to themselves.
const PAGE_POLICY = "default-src 'none'; style-src 'unsafe-inline'; form-action 'self'; base-uri 'none'; frame-ancestors 'none'";

export function createStandInApp(store: Store, sender: WebhookSender, baseUrl: () => string) {
  const deps: ApiDeps = { store, baseUrl, emit: (account, event) => sender.enqueue(account, recordEvent(store, account, event)) };
  const app = express();
  app.disable("x-powered-by");
  app.set("query parser", "extended");
  app.use(express.urlencoded({ extended: true, limit: "100kb" }));
  for (const [method, path, handler] of API) app[method](path, apiRoute(deps, handler));
  mountControls(app, store, sender);

  const html = (res: Response, status: number, body: string) => res.status(status).set("Content-Security-Policy", PAGE_POLICY).type("html").send(body);
  app.get("/", (_req, res) => html(res, 200, indexPage()));
  app.get("/i/:token", (req, res) => {
    const found = store.invoiceByHostedToken(req.params.token);
    if (!found) return html(res, 404, notFoundPage());
    html(res, 200, invoicePage(found.account, found.invoice, { justPaid: req.query.paid === "1", payPath: `/i/${req.params.token}/pay` }));
  });
  // The sponsor pays: no card, no money, just the events the provider would send.
  app.post("/i/:token/pay", (req, res) => {
    const found = store.invoiceByHostedToken(req.params.token);
    if (!found) return html(res, 404, notFoundPage());
    const { account, invoice } = found;
    const payable = invoice.status === "open" || invoice.status === "uncollectible";
    if (payable) {
      const request = { id: null, idempotencyKey: null, apiVersion: null };
      markPaid({ account, baseUrl: baseUrl(), emit: (type, object) => deps.emit(account, { type, object, request }) }, invoice, "hosted_page");
      store.save();
    }
    res.redirect(303, `/i/${req.params.token}${payable ? "?paid=1" : ""}`);
  });

  app.use((req, res) => sendJson(res, 404, { error: { type: "invalid_request_error", message: `Unrecognized request URL (${req.method}: ${req.path}).` } }));
  app.use(errorAnswer);
  return app;
}

const errorAnswer: ErrorRequestHandler = (error: { status?: number; message?: string }, _req, res, _next) => {
  const status = typeof error.status === "number" && error.status >= 400 && error.status < 500 ? error.status : 500;
  if (status === 500) console.error("[payments stand-in]", error);
  sendJson(res, status, {
    error: status === 500 ? { type: "api_error", message: "An unknown error occurred in the payments stand-in." } : { type: "invalid_request_error", message: error.message ?? "Invalid request." },
  });
};
