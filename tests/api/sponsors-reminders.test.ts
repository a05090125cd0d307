import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { formatDay } from "../../shared/fields/written-dates";
import { startMailCatcher, type MailCatcher } from "../../dev-services/mail";
import { freePort } from "../../dev-services/processes";
import { connectDatabase, type DatabaseHandle } from "../../server/db/client";
import { REMINDER_QUEUE, scanReminders, scheduleSponsorJobs, type ReminderDeps } from "../../server/sponsors/reminders";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { createTestDatabase, type TestDatabase } from "../support/database";
import { mailJobsTo, retryNow, waitForJobStates } from "../support/jobs";
import { mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";

/*
 * Two app instances on one database, each with its own connection pool and its own pg-boss workers,
 * sending through a mail server of this test's own that starts out stopped.
 */
let database: TestDatabase;
let smtpPort: number;
let webPort: number;
let mail: MailCatcher | null = null;
const instances: { app: TestApp; handle: DatabaseHandle; deps: ReminderDeps }[] = [];

const inbox = (address: string) => mailTo(address, mail!.webUrl);

async function waitForCount(address: string, count: number) {
  await waitForMail(address, { count, webUrl: mail!.webUrl, timeoutMs: 60_000 });
  return inbox(address);
}

beforeAll(async () => {
  database = await createTestDatabase();
  smtpPort = await freePort();
  webPort = await freePort();
  for (let i = 0; i < 2; i++) {
    const app = await startTestApp({ database, smtpPort });
    const handle = connectDatabase(database.url);
    instances.push({ app, handle, deps: { db: handle.db, jobs: app.jobs, appUrl: "http://kerf.test" } });
  }
});
afterAll(async () => {
  for (const { app, handle } of instances) {
    await app.close();
    await handle.close();
  }
  await mail?.stop();
  await database.drop();
});

describe("deliverable reminders", () => {
  it("when two instances scan at once with the mail server down, then each reminder is queued once and delivered once after it comes back", async () => {
    const world = await createCrewedChannel(instances[0]!.app.db, "Reminder Bench");
    const owner = world.producer;
    const today = dateInZone(new Date(), owner.timeZone);
    const episode = await createEpisode(instances[0]!.app.db, world.channel.id, { title: "Reminder episode", targetPublishDate: shiftDate(today, 30) });
    const sponsor = await createSponsor(instances[0]!.app.db, world.channel.id, { company: "Alder Optics" });
    const fixed = (title: string) => ({ kind: "other" as const, title, anchor: "before_publish" as const, offsetDays: 0, ownerRole: null });
    const made = await createDeal(instances[0]!.app.db, world.channel.id, episode.id, {
      sponsorId: sponsor.id,
      ownerId: owner.id,
      publishDate: shiftDate(today, 30),
      items: [fixed("Due in two days"), fixed("Was due yesterday"), fixed("Due in ten days"), fixed("Done, and was due yesterday")],
      statuses: { 3: "done" },
    });
    const due = [shiftDate(today, 2), shiftDate(today, -1), shiftDate(today, 10), shiftDate(today, -1)];
    for (const [i, item] of made.items.entries()) {
      await database.pool.query("update deliverables set anchor = 'fixed', due_date = $2 where id = $1", [item.id, due[i]]);
    }

    // Both instances scan, twice each, at the same moment: the unique key lets one insert win per reminder.
    const results = await Promise.all(instances.flatMap(({ deps }) => [scanReminders(deps), scanReminders(deps)]));
    expect(results.reduce((sum, r) => sum + r.sent, 0)).toBe(2);
    const recorded = await database.pool.query("select kind, due_date::text from reminders_sent order by kind");
    expect(recorded.rows).toEqual([
      { kind: "before", due_date: shiftDate(today, 2) },
      { kind: "late", due_date: shiftDate(today, -1) },
    ]);
    const queued = await database.pool.query("select count(*)::int as n from pgboss.job where name = 'mail'");
    expect(queued.rows[0].n).toBe(2);

    // The scheduled path too: both instances' workers take scan jobs from pg-boss and finish them;
    // nothing new is due, so no reminder is recorded twice.
    for (const { app, deps } of instances) await scheduleSponsorJobs(app.jobs.boss, deps, { pollSeconds: 0.5 });
    const scans = await Promise.all(instances.map(({ app }) => app.jobs.boss.send(REMINDER_QUEUE, {})));
    expect(await waitForJobStates(database.pool, scans.map((id) => id!))).toEqual(["completed", "completed"]);
    expect((await database.pool.query("select count(*)::int as n from reminders_sent")).rows[0].n).toBe(2);

    // The mail server comes up: the queued mail goes out on the next retry, once each.
    mail = await startMailCatcher({ smtpPort, webPort });
    await retryNow(database.pool, (await mailJobsTo(database.pool, owner.email)).map((job) => job.id));
    const arrived = await waitForCount(owner.email, 2);
    expect(arrived.map((m) => m.subject).sort()).toEqual(["Due soon: Due in two days (Alder Optics)", "Late: Was due yesterday (Alder Optics)"]);
    expect(arrived.find((m) => m.subject.startsWith("Late"))!.text).toContain("is 1 day late");

    // Another scan queues nothing, and once both mail jobs have finished no retry can send one again.
    const rescans = await Promise.all(instances.map(({ deps }) => scanReminders(deps)));
    expect(rescans.map((r) => r.sent)).toEqual([0, 0]);
    const firstMails = (await mailJobsTo(database.pool, owner.email)).map((job) => job.id);
    expect(await waitForJobStates(database.pool, firstMails)).toEqual(["completed", "completed"]);
    expect(await inbox(owner.email)).toHaveLength(2);

    // The mail server stops and starts again; a moved due date earns one fresh reminder, no repeats.
    await mail.stop();
    await database.pool.query("update deliverables set due_date = $2 where id = $1", [made.items[0]!.id, shiftDate(today, 1)]);
    const afterMove = await Promise.all(instances.map(({ deps }) => scanReminders(deps)));
    expect(afterMove.reduce((sum, r) => sum + r.sent, 0)).toBe(1);
    const freshMail = (await mailJobsTo(database.pool, owner.email)).map((job) => job.id).filter((id) => !firstMails.includes(id));
    expect(freshMail).toHaveLength(1);
    // A worker has tried it against the stopped server: pg-boss records the failure and a retry.
    expect(await waitForJobStates(database.pool, freshMail, ["retry"])).toEqual(["retry"]);
    mail = await startMailCatcher({ smtpPort, webPort });
    await retryNow(database.pool, freshMail);
    const fresh = await waitForCount(owner.email, 1);
    expect(fresh.map((m) => m.subject)).toEqual(["Due soon: Due in two days (Alder Optics)"]);
    expect(fresh[0]!.text).toContain(`is due in 1 day, on ${formatDay(shiftDate(today, 1))}`);
    expect(await waitForJobStates(database.pool, freshMail)).toEqual(["completed"]);
    expect(await inbox(owner.email)).toHaveLength(1);
  }, 150_000);
});
