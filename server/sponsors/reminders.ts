import { drizzle } from "drizzle-orm/node-postgres";
import type pg from "pg";
import type PgBoss from "pg-boss";
import { dateInZone, daysBetween } from "../../shared/sponsors/dates";
import { isMoneyKind, reminderFor } from "../../shared/sponsors/deliverables";
import type { Database } from "../db/client";
import type { Jobs } from "../jobs/queue";
import type { OutgoingMail } from "../mail/mailer";
import { insertEvents } from "./deals.repository";
import { seesFees } from "./deals.service";
import { recordReminder, reminderCandidates } from "./reminders.repository";
import { catchUpPublishDates } from "./schedule.service";
import { DEFAULT_REMINDER_DAYS_BEFORE } from "./sponsors.repository";

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
  pool: pg.Pool;
  jobs: Pick<Jobs, "enqueueMail">;
  appUrl: string;
}

type Candidate = Awaited<ReturnType<typeof reminderCandidates>>[number];

function reminderMail(item: Candidate, kind: "before" | "late", today: string, appUrl: string): OutgoingMail {
  const due = item.dueDate!;
  const days = daysBetween(today, due);
  const when = kind === "late" ? `was due on ${due} and is ${-days} day${days === -1 ? "" : "s"} late` : days === 0 ? `is due today (${due})` : `is due in ${days} day${days === 1 ? "" : "s"}, on ${due}`;
  return {
    to: item.ownerEmail,
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
  };
}

/** Records one reminder and queues its mail in one transaction; false when another scan already sent it. */
async function sendOnce(deps: ReminderDeps, item: Candidate, kind: "before" | "late", today: string): Promise<boolean> {
  const client = await deps.pool.connect();
  try {
    await client.query("begin");
    const tx = drizzle(client);
    if (!(await recordReminder(tx, { deliverableId: item.id, kind, dueDate: item.dueDate!, sentTo: item.ownerEmail }))) {
      await client.query("rollback");
      return false;
    }
    await deps.jobs.enqueueMail(reminderMail(item, kind, today, deps.appUrl), { db: { executeSql: (text, values) => client.query(text, values) } });
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
    await client.query("commit");
    return true;
  } catch (error) {
    await client.query("rollback").catch(() => undefined);
    throw error;
  } finally {
    client.release();
  }
}

/** One pass over every open item of every channel; answers how many reminders this pass queued. */
export async function scanReminders(deps: ReminderDeps, now = new Date()): Promise<{ sent: number }> {
  await catchUpPublishDates(deps.db, null);
  let sent = 0;
  for (const item of await reminderCandidates(deps.db)) {
    if (isMoneyKind(item.kind) && !seesFees(item.ownerRole)) continue;
    const today = dateInZone(now, item.ownerTimeZone);
    const kind = reminderFor(item, today, item.daysBefore ?? DEFAULT_REMINDER_DAYS_BEFORE);
    if (kind && (await sendOnce(deps, item, kind, today))) sent++;
  }
  return { sent };
}

/** Puts the scan on pg-boss's clock. Every instance may call this; pg-boss hands each tick to one worker. */
export async function scheduleSponsorJobs(boss: PgBoss, deps: ReminderDeps, options: { cron?: string; pollSeconds?: number } = {}): Promise<void> {
  await boss.createQueue(REMINDER_QUEUE);
  await boss.schedule(REMINDER_QUEUE, options.cron ?? REMINDER_CRON);
  await boss.work(REMINDER_QUEUE, { pollingIntervalSeconds: options.pollSeconds ?? 5, batchSize: 1 }, async () => {
    await scanReminders(deps);
  });
}
