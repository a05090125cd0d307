import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import { PASSWORD_RESET_ANSWER } from "../../shared/auth/account";
import { createCrewedChannel, createUser } from "../factories/accounts";
import { createPasswordReset, sha256Hex, uniqueEmail } from "../factories/invitations";
import { jobsIn, mailJobsTo, waitForJobStates, waitForQueueToSettle } from "../support/jobs";
import { linkIn, mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { newEpisode } from "./slate-support";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const NEW_PASSWORD = "a-brand-new-passphrase";

/** The token of the "set a new password" link in the n-th such mail to `email`. */
async function resetToken(email: string, count = 1): Promise<string> {
  const mail = await waitForMail(email, { count });
  expect(mail.subject).toBe("Set a new password for Kerf");
  const link = linkIn(mail, /http:\/\/kerf\.test\/new-password\/[A-Za-z0-9_-]+/);
  return link.slice(link.lastIndexOf("/") + 1);
}

async function signInStatus(email: string, password: string): Promise<number> {
  const visitor = await app.visitor();
  return (await visitor.send("post", "/api/auth/sign-in", { email, password })).status;
}

async function passwordHashOf(userId: string): Promise<string> {
  return (await app.database.pool.query<{ password_hash: string }>("select password_hash from users where id = $1", [userId])).rows[0]!.password_hash;
}

describe("forgot password", () => {
  it("when someone asks for a link, then the answer is the same whether or not the address has an account, and only the account gets mail", async () => {
    const person = await createUser(app.db);
    const nobody = uniqueEmail("nobody");
    const visitor = await app.visitor();
    const known = await visitor.send("post", "/api/auth/password-reset", { email: person.email.toUpperCase() }).expect(202);
    const unknown = await visitor.send("post", "/api/auth/password-reset", { email: nobody }).expect(202);
    expect(known.body).toEqual({ message: PASSWORD_RESET_ANSWER });
    expect(unknown.body).toEqual(known.body);

    await resetToken(person.email);
    const [job] = await mailJobsTo(app.database.pool, nobody);
    await waitForJobStates(app.database.pool, [job!.id]);
    const output = (await jobsIn(app.database.pool, "mail")).find((j) => j.id === job!.id)!.output;
    expect(JSON.stringify(output)).toContain("no account has this address");
    expect(await mailTo(nobody)).toEqual([]);
  });

  it("when the link is mailed, then its expiry is written in the account's own zone, naming it", async () => {
    // America/St_Johns is UTC−3:30 in winter (IANA tz database, zone America/St_Johns); a half-hour offset
    // shows the time is converted, not only relabelled.
    const person = await createUser(app.db, { timeZone: "America/St_Johns" });
    const visitor = await app.visitor();
    await visitor.send("post", "/api/auth/password-reset", { email: person.email }).expect(202);
    const mail = await waitForMail(person.email);
    const { expires_at: expiresAt } = (await app.database.pool.query("select expires_at from password_resets where user_id = $1", [person.id])).rows[0];
    expect(mail.text).toContain(`expires in 1 hour, at ${formatInstantNamingZone(expiresAt, "America/St_Johns")}.`);
    expect(mail.text).toMatch(/, \d{2}:\d{2} UTC-[23]:30 \(America\/St_Johns\)\./);
  });

  it("when the link is used, then the password changes, every session of the account ends, the link works only once, and only its hash was stored", async () => {
    const person = await createUser(app.db);
    const laptop = await app.signedIn(person);
    const phone = await app.signedIn(person);
    const other = await createUser(app.db);
    const bystander = await app.signedIn(other);

    const visitor = await app.visitor();
    await visitor.send("post", "/api/auth/password-reset", { email: person.email }).expect(202);
    const token = await resetToken(person.email);
    const stored = await app.database.pool.query("select token_hash, expires_at - created_at < interval '61 minutes' as within_hour from password_resets where user_id = $1", [person.id]);
    expect(stored.rows).toEqual([{ token_hash: sha256Hex(token), within_hour: true }]);
    expect(JSON.stringify(await jobsIn(app.database.pool, "mail"))).not.toContain(token);

    const done = await visitor.send("post", "/api/auth/password-reset/complete", { token, password: NEW_PASSWORD }).expect(200);
    expect(done.body.user).toBeNull();
    await laptop.get("/api/account").expect(401);
    await phone.get("/api/account").expect(401);
    await bystander.get("/api/account").expect(200);
    expect(await signInStatus(person.email, person.password)).toBe(401);
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);

    const again = await visitor.send("post", "/api/auth/password-reset/complete", { token, password: "yet-another-passphrase" }).expect(410);
    expect(again.body.error.message).toMatch(/already been used/);
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);
  });

  it("when the link has expired or was never made, then it is refused and the password stays", async () => {
    const person = await createUser(app.db);
    const before = await passwordHashOf(person.id);
    const expired = await createPasswordReset(app.db, person, new Date(Date.now() - 60_000));
    const visitor = await app.visitor();
    const refused = await visitor.send("post", "/api/auth/password-reset/complete", { token: expired, password: NEW_PASSWORD }).expect(410);
    expect(refused.body.error.message).toMatch(/expired/);
    await visitor.send("post", "/api/auth/password-reset/complete", { token: "A".repeat(43), password: NEW_PASSWORD }).expect(404);
    await visitor.send("post", "/api/auth/password-reset/complete", { token: "short", password: NEW_PASSWORD }).expect(400);
    const weak = await visitor.send("post", "/api/auth/password-reset/complete", { token: await createPasswordReset(app.db, person), password: "short" }).expect(400);
    expect(weak.body.error.fields.password).toMatch(/at least 10/);
    expect(await passwordHashOf(person.id)).toBe(before);
  });

  it("when a newer link is sent, or the password is changed, then the older links stop working", async () => {
    const person = await createUser(app.db);
    const visitor = await app.visitor();
    await visitor.send("post", "/api/auth/password-reset", { email: person.email }).expect(202);
    const first = await resetToken(person.email, 1);
    await visitor.send("post", "/api/auth/password-reset", { email: person.email }).expect(202);
    const second = await resetToken(person.email, 2);
    await visitor.send("post", "/api/auth/password-reset/complete", { token: first, password: NEW_PASSWORD }).expect(410);

    const agent = await app.signedIn(person);
    await agent.send("post", "/api/account/password", { currentPassword: person.password, newPassword: NEW_PASSWORD }).expect(200);
    await visitor.send("post", "/api/auth/password-reset/complete", { token: second, password: "yet-another-passphrase" }).expect(410);
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);
  });

  it("when one address is asked about too often, then a 429 says when to try again, alike for an account and for nobody", async () => {
    const person = await createUser(app.db);
    const nobody = uniqueEmail("nobody");
    const visitor = await app.visitor();
    for (const email of [person.email, nobody]) {
      for (let n = 0; n < 5; n++) await visitor.send("post", "/api/auth/password-reset", { email }).expect(202);
    }
    const a = await visitor.send("post", "/api/auth/password-reset", { email: person.email }).expect(429);
    const b = await visitor.send("post", "/api/auth/password-reset", { email: nobody }).expect(429);
    expect(a.body.error.message).toMatch(/at most 5 password links an hour/);
    expect(b.body.error.message.replace(/\d+/g, "#")).toBe(a.body.error.message.replace(/\d+/g, "#"));
  });

  it("when one network asks for many links, then it is slowed down whatever the addresses", async () => {
    const limited = await startTestApp({ signInLimits: { perAccount: 5, perAddress: 1000, resetsPerAddress: 2, windowMs: 60_000 } });
    try {
      const visitor = await limited.visitor();
      await visitor.send("post", "/api/auth/password-reset", { email: uniqueEmail("a") }).expect(202);
      await visitor.send("post", "/api/auth/password-reset", { email: uniqueEmail("b") }).expect(202);
      const refused = await visitor.send("post", "/api/auth/password-reset", { email: uniqueEmail("c") }).expect(429);
      expect(refused.body.error.message).toMatch(/Too many requests for password links/);
    } finally {
      await limited.close();
    }
  });
});

