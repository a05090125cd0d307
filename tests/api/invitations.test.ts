import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "../../shared/access/roles";
import { createChannel, createUser } from "../factories/accounts";
import { sha256Hex, uniqueEmail } from "../factories/invitations";
import { linkIn, waitForMail } from "../support/mailbox";
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

  it("when someone who is already a member opens a link, then it answers 409 and the link stays open for its addressee", async () => {
    const { owner, channel, agent } = await ownerWithChannel("Already Here");
    const { token } = await invite(agent, channel.id, "editor");
    await accept(token, {}, { as: await app.signedIn(owner), status: 409 });
    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("open");
    await accept(token, NEWCOMER, { status: 200 });
  });

  it("when a newcomer sends neither name nor password, then it answers 400 and the link stays open", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { token } = await invite(agent, channel.id);
    const response = await accept(token, {}, { status: 400 });
    expect(response.body.error).toMatchObject({ code: "validation_failed", fields: { name: "Enter your name.", password: "Choose a password." } });
    const preview = await (await app.visitor()).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.state).toBe("open");
  });

  it("when two signed-in people accept one link at the same moment, then exactly one joins", async () => {
    const { channel, agent } = await ownerWithChannel();
    const { token } = await invite(agent, channel.id, "crew");
    const first = await createUser(app.db);
    const second = await createUser(app.db);
    const [a, b] = await Promise.all([app.signedIn(first), app.signedIn(second)]);

    const statuses = (await Promise.all([accept(token, {}, { as: a }), accept(token, {}, { as: b })])).map((r) => r.status).sort();
    expect(statuses).toEqual([200, 410]);
    const joined = await app.database.pool.query("select user_id from memberships where channel_id = $1 and user_id = any($2)", [channel.id, [first.id, second.id]]);
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
