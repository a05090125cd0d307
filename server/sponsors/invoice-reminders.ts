import { formatDay } from "../../shared/fields/written-dates";
import { daysBetween, dateInZone } from "../../shared/sponsors/dates";
import { formatMinorUnits } from "../../shared/money/minor-units";
import type { OverdueInvoice } from "../../shared/sponsors/invoices";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { eachItem, type ItemTally } from "../jobs/each-item";
import type { Caller } from "../http/route-table";
import { memberMail } from "../mail/member-mail";
import { claimOverdueReminder, overdueInvoices } from "./invoices.repository";
import type { ReminderDeps } from "./reminders";

export async function listOverdueInvoices(db: Database, caller: Caller, now = new Date()): Promise<OverdueInvoice[]> {
  const today = dateInZone(now, caller.timeZone);
  return (await overdueInvoices(db, caller.channelId, today)).map(({ invoice, episodeId, episodeTitle, company }) => ({
    id: invoice.id,
    dealId: invoice.dealId,
    episodeId,
    episodeTitle,
    company,
    label: invoice.label,
    number: invoice.number,
    amountMinor: invoice.amountMinor,
    currency: invoice.currency,
    dueDate: invoice.dueDate!,
    daysLate: daysBetween(invoice.dueDate!, today),
    hostedUrl: invoice.hostedUrl,
  }));
}

type Overdue = Awaited<ReturnType<typeof overdueInvoices>>[number];

/** To whoever made the invoice while they still see fees, else to the channel's members who do (its producers and owners). */
const overdueMail = (row: Overdue, today: string, appUrl: string) =>
  memberMail({
    channelId: row.invoice.channelId,
    userId: row.invoice.createdBy,
    needs: { area: "fees", need: "R" },
    otherwise: { area: "fees", need: "R", note: "You get this because whoever made the invoice can no longer see the channel's fees." },
    topic: "reminders",
    subject: `Overdue: invoice ${row.invoice.number ?? ""} to ${row.company}`.replace("  ", " "),
    text: [
      `The invoice "${row.invoice.label}" (${formatMinorUnits(row.invoice.amountMinor, row.invoice.currency, "en-GB")}) to ${row.company} for "${row.episodeTitle}" was due by ${formatDay(row.invoice.dueDate)} and is ${daysBetween(row.invoice.dueDate!, today)} days late.`,
      "",
      "Open the episode's sponsor deals in Kerf:",
      `${appUrl}/c/${row.invoice.channelId}/episodes/${row.episodeId}/sponsor-deals`,
      "",
      "Kerf sends this once per invoice.",
    ].join("\n"),
  });

/** Tells the producer once about each invoice past its terms; claimed and queued in one transaction. */
export async function remindOverdueInvoices(deps: ReminderDeps, now = new Date()): Promise<{ sent: number } & ItemTally> {
  // Due dates are the provider's, in UTC.
  const today = now.toISOString().slice(0, 10);
  let sent = 0;
  const candidates = (await overdueInvoices(deps.db, null, today)).filter((row) => row.invoice.overdueRemindedAt === null);
  const tally = await eachItem("overdue invoices", candidates, (row) => `invoice ${row.invoice.id} of channel ${row.invoice.channelId}`, async (row) => {
    const claimed = await inTransaction(deps.db, async (tx, sql) => {
      if (!(await claimOverdueReminder(tx, row.invoice.id, now))) return false;
      await deps.jobs.enqueueMail(overdueMail(row, today, deps.appUrl), { db: sql });
      return true;
    });
    if (claimed) sent++;
  });
  return { sent, ...tally };
}
