import { randomUUID } from "node:crypto";
import type { Response } from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "../../shared/access/roles";
import { addMember, createChannel, createUser } from "../factories/accounts";
import { createInvitation, sha256Hex, uniqueEmail } from "../factories/invitations";
import { jobsIn } from "../support/jobs";
import { linkIn, mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const NEWCOMER = { name: "Nia Newcomer", password: "a-long-enough-password" };

/** An owner with a channel, signed in. */
async function ownerWithChannel(channelName = "Invite Channel") {
  const owner = await createUser(app.db, { name: "Olive Owner" });
  const channel = await createChannel(app.db, owner, channelName);
  return { owner, channel, agent: await app.signedIn(owner) };
}

/** Invites through the API and reads the link's token out of the mail that arrives. */
async function invite(agent: Visitor, channelId: string, role: Role = "editor", email = uniqueEmail("invitee")) {
  const response = await agent.send("post", `/api/channels/${channelId}/invitations`, { email, role }).expect(201);
  const mail = await waitForMail(email);
  const link = linkIn(mail, /http:\/\/kerf\.test\/invite\/[A-Za-z0-9_-]+/);
  const token = link.slice(link.lastIndexOf("/") + 1);
  return { id: response.body.id as string, email, token, mail };
}

/** Accepts as `as` (a fresh visitor if none), checking the status when one is given. */
async function accept(token: string, body: object, options: { as?: Visitor; status?: number } = {}) {
  const visitor = options.as ?? (await app.visitor());
  const test = visitor.send("post", `/api/invitations/${token}/accept`, body);
  return options.status === undefined ? test : test.expect(options.status);
}

async function membershipRole(channelId: string, email: string): Promise<string | null> {
  const result = await app.database.pool.query<{ role: string }>(
    "select m.role from memberships m join users u on u.id = m.user_id where m.channel_id = $1 and u.email = $2",
    [channelId, email],
  );
  return result.rows[0]?.role ?? null;
}

/** Starts a request now (supertest sends on the first `then`), to be awaited later. */
const started = (test: PromiseLike<Response>) => Promise.resolve(test);

/** Holds the channel's row as a concurrent writer would, until `release`. */
async function holdChannel(channelId: string) {
  const client = await app.database.pool.connect();
  await client.query("begin");
  await client.query("select id from channels where id = $1 for update", [channelId]);
  return {
    release: async () => {
      await client.query("commit");
      client.release();
    },
  };
}

/** Waits until this many of the test database's sessions are waiting for a lock. */
async function waitForLockWaits(count: number) {
  const waiting = async () =>
    (await app.database.pool.query<{ n: number }>("select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock'")).rows[0]!.n;
  await expect.poll(waiting, { timeout: 10_000, interval: 20 }).toBe(count);
}

describe("inviting by e-mail", () => {
  it("when an owner invites an address, then a mail with a link arrives and its preview is open", async () => {
    const { channel, agent } = await ownerWithChannel("Prop Wash");
    const { email, token, mail } = await invite(agent, channel.id, "producer");
    expect(mail.subject).toMatch(/Prop Wash/);
    expect(token.length).toBeGreaterThanOrEqual(40);

    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body).toEqual({ channelName: "Prop Wash", email, role: "producer", invitedBy: "Olive Owner", state: "open", hasAccount: false });

    const members = await agent.get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.invitations).toEqual([expect.objectContaining({ email, role: "producer" })]);
  });

  it("when a newcomer accepts with a name and password, then they are a signed-in member with the invited role", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { email, token } = await invite(agent, channel.id, "editor");
    const newcomer = await app.visitor();

    const accepted = await accept(token, NEWCOMER, { as: newcomer, status: 200 });
    expect(accepted.body.channelId).toBe(channel.id);
    expect(accepted.body.me.user).toMatchObject({ email, name: NEWCOMER.name });
    expect(accepted.body.me.memberships).toEqual([{ channelId: channel.id, channelName: "Invite Channel", role: "editor" }]);

    const me = await newcomer.get("/api/auth/me").expect(200);
    expect(me.body.user.email).toBe(email);
    await newcomer.get(`/api/channels/${channel.id}/episodes`).expect(200);
    expect(await membershipRole(channel.id, email)).toBe("editor");

    // The password they chose is the one the account now has.
    await app.signedIn({ email, password: NEWCOMER.password });
  });

  it("when a newcomer accepts from a browser in another zone, then their account starts in it", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { token } = await invite(agent, channel.id, "crew");
    const accepted = await accept(token, { ...NEWCOMER, timeZone: "America/Sao_Paulo" }, { status: 200 });
    expect(accepted.body.me.user.timeZone).toBe("America/Sao_Paulo");
  });

  it("when a link has been used, then using it again answers 410 and its preview says accepted", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { token } = await invite(agent, channel.id);
    await accept(token, NEWCOMER, { status: 200 });

    const again = await accept(token, { name: "Second Try", password: "another-long-password" }, { status: 410 });
    expect(again.body.error.code).toBe("gone");
    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("accepted");
  });

  it("when an invitation has expired, then its preview says expired and accepting answers 410 without making an account", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { id, email, token } = await invite(agent, channel.id);
    await app.database.pool.query("update invitations set expires_at = now() - interval '1 minute' where id = $1", [id]);

    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("expired");
    const response = await accept(token, NEWCOMER, { status: 410 });
    expect(response.body.error.code).toBe("gone");
    const users = await app.database.pool.query("select 1 from users where email = $1", [email]);
    expect(users.rowCount).toBe(0);
  });

  it("when an owner revokes an invitation, then it leaves the list and accepting answers 410", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { id, email, token } = await invite(agent, channel.id);
    await agent.send("delete", `/api/channels/${channel.id}/invitations/${id}`).expect(204);

    const members = await agent.get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.invitations).toEqual([]);
    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("revoked");
    await accept(token, NEWCOMER, { status: 410 });
    expect(await membershipRole(channel.id, email)).toBeNull();

    // Revoking twice finds nothing left to revoke.
    await agent.send("delete", `/api/channels/${channel.id}/invitations/${id}`).expect(404);
  });

  it("when an invitation is stored, then only the SHA-256 of the link's token is kept", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { id, token } = await invite(agent, channel.id);

    const row = await app.database.pool.query("select * from invitations where id = $1", [id]);
    expect(row.rows[0].token_hash).toBe(sha256Hex(token));
    const everything = await app.database.pool.query("select * from invitations");
    expect(JSON.stringify(everything.rows)).not.toContain(token);
    // Nor does the mail queue: the link is made when the mail is sent.
    expect(JSON.stringify(await jobsIn(app.database.pool, "mail"))).not.toContain(token);
  });

  it("when a person who already has an account accepts while signed in, then they join with their own account", async () => {
    const { channel, agent } = await ownerWithChannel("Second Home");
    const existing = await createUser(app.db, { name: "Eli Existing" });
    const theirOwn = await createChannel(app.db, existing, "Eli's Workshop");
    const { token } = await invite(agent, channel.id, "crew", existing.email);

    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.hasAccount).toBe(true);

    const signedIn = await app.signedIn(existing);
    const accepted = await accept(token, {}, { as: signedIn, status: 200 });
    expect(accepted.body.me.user.id).toBe(existing.id);
    const me = await signedIn.get("/api/auth/me").expect(200);
    expect(me.body.memberships).toEqual(
      expect.arrayContaining([
        { channelId: channel.id, channelName: "Second Home", role: "crew" },
        { channelId: theirOwn.id, channelName: "Eli's Workshop", role: "owner" },
      ]),
    );
    expect(me.body.memberships).toHaveLength(2);
  });

  it("when someone signed in with another address opens the link, then it answers 403 naming the invited address, and the link stays open for its addressee", async () => {
    const { owner, channel, agent } = await ownerWithChannel("Not For You");
    const { email, token } = await invite(agent, channel.id, "editor");
    const stranger = await createUser(app.db, { name: "Sly Stranger" });
    for (const person of [owner, stranger]) {
      const refused = await accept(token, {}, { as: await app.signedIn(person), status: 403 });
      expect(refused.body.error.message).toBe(
        `This invitation is for ${email}, and you are signed in as ${person.email}. Sign out, then open the link again to join with ${email}.`,
      );
    }
    expect(await membershipRole(channel.id, stranger.email)).toBeNull();
    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("open");
    await accept(token, NEWCOMER, { status: 200 });
    expect(await membershipRole(channel.id, email)).toBe("editor");
  });

  it("when the invited address already belongs to a member, then accepting answers 409 and the link stays open", async () => {
    const { channel, owner } = await ownerWithChannel("Already Here");
    const member = await createUser(app.db);
    const invitation = await createInvitation(app.db, { channelId: channel.id, invitedBy: owner, email: member.email });
    await addMember(app.db, channel.id, member, "crew");
    await accept(invitation.token, {}, { as: await app.signedIn(member), status: 409 });
    expect((await (await app.visitor()).get(`/api/invitations/${invitation.token}`).expect(200)).body.state).toBe("open");
  });

  it("when an address already has an open invitation or is a member, then inviting it again answers 409 and sends nothing", async () => {
    const { channel, agent } = await ownerWithChannel("No Twice");
    const { email } = await invite(agent, channel.id, "crew");
    const again = await agent.send("post", `/api/channels/${channel.id}/invitations`, { email: email.toUpperCase(), role: "editor" }).expect(409);
    expect(again.body.error.message).toMatch(new RegExp(`^${email} already has an open invitation .*nothing was sent`));
    expect(again.body.error.fields).toEqual({ email: "Already invited; the invitation is still open." });

    const member = await createUser(app.db);
    await addMember(app.db, channel.id, member, "crew");
    const joined = await agent.send("post", `/api/channels/${channel.id}/invitations`, { email: member.email, role: "crew" }).expect(409);
    expect(joined.body.error.message).toBe(`${member.email} is already a member of this channel; nothing was sent.`);

    const rows = await app.database.pool.query("select email from invitations where channel_id = $1", [channel.id]);
    expect(rows.rows).toEqual([{ email }]);
    // Two owners inviting one address at the same moment make one invitation.
    const other = uniqueEmail("raced");
    const answers = await Promise.all([0, 1].map(() => agent.send("post", `/api/channels/${channel.id}/invitations`, { email: other, role: "crew" })));
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
    await waitForMail(other);
    expect(await mailTo(other)).toHaveLength(1);
    expect(await mailTo(email)).toHaveLength(1);
  });

  it("when a person joins, then their other open invitations to that channel close", async () => {
    const { channel, owner } = await ownerWithChannel("Close The Rest");
    const email = uniqueEmail("twice");
    // Two open invitations to one address (made before Kerf refused the second).
    const first = await createInvitation(app.db, { channelId: channel.id, invitedBy: owner, email, role: "crew" });
    const second = await createInvitation(app.db, { channelId: channel.id, invitedBy: owner, email, role: "editor" });
    await accept(first.token, NEWCOMER, { status: 200 });

    const preview = await (await app.visitor()).get(`/api/invitations/${second.token}`).expect(200);
    expect(preview.body.state).toBe("closed");
    const closed = await accept(second.token, {}, { as: await app.signedIn({ email, password: NEWCOMER.password }), status: 410 });
    expect(closed.body.error.message).toMatch(/already joined/);
    const members = await (await app.signedIn(owner)).get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.invitations).toEqual([]);
    expect(await membershipRole(channel.id, email)).toBe("crew");
  });

  it("when a newcomer joins through an invitation, then their address counts as confirmed", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { token } = await invite(agent, channel.id, "producer");
    const newcomer = await app.visitor();
    const accepted = await accept(token, NEWCOMER, { as: newcomer, status: 200 });
    expect(accepted.body.me.user.emailVerified).toBe(true);
  });

  it("when a newcomer sends neither name nor password, then it answers 400 and the link stays open", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { token } = await invite(agent, channel.id);
    const response = await accept(token, {}, { status: 400 });
    expect(response.body.error).toMatchObject({ code: "validation_failed", fields: { name: "Enter your name.", password: "Choose a password." } });
    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("open");
  });

  it("when the invited person accepts one link from two sessions at the same moment, then they join once", async () => {
    const { channel, agent } = await ownerWithChannel();
    const invited = await createUser(app.db);
    const { token } = await invite(agent, channel.id, "crew", invited.email);
    const [a, b] = await Promise.all([app.signedIn(invited), app.signedIn(invited)]);

    const statuses = (await Promise.all([accept(token, {}, { as: a }), accept(token, {}, { as: b })])).map((r) => r.status).sort();
    expect(statuses).toEqual([200, 410]);
    const joined = await app.database.pool.query("select user_id from memberships where channel_id = $1 and user_id = $2", [channel.id, invited.id]);
    expect(joined.rowCount).toBe(1);
  });

  it("when two newcomers accept one link at the same moment, then exactly one account is made and joins", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { email, token } = await invite(agent, channel.id, "crew");

    const responses = await Promise.all([accept(token, NEWCOMER), accept(token, { name: "Other Newcomer", password: "other-long-password" })]);
    const statuses = responses.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    const loser = statuses.find((s) => s !== 200);
    expect([409, 410]).toContain(loser);
    const users = await app.database.pool.query("select id from users where email = $1", [email]);
    expect(users.rowCount).toBe(1);
    expect(await membershipRole(channel.id, email)).toBe("crew");
  });

  it("when an invitation is accepted at the moment an owner removes its sender, then one of them wins with a clear answer and neither fails", async () => {
    const { owner, channel } = await ownerWithChannel("Crossed Paths");
    const coOwner = await createUser(app.db, { name: "Cleo Coowner" });
    await addMember(app.db, channel.id, coOwner, "owner");
    const invitation = await createInvitation(app.db, { channelId: channel.id, invitedBy: coOwner, role: "crew" });
    const ownerAgent = await app.signedIn(owner);

    // Both requests queue behind the channel's row, removal first; then they go on together.
    const held = await holdChannel(channel.id);
    const removal = started(ownerAgent.send("delete", `/api/channels/${channel.id}/members/${coOwner.id}`));
    await waitForLockWaits(1);
    const acceptance = started(accept(invitation.token, NEWCOMER));
    await waitForLockWaits(2);
    await held.release();

    const [removed, accepted] = await Promise.all([removal, acceptance]);
    expect(removed.status).toBe(204);
    // The removal went first, so the link was withdrawn with its sender's role; a refusal that says so.
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(410);
    expect(accepted.body.error.message).toMatch(/withdrawn/);
    expect(await membershipRole(channel.id, invitation.email)).toBeNull();
  });

  it("when an owner invites an address at the moment that person joins through another invitation, then no open invitation is left for a member", async () => {
    const { owner, channel, agent } = await ownerWithChannel("Same Moment");
    const email = uniqueEmail("joining");
    const first = await createInvitation(app.db, { channelId: channel.id, invitedBy: owner, email, role: "crew" });

    // The joining goes first; the invitation waits for it, then finds a member.
    const held = await holdChannel(channel.id);
    const joining = started(accept(first.token, NEWCOMER));
    await waitForLockWaits(1);
    const inviting = started(agent.send("post", `/api/channels/${channel.id}/invitations`, { email, role: "editor" }));
    await waitForLockWaits(2);
    await held.release();

    const [joined, invited] = await Promise.all([joining, inviting]);
    expect(joined.status).toBe(200);
    expect(invited.status, JSON.stringify(invited.body)).toBe(409);
    expect(invited.body.error.message).toBe(`${email} is already a member of this channel; nothing was sent.`);
    const members = await agent.get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.invitations).toEqual([]);
  });

  it("when the token names no invitation, then preview and accept answer 404", async () => {
    const unknown = "x".repeat(43);
    const visitor = await app.visitor();
    const preview = await visitor.get(`/api/invitations/${unknown}`).expect(404);
    expect(preview.body.error.code).toBe("not_found");
    const name = `Nobody ${randomUUID()}`;
    await visitor.send("post", `/api/invitations/${unknown}/accept`, { name, password: NEWCOMER.password }).expect(404);
    const users = await app.database.pool.query("select 1 from users where name = $1", [name]);
    expect(users.rowCount).toBe(0);
  });
});
