import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailCatcher, type MailCatcher } from "../../dev-services/mail";
import { freePort } from "../../dev-services/processes";
import { createChannel, createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp } from "../support/test-app";

let smtpPort: number;
let webPort: number;
let mail: MailCatcher | null = null;
let app: TestApp;

async function inbox(address: string): Promise<unknown[]> {
  const all = (await (await fetch(`${mail!.webUrl}/api/email`)).json()) as { to: { address: string }[] }[];
  return all.filter((m) => m.to.some((t) => t.address === address));
}

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
    const queued = await app.database.pool.query("select count(*)::int as n from pgboss.job where name = 'mail' and state <> 'completed'");
    expect(queued.rows[0].n).toBeGreaterThanOrEqual(1);
    await new Promise((r) => setTimeout(r, 1_500));

    mail = await startMailCatcher({ smtpPort, webPort });
    const deadline = Date.now() + 45_000;
    while ((await inbox(invitee)).length === 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 500));
    expect(await inbox(invitee)).toHaveLength(1);

    // A later retry or a second worker must not send it again.
    await new Promise((r) => setTimeout(r, 3_000));
    expect(await inbox(invitee)).toHaveLength(1);
  }, 75_000);
});
