import express from "express";
import { invoiceActions, newInvoiceSchema } from "../../shared/sponsors/invoices";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { listOverdueInvoices } from "./invoice-reminders";
import { actOnInvoice, createInvoice, listInvoices, type InvoiceDeps } from "./invoices.service";
import { receivePaymentEvent } from "./payment-events.service";

const invoices = "/api/channels/:channelId/deals/:dealId/invoices";
/** Larger than any event the provider sends about an invoice (a few kB), far below anything costly. */
const EVENT_BODY_LIMIT = "256kb";

/** A deal's invoices at the payments provider ("fees": owner and producer), and the provider's webhook. */
export function invoiceRoutes(deps: InvoiceDeps): RouteSpec[] {
  return [
    {
      method: "get",
      path: invoices,
      access: channelAccess("fees", "R"),
      handler: async (req, res) => res.json({ invoices: await listInvoices(deps.db, callerOf(req), idOf(req, "dealId")) }),
    },
    {
      method: "post",
      path: invoices,
      access: channelAccess("fees", "W"),
      handler: async (req, res) => {
        const input = parseBody(newInvoiceSchema, req.body);
        res.status(201).json({ invoice: await createInvoice(deps, callerOf(req), idOf(req, "dealId"), input) });
      },
    },
    ...invoiceActions.map(
      (action): RouteSpec => ({
        method: "post",
        path: `${invoices}/:invoiceId/${action}`,
        access: channelAccess("fees", "W"),
        body: "none",
        handler: async (req, res) => res.json({ invoice: await actOnInvoice(deps, callerOf(req), idOf(req, "dealId"), idOf(req, "invoiceId"), action) }),
      }),
    ),
    {
      method: "get",
      path: "/api/channels/:channelId/invoices/overdue",
      access: channelAccess("fees", "R"),
      handler: async (req, res) => res.json({ invoices: await listOverdueInvoices(deps.db, callerOf(req)) }),
    },
    {
      method: "post",
      path: "/api/payments/webhook",
      access: publicAccess,
      body: "none",
      signedByCaller: true,
      before: [express.raw({ type: () => true, limit: EVENT_BODY_LIMIT })],
      handler: async (req, res) => {
        const rawBody = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
        res.json({ received: true, outcome: await receivePaymentEvent(deps, rawBody, req.get("stripe-signature")) });
      },
    },
  ];
}