describe("changing the password", () => {
  it("when the current password is wrong, then it answers 400 on that field and nothing changes", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    const other = await app.signedIn(person);
    const before = await passwordHashOf(person.id);
    const refused = await agent.send("post", "/api/account/password", { currentPassword: "not-my-password", newPassword: NEW_PASSWORD }).expect(400);
    expect(refused.body.error.fields).toEqual({ currentPassword: "That is not your current password." });
    expect(await passwordHashOf(person.id)).toBe(before);
    await other.get("/api/account").expect(200);
  });

  it("when the current password is right, then every other session ends and this one stays", async () => {
    const person = await createUser(app.db);
    const here = await app.signedIn(person);
    const elsewhere = await app.signedIn(person);
    const third = await app.signedIn(person);
    const changed = await here.send("post", "/api/account/password", { currentPassword: person.password, newPassword: NEW_PASSWORD }).expect(200);
    expect(changed.body).toEqual({ signedOut: 2 });
    await here.get("/api/account").expect(200);
    await elsewhere.get("/api/account").expect(401);
    await third.get("/api/account").expect(401);
    expect(await signInStatus(person.email, NEW_PASSWORD)).toBe(200);
  });

  it("when wrong current passwords keep coming, then the account page is slowed down", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    for (let n = 0; n < 5; n++) await agent.send("post", "/api/account/password", { currentPassword: `wrong-${n}`, newPassword: NEW_PASSWORD }).expect(400);
    await agent.send("post", "/api/account/password", { currentPassword: person.password, newPassword: NEW_PASSWORD }).expect(429);
  });
});

