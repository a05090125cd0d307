import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { confirmDemoAddresses, DEMO_PASSWORD, demoAccounts, seedDemo } from "../../dev-services/demo/channel";
import { createChannel, createUser } from "../factories/accounts";
import { sha256Hex, uniqueEmail } from "../factories/invitations";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { createEpisode } from "../factories/episodes";
import { jobsIn } from "../support/jobs";
import { linkIn, mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const PASSWORD = "a-long-enough-password";

async function signUp(email = uniqueEmail("host")): Promise<{ visitor: Visitor; email: string; channelId: string }> {
  const visitor = await app.visitor();
  const response = await visitor.send("post", "/api/auth/sign-up", { name: "Vera Vale", email, password: PASSWORD, channelName: "Vale Works" }).expect(201);
  visitor.csrf = response.body.csrfToken;
  return { visitor, email, channelId: response.body.memberships[0].channelId };
}

/** The token of the confirmation link in the n-th confirmation mail to `email`. */
async function confirmationToken(email: string, count = 1): Promise<string> {
  const mail = await waitForMail(email, { count });
  expect(mail.subject).toBe("Confirm your address for Kerf");
  const link = linkIn(mail, /http:\/\/kerf\.test\/verify\/[A-Za-z0-9_-]+/);
  return link.slice(link.lastIndexOf("/") + 1);
}

async function count(sql: string, values: unknown[]): Promise<number> {
  return (await app.database.pool.query<{ n: number }>(sql, values)).rows[0]!.n;
}

describe("confirming an address", () => {
  it("when someone signs up, then a confirmation mail arrives whose link works once, and only its hash is stored", async () => {
    const { visitor, email } = await signUp();
    expect((await visitor.get("/api/auth/me").expect(200)).body.user.emailVerified).toBe(false);

    const token = await confirmationToken(email);
    const stored = await app.database.pool.query("select token_hash from email_verifications v join users u on u.id = v.user_id where u.email = $1", [email]);
    expect(stored.rows).toEqual([{ token_hash: sha256Hex(token) }]);
    // Nor does the mail queue hold it: the link is made when the mail is sent.
    expect(JSON.stringify(await jobsIn(app.database.pool, "mail"))).not.toContain(token);

    // Opened on another device, signed out: it still confirms the address.
    const elsewhere = await app.visitor();
    const confirmed = await elsewhere.send("post", "/api/auth/verify-email", { token }).expect(200);
    expect(confirmed.body).toMatchObject({ confirmed: email, me: { user: null } });
    expect((await visitor.get("/api/auth/me").expect(200)).body.user.emailVerified).toBe(true);

    const again = await elsewhere.send("post", "/api/auth/verify-email", { token }).expect(410);
    expect(again.body.error.message).toMatch(/already been used/);
  });

  it("when the link has expired or was never made, then it answers 410 or 404 and confirms nothing", async () => {
    const { visitor, email } = await signUp();
    const token = await confirmationToken(email);
    await app.database.pool.query("update email_verifications set expires_at = now() - interval '1 minute' where token_hash = $1", [sha256Hex(token)]);
    const expired = await visitor.send("post", "/api/auth/verify-email", { token }).expect(410);
    expect(expired.body.error.message).toMatch(/expired/);
    await visitor.send("post", "/api/auth/verify-email", { token: "A".repeat(43) }).expect(404);
    await visitor.send("post", "/api/auth/verify-email", { token: "short" }).expect(400);
    expect((await visitor.get("/api/auth/me").expect(200)).body.user.emailVerified).toBe(false);
  });

  it("when the address is not confirmed yet, then inviting and sending a review link answer 403 and send nothing", async () => {
    const { visitor, channelId } = await signUp();
    const invitee = uniqueEmail("invitee");
    const invite = await visitor.send("post", `/api/channels/${channelId}/invitations`, { email: invitee, role: "crew" }).expect(403);
    expect(invite.body.error.message).toMatch(/^Confirm your e-mail address first/);
    expect(await count("select count(*)::int as n from invitations where email = $1", [invitee])).toBe(0);

    const episode = await createEpisode(app.db, channelId, { title: "Unconfirmed", targetPublishDate: "2027-05-01" });
    const sponsor = await createSponsor(app.db, channelId);
    const contact = await createContact(app.db, channelId, sponsor.id);
    const deal = await createDeal(app.db, channelId, episode.id, { sponsorId: sponsor.id, contactId: contact.id, publishDate: "2027-05-01" });
    const item = deal.items.find((i) => i.kind === "script_approval")!;
    const review = await visitor.send("post", `/api/channels/${channelId}/deals/${deal.deal.id}/review-links`, { deliverableId: item.id, contactId: contact.id }).expect(403);
    expect(review.body.error.message).toMatch(/^Confirm your e-mail address first/);
    expect(await count("select count(*)::int as n from review_links where deal_id = $1", [deal.deal.id])).toBe(0);
    expect(await mailTo(contact.email)).toEqual([]);
  });

  it("when a person asks for the mail again, then a new link comes, within three an hour, and then a 429 says when", async () => {
    const { visitor, email } = await signUp();
    await confirmationToken(email);
    for (const n of [2, 3]) {
      expect((await visitor.send("post", "/api/auth/verification-mail").expect(200)).body).toEqual({ sentTo: email });
      await confirmationToken(email, n);
    }
    const refused = await visitor.send("post", "/api/auth/verification-mail").expect(429);
    expect(refused.body.error.message).toMatch(/at most 3 confirmation mails an hour .* try again after \d\d:\d\d UTC/);
    expect(refused.body.retryAfterSeconds).toBeGreaterThan(0);
    expect(refused.headers["retry-after"]).toBe(String(refused.body.retryAfterSeconds));
    expect(await count("select count(*)::int as n from pgboss.job where name = 'mail' and data->'data'->>'userId' = (select id::text from users where email = $1)", [email])).toBe(3);
  });

  it("when the address is already confirmed, then asking again sends nothing", async () => {
    const person = await createUser(app.db);
    await createChannel(app.db, person);
    const agent = await app.signedIn(person);
    expect((await agent.send("post", "/api/auth/verification-mail").expect(200)).body).toEqual({ sentTo: null });
  });
});

describe("the demo's accounts", () => {
  it("when the demo is seeded, or was seeded before addresses were confirmed, then its accounts are confirmed and may invite", async () => {
    await seedDemo(app.db);
    const owner = demoAccounts.find((account) => account.role === "owner")!;
    await app.database.pool.query("update users set email_verified_at = null where email = $1", [owner.email]);
    await confirmDemoAddresses(app.db);
    const unconfirmed = await app.database.pool.query("select email from users where email = any($1) and email_verified_at is null", [demoAccounts.map((a) => a.email)]);
    expect(unconfirmed.rows).toEqual([]);

    const agent = await app.signedIn({ email: owner.email, password: DEMO_PASSWORD });
    const me = await agent.get("/api/auth/me").expect(200);
    await agent.send("post", `/api/channels/${me.body.memberships.find((m: { role: string }) => m.role === "owner").channelId}/invitations`, { email: uniqueEmail("demo-guest"), role: "crew" }).expect(201);
  });
});
