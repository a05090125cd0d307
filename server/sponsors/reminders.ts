import type PgBoss from "pg-boss";
import { formatDay } from "../../shared/fields/written-dates";
import { dateInZone, daysBetween } from "../../shared/sponsors/dates";
import { isMoneyKind, reminderFor } from "../../shared/sponsors/deliverables";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { eachItem, mergeTallies, type ItemTally } from "../jobs/each-item";
import type { Jobs } from "../jobs/queue";
import { memberMail } from "../mail/member-mail";
import { insertEvents } from "./deals.repository";
import { remindOverdueInvoices } from "./invoice-reminders";
import { seesFees } from "./deals.service";
import { recordReminder, reminderCandidates } from "./reminders.repository";
import { catchUpPublishDates } from "./schedule.service";
import { DEFAULT_REMINDER_DAYS_BEFORE } from "./sponsors.repository";
import { makeQueue } from "../jobs/make-queue";

/**
 * Deliverable reminders. A scheduled pg-boss job scans open items; each reminder an item calls for is
 * recorded in reminders_sent (unique per item, kind and due date) and its mail queued in the same
 * transaction. So however many instances scan at once, one insert wins and one mail is queued; and
 * the mail job's retries (server/jobs/queue.ts) carry it through a mail server that is down.
 */
export const REMINDER_QUEUE = "sponsor-reminders";
/** Every ten minutes: a reminder goes out within ten minutes of its owner's local day calling for it. */
export const REMINDER_CRON = "*/10 * * * *";

export interface ReminderDeps {
  db: Database;
  jobs: Pick<Jobs, "enqueueMail">;
  appUrl: string;
}

type Candidate = Awaited<ReturnType<typeof reminderCandidates>>[number];

/** To the item's owner, if they may still see the item (money items: the fees) when the mail goes out. */
function reminderMail(item: Candidate, kind: "before" | "late", today: string, appUrl: string) {
  const days = daysBetween(today, item.dueDate!);
  // A due date is a calendar day, the same in every zone: written as one ("Fri 5 Mar 2027").
  const due = formatDay(item.dueDate);
  const when = kind === "late" ? `was due on ${due} and is ${-days} day${days === -1 ? "" : "s"} late` : days === 0 ? `is due today (${due})` : `is due in ${days} day${days === 1 ? "" : "s"}, on ${due}`;
  return memberMail({
    channelId: item.channelId,
    userId: item.ownerId,
    topic: "reminders",
    needs: isMoneyKind(item.kind) ? { area: "fees", need: "R" } : { area: "deliverables", need: "R" },
    subject: kind === "late" ? `Late: ${item.title} (${item.company})` : `Due soon: ${item.title} (${item.company})`,
    text: [
      `Hello ${item.ownerName},`,
      "",
      `"${item.title}" for ${item.company}'s deal on "${item.episodeTitle}" ${when}.`,
      "",
      "Open the episode's sponsor deals in Kerf:",
      `${appUrl}/c/${item.channelId}/episodes/${item.episodeId}#sponsor-deals`,
      "",
      "You get this because you own the item. It is sent once per due date.",
    ].join("\n"),
  });
}

/** Records one reminder and queues its mail in one transaction; false when another scan already sent it. */
async function sendOnce(deps: ReminderDeps, item: Candidate, kind: "before" | "late", today: string): Promise<boolean> {
  const mail = reminderMail(item, kind, today, deps.appUrl);
  return inTransaction(deps.db, async (tx, sql) => {
    if (!(await recordReminder(tx, { deliverableId: item.id, kind, dueDate: item.dueDate!, sentTo: item.ownerEmail }))) return false;
    await deps.jobs.enqueueMail(mail, { db: sql });
    await insertEvents(tx, [
      {
        channelId: item.channelId,
        deliverableId: item.id,
        actorName: "Kerf",
        actorKind: "system",
        what: "reminder",
        note: `${kind === "late" ? "Late notice" : "Reminder"} e-mailed to ${item.ownerName}`,
      },
    ]);
    return true;
  });
}

export type ScanResult = { sent: number } & ItemTally;

/**
 * One pass over every open item of every channel. An item (or an episode's catch-up) that fails is
 * logged and counted, and the pass goes on: one channel's broken row never stops another's reminders.
 */
export async function scanReminders(deps: ReminderDeps, now = new Date()): Promise<ScanResult> {
  const caughtUp = await catchUpPublishDates(deps.db, null);
  let sent = 0;
  const scanned = await eachItem("reminders", await reminderCandidates(deps.db), (item) => `item ${item.id} of channel ${item.channelId}`, async (item) => {
    if (isMoneyKind(item.kind) && !seesFees(item.ownerRole)) return;
    const today = dateInZone(now, item.ownerTimeZone);
    const kind = reminderFor(item, today, item.daysBefore ?? DEFAULT_REMINDER_DAYS_BEFORE);
    if (kind && (await sendOnce(deps, item, kind, today))) sent++;
  });
  const invoices = await remindOverdueInvoices(deps, now);
  return { sent: sent + invoices.sent, ...mergeTallies(mergeTallies(caughtUp, scanned), invoices) };
}

/** Puts the scan on pg-boss's clock. Every instance may call this; pg-boss hands each tick to one worker. */
export async function scheduleSponsorJobs(boss: PgBoss, deps: ReminderDeps, options: { cron?: string; pollSeconds?: number } = {}): Promise<void> {
  await makeQueue(boss, REMINDER_QUEUE);
  await boss.schedule(REMINDER_QUEUE, options.cron ?? REMINDER_CRON);
  // The scan's tally (sent, failed, which items) becomes the job's output, where an operator can read it.
  await boss.work(REMINDER_QUEUE, { pollingIntervalSeconds: options.pollSeconds ?? 5, batchSize: 1 }, () => scanReminders(deps));
}