describe("sessions", () => {
  it("when a person lists their sessions, then each shows when it started and was last seen, this one marked, and signing out the others ends only theirs", async () => {
    const person = await createUser(app.db);
    const here = await app.signedIn(person);
    here.agent.set("user-agent", "Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0 Safari/537.36");
    const elsewhere = await app.visitor();
    elsewhere.agent.set("user-agent", "Mozilla/5.0 (iPhone; CPU iPhone OS 17_0 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.0 Mobile/15E148 Safari/604.1");
    await elsewhere.send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(200);
    const stranger = await app.signedIn(await createUser(app.db));

    const listed = await here.get("/api/account/sessions").expect(200);
    expect(listed.body.sessions).toHaveLength(2);
    const [mine, theirs] = listed.body.sessions;
    expect(mine).toMatchObject({ current: true });
    expect(theirs).toMatchObject({ current: false, device: "Safari on iOS" });
    for (const session of listed.body.sessions) {
      expect(Date.parse(session.startedAt)).toBeGreaterThan(Date.now() - 60_000);
      expect(Date.parse(session.lastSeenAt)).toBeGreaterThan(Date.now() - 60_000);
      expect(session.key).toMatch(/^[A-Za-z0-9_-]{16}$/);
    }
    // The list never hands out a session's own id, which is what its cookie holds.
    const sids = (await app.database.pool.query<{ sid: string }>("select sid from session where user_id = $1", [person.id])).rows.map((row) => row.sid);
    expect(sids).toHaveLength(2);
    for (const sid of sids) expect(JSON.stringify(listed.body)).not.toContain(sid);

    expect((await here.send("post", "/api/account/sessions/sign-out-others").expect(200)).body).toEqual({ signedOut: 1 });
    await elsewhere.get("/api/account").expect(401);
    await stranger.get("/api/account").expect(200);
    expect((await here.get("/api/account/sessions").expect(200)).body.sessions).toEqual([expect.objectContaining({ current: true })]);

    await here.send("post", "/api/auth/sign-out").expect(200);
    expect((await app.database.pool.query("select 1 from session where user_id = $1", [person.id])).rowCount).toBe(0);
  });
});

describe("settings", () => {
  async function account(agent: Visitor) {
    return (await agent.get("/api/account").expect(200)).body.account;
  }

  it("when a person saves their name, time zone and mail topics, then the account and the channel's view of them follow, and a stale save answers 409", async () => {
    const { channel, crew } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(crew);
    const opened = await account(agent);
    expect(opened).toMatchObject({ name: "Cato Crew", timeZone: "UTC", mailOptOuts: [], pendingEmail: null, version: 1 });

    const saved = await agent.send("put", "/api/account", { version: 1, name: "Cato Crewe", timeZone: "America/Sao_Paulo", mailOptOuts: ["reminders"] }).expect(200);
    expect(saved.body.account).toMatchObject({ name: "Cato Crewe", timeZone: "America/Sao_Paulo", mailOptOuts: ["reminders"], version: 2 });
    expect((await agent.get("/api/auth/me").expect(200)).body.user).toMatchObject({ name: "Cato Crewe", timeZone: "America/Sao_Paulo" });
    // Channel routes read the caller's zone from the account on every request.
    await agent.get(`/api/channels/${channel.id}/episodes`).expect(200);

    const stale = await agent.send("put", "/api/account", { version: 1, name: "Someone Else", timeZone: "UTC", mailOptOuts: [] }).expect(409);
    expect(stale.body.current).toMatchObject({ name: "Cato Crewe", version: 2 });
    expect((await account(agent)).name).toBe("Cato Crewe");
  });

  it("when the settings are not valid, then 400 names the field and nothing is saved", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    const zone = await agent.send("put", "/api/account", { version: 1, name: "Fine Name", timeZone: "Mars/Olympus_Mons", mailOptOuts: [] }).expect(400);
    expect(zone.body.error.fields.timeZone).toBe("Choose a time zone from the list.");
    await agent.send("put", "/api/account", { version: 1, name: "Fine Name", timeZone: "UTC", mailOptOuts: ["invitations"] }).expect(400);
    await agent.send("put", "/api/account", { version: 1, name: "  ", timeZone: "UTC", mailOptOuts: [] }).expect(400);
    await agent.send("put", "/api/account", { version: 1, name: "Fine Name", timeZone: "UTC", mailOptOuts: [], email: "x@example.com" }).expect(400);
    expect(await account(agent)).toMatchObject({ name: "Test Person", version: 1 });
  });

  it("when a member turned mentions off, then a mention mails the others and not them", async () => {
    const { channel, owner, editor, producer } = await createCrewedChannel(app.db);
    const quiet = await app.signedIn(editor);
    await quiet.send("put", "/api/account", { version: 1, name: "Edda Editor", timeZone: "UTC", mailOptOuts: ["mentions"] }).expect(200);
    const made = await newEpisode(await app.signedIn(owner), channel.id, { title: "Quiet mentions" });
    await (await app.signedIn(owner)).send("post", `/api/channels/${channel.id}/episodes/${made.id}/comments`, { body: "@Edda Editor and @Pim Producer: cut is ready." }).expect(201);

    await waitForMail(producer.email);
    const jobs = await mailJobsTo(app.database.pool, editor.email);
    expect(jobs).toHaveLength(1);
    await waitForJobStates(app.database.pool, jobs.map((job) => job.id));
    const output = (await jobsIn(app.database.pool, "mail")).find((job) => job.id === jobs[0]!.id)!.output;
    expect(JSON.stringify(output)).toContain("turned off mail about mentions");
    expect(await mailTo(editor.email)).toEqual([]);
  });

  it("when a member turned every topic off, then mail about their own account still comes", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    await agent.send("put", "/api/account", { version: 1, name: "Test Person", timeZone: "UTC", mailOptOuts: ["mentions", "reminders", "decisions"] }).expect(200);
    await (await app.visitor()).send("post", "/api/auth/password-reset", { email: person.email }).expect(202);
    await resetToken(person.email);
  });
});

