import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { scanReminders } from "../../server/sponsors/reminders";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { createItemDue } from "../factories/sponsors";
import { settledJobs } from "../support/jobs";
import { waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";

/* The mail worker starts only once both channels' mail is queued, so the order it sends in is the queue's own. */
let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ holdMail: true });
});
afterAll(() => app.close());

describe("a mail queue fair between channels", () => {
  it("when channel A queues a burst of thirty invitations and then channel B a reminder, then B's reminder goes out before A's burst has drained", async () => {
    const hostA = await createUser(app.db, { name: "Burst Owner" });
    const channelA = await createChannel(app.db, hostA, "Burst Bench");
    const agentA = await app.signedIn(hostA);
    for (let i = 0; i < 30; i++) {
      await agentA.send("post", `/api/channels/${channelA.id}/invitations`, { email: uniqueEmail(`burst${i}`), role: "crew" }).expect(201);
    }

    const b = await createCrewedChannel(app.db, "Quiet Bench");
    const today = dateInZone(new Date(), b.producer.timeZone);
    await createItemDue(app.db, b.channel.id, { ownerId: b.producer.id, dueDate: shiftDate(today, 2), title: "Send the B-roll", company: "Quiet Parts" });
    const reminderDeps = { db: app.db, pool: app.database.pool, jobs: app.jobs, appUrl: "http://kerf.test" };
    expect((await scanReminders(reminderDeps)).sent).toBe(1);

    await app.startMailWorker();
    const jobs = await settledJobs(app.database.pool, "mail", () => true, 31, 60_000);
    const sentOrder = jobs.filter((job) => job.state === "completed").sort((x, y) => x.completed_on!.getTime() - y.completed_on!.getTime());
    expect(sentOrder).toHaveLength(31);
    const reminderAt = sentOrder.findIndex((job) => JSON.stringify(job.data).includes(b.channel.id));
    // Its turn came after at most A's first mail (both were first in their channel's line).
    expect(reminderAt, `the reminder went out as mail ${reminderAt + 1} of 31`).toBeLessThanOrEqual(1);
    expect((await waitForMail(b.producer.email)).subject).toBe("Due soon: Send the B-roll (Quiet Parts)");
  }, 90_000);
});
