import { formatMinorUnits } from "../../shared/money/minor-units";
import type { Database } from "../db/client";
import { mailKind, type MailRenderers } from "../mail/mail-jobs";
import { listContactsOf } from "./deals.repository";
import { findInvoiceForMail } from "./invoices.repository";

/**
 * The mail that carries an invoice's payment page to the sponsor's contact on the deal. Only Kerf's
 * words and the names involved; built when sent, and only while the invoice still waits for payment.
 */
export const invoiceMail = mailKind<{ invoiceId: string }>("sponsor-invoice");

export function invoiceMailRenderer(db: Database): MailRenderers {
  return invoiceMail.renderer(async ({ invoiceId }) => {
    const row = await findInvoiceForMail(db, invoiceId);
    if (!row) return { skip: "the invoice is gone" };
    const { invoice } = row;
    if (invoice.status !== "open" || !invoice.hostedUrl) return { skip: `the invoice is ${invoice.status}` };
    const contact = (await listContactsOf(db, row.channelId, row.sponsorId)).find((c) => c.id === row.contactId);
    if (!contact) return { skip: "the deal names no contact at the sponsor" };
    const amount = formatMinorUnits(invoice.amountMinor, invoice.currency, "en-GB");
    return {
      send: {
        to: contact.email,
        subject: `Invoice ${invoice.number ?? ""} from ${row.channelName}: ${amount}`.replace("  ", " "),
        text: [
          `Hello ${contact.name},`,
          "",
          `${row.channelName} has invoiced ${row.company} ${amount} for "${invoice.label}", the sponsored segment in "${row.episodeTitle}".`,
          invoice.dueDate ? `It is due by ${invoice.dueDate}.` : "",
          "",
          "You can see and pay the invoice here:",
          invoice.hostedUrl,
        ].join("\n"),
      },
    };
  });
}