describe("changing the address", () => {
  it("when the current password is wrong, then 400 and no mail", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    const target = uniqueEmail("moved");
    await agent.send("post", "/api/account/email", { email: target, currentPassword: "wrong-password" }).expect(400);
    await waitForQueueToSettle(app.database.pool);
    expect(await mailJobsTo(app.database.pool, target)).toEqual([]);
  });

  it("when a person asks for a new address, then it takes effect only once the link mailed to it is opened", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    const target = uniqueEmail("moved");
    const asked = await agent.send("post", "/api/account/email", { email: target, currentPassword: person.password }).expect(202);
    expect(asked.body).toEqual({ pendingEmail: target });

    const mail = await waitForMail(target);
    expect(mail.subject).toBe("Confirm your new address for Kerf");
    expect((await account(agent)).email).toBe(person.email);
    expect((await account(agent)).pendingEmail).toBe(target);
    expect(await signInStatus(target, person.password)).toBe(401);

    const token = linkIn(mail, /http:\/\/kerf\.test\/verify\/[A-Za-z0-9_-]+/).split("/").pop()!;
    const stored = await app.database.pool.query("select token_hash from email_verifications where user_id = $1 and changes_address", [person.id]);
    expect(stored.rows).toEqual([{ token_hash: sha256Hex(token) }]);
    const opened = await agent.send("post", "/api/auth/verify-email", { token }).expect(200);
    expect(opened.body).toMatchObject({ confirmed: target, me: { user: { email: target, emailVerified: true } } });
    expect(await account(agent)).toMatchObject({ email: target, pendingEmail: null });
    expect(await signInStatus(target, person.password)).toBe(200);
    expect(await signInStatus(person.email, person.password)).toBe(401);
    await agent.send("post", "/api/auth/verify-email", { token }).expect(410);
  });

  it("when another account took the address meanwhile, then opening the link changes nothing and says why", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    const target = uniqueEmail("contested");
    await agent.send("post", "/api/account/email", { email: target, currentPassword: person.password }).expect(202);
    const token = linkIn(await waitForMail(target), /http:\/\/kerf\.test\/verify\/[A-Za-z0-9_-]+/).split("/").pop()!;
    await createUser(app.db, { email: target });
    const refused = await agent.send("post", "/api/auth/verify-email", { token }).expect(409);
    expect(refused.body.error.message).toMatch(/belongs to another Kerf account/);
    expect((await account(agent)).email).toBe(person.email);
  });

  it("when the address asked for is the current one, then 400", async () => {
    const person = await createUser(app.db);
    const agent = await app.signedIn(person);
    await agent.send("post", "/api/account/email", { email: person.email, currentPassword: person.password }).expect(400);
  });

  async function account(agent: Visitor) {
    return (await agent.get("/api/account").expect(200)).body.account;
  }
});
