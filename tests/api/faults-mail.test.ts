import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailCatcher, type MailCatcher } from "../../dev-services/mail";
import { freePort } from "../../dev-services/processes";
import { createChannel, createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { mailJobsTo, retryNow, waitForJobStates } from "../support/jobs";
import { mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";

let smtpPort: number;
let webPort: number;
let mail: MailCatcher | null = null;
let app: TestApp;

beforeAll(async () => {
  smtpPort = await freePort();
  webPort = await freePort();
  app = await startTestApp({ smtpPort });
});
afterAll(async () => {
  await app.close();
  await mail?.stop();
});

describe("mail server stopped", () => {
  it("when the mail server is down, then an invitation is queued, and delivered once after it comes back", async () => {
    const owner = await createUser(app.db);
    const channel = await createChannel(app.db, owner, "Quiet Inbox");
    const agent = await app.signedIn(owner);
    const invitee = uniqueEmail("while-down");

    // No mail server listens on smtpPort yet: the request still succeeds, the mail waits in the queue.
    await agent.send("post", `/api/channels/${channel.id}/invitations`, { email: invitee, role: "crew" }).expect(201);
    const queued = (await mailJobsTo(app.database.pool, invitee)).map((job) => job.id);
    expect(queued).toHaveLength(1);
    // A worker has tried to send it: pg-boss records the failure and schedules a retry.
    expect(await waitForJobStates(app.database.pool, queued, ["retry"])).toEqual(["retry"]);

    mail = await startMailCatcher({ smtpPort, webPort });
    await retryNow(app.database.pool, queued);
    await waitForMail(invitee, { webUrl: mail.webUrl, timeoutMs: 45_000 });

    // Once the job has finished, no later retry or second worker can send it again.
    expect(await waitForJobStates(app.database.pool, queued)).toEqual(["completed"]);
    expect(await mailTo(invitee, mail.webUrl)).toHaveLength(1);
  }, 75_000);
});
