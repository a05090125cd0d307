import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CSRF_HEADER } from "../../server/http/csrf";
import { SESSION_COOKIE } from "../../server/http/session";
import { starterTemplate } from "../../shared/sponsors/starter-template";
import { createChannel, createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp } from "../support/test-app";

const GOOD_PASSWORD = "a-long-enough-password";
const NO_MATCH = "That e-mail and password don't match an account.";

function signUpBody(overrides: Record<string, unknown> = {}) {
  return { name: "Hana Host", email: uniqueEmail("signup"), password: GOOD_PASSWORD, channelName: "Bench Gremlins", ...overrides };
}

/** The session cookie a response sets, as "name=value" (what a browser would send back). */
function sessionCookieOf(response: request.Response): { pair: string; attributes: string } {
  const header = response.headers["set-cookie"] as unknown;
  const all = Array.isArray(header) ? (header as string[]) : typeof header === "string" ? [header] : [];
  const cookie = all.find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  if (!cookie) throw new Error(`no ${SESSION_COOKIE} cookie in ${JSON.stringify(all)}`);
  const [pair, ...attributes] = cookie.split(";").map((part) => part.trim());
  return { pair: pair!, attributes: attributes.join("; ") };
}

/** The session id inside a signed cookie value ("s:<sid>.<signature>", URL-encoded). */
function sidOf(pair: string): string {
  const value = decodeURIComponent(pair.slice(pair.indexOf("=") + 1));
  return value.slice(2, value.lastIndexOf("."));
}

async function countRows(app: TestApp, table: "users" | "channels" | "memberships"): Promise<number> {
  const result = await app.database.pool.query<{ n: number }>(`select count(*)::int as n from ${table}`);
  return result.rows[0]!.n;
}

async function userExists(app: TestApp, email: string): Promise<boolean> {
  const result = await app.database.pool.query("select 1 from users where email = $1", [email]);
  return (result.rowCount ?? 0) > 0;
}

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

describe("signing up, in and out", () => {
  it("when someone signs up, then a channel is made and they are its owner", async () => {
    const visitor = await app.visitor();
    const body = signUpBody({ channelName: "Thrust Lab" });
    const response = await visitor.send("post", "/api/auth/sign-up", body).expect(201);
    expect(response.body.user).toMatchObject({ email: body.email, name: "Hana Host" });
    expect(response.body.user).not.toHaveProperty("passwordHash");
    expect(response.body.memberships).toEqual([{ channelId: expect.any(String), channelName: "Thrust Lab", role: "owner" }]);

    const me = await visitor.get("/api/auth/me").expect(200);
    expect(me.body.user.email).toBe(body.email);
    expect(me.body.memberships).toEqual([{ channelId: response.body.memberships[0].channelId, channelName: "Thrust Lab", role: "owner" }]);

    const stored = await app.database.pool.query(
      "select m.role, c.name from memberships m join users u on u.id = m.user_id join channels c on c.id = m.channel_id where u.email = $1",
      [body.email],
    );
    expect(stored.rows).toEqual([{ role: "owner", name: "Thrust Lab" }]);
  });

  it("when someone signs up from a browser in another zone, then the account starts in that zone; an unknown zone is refused and makes nothing", async () => {
    const visitor = await app.visitor();
    const body = signUpBody({ channelName: "Zone Lab" });
    const made = await visitor.send("post", "/api/auth/sign-up", { ...body, timeZone: "Asia/Tokyo" }).expect(201);
    expect(made.body.user.timeZone).toBe("Asia/Tokyo");
    const bad = signUpBody({ channelName: "Nowhere Lab" });
    const refused = await (await app.visitor()).send("post", "/api/auth/sign-up", { ...bad, timeZone: "Mars/Olympus_Mons" }).expect(400);
    expect(refused.body.error.fields).toEqual({ timeZone: "Choose a time zone from the list." });
    expect((await app.database.pool.query("select count(*)::int as n from users where email = $1", [bad.email])).rows[0].n).toBe(0);
    // Without one (an older client), UTC, as before.
    const plain = await (await app.visitor()).send("post", "/api/auth/sign-up", signUpBody({ channelName: "Plain Lab" })).expect(201);
    expect(plain.body.user.timeZone).toBe("UTC");
  });

  it("when a channel is made, by signing up or later, then it starts with one deal template to adjust", async () => {
    const visitor = await app.visitor();
    const made = await visitor.send("post", "/api/auth/sign-up", signUpBody({ channelName: "Starter Lab" })).expect(201);
    const someone = await app.signedIn(await createUser(app.db));
    const later = await someone.send("post", "/api/channels", { name: "Second Lab" }).expect(201);
    for (const [agent, channelId] of [[visitor, made.body.memberships[0].channelId], [someone, later.body.id]] as const) {
      const templates = await agent.get(`/api/channels/${channelId}/deal-templates`).expect(200);
      expect(templates.body.templates).toHaveLength(1);
      expect(templates.body.templates[0]).toMatchObject({ name: starterTemplate.name, items: starterTemplate.items });
    }
  });

  it("when an e-mail already has an account, then signing up with it again answers 409 with a message on the e-mail field", async () => {
    const first = signUpBody();
    await (await app.visitor()).send("post", "/api/auth/sign-up", first).expect(201);
    const usersBefore = await countRows(app, "users");
    const channelsBefore = await countRows(app, "channels");

    const again = await (await app.visitor()).send("post", "/api/auth/sign-up", signUpBody({ email: first.email.toUpperCase() })).expect(409);
    expect(again.body.error.code).toBe("conflict");
    expect(again.body.error.fields.email).toMatch(/already exists/);
    expect(await countRows(app, "users")).toBe(usersBefore);
    expect(await countRows(app, "channels")).toBe(channelsBefore);
  });

  it("when a person signs in and then out, then me shows them and then nobody, and channel routes answer 401", async () => {
    const person = await createUser(app.db);
    const channel = await createChannel(app.db, person, "Sign-out Channel");
    const visitor = await app.visitor();

    const signedIn = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(200);
    expect(signedIn.body.user).toMatchObject({ id: person.id, email: person.email });
    visitor.csrf = signedIn.body.csrfToken;
    const me = await visitor.get("/api/auth/me").expect(200);
    expect(me.body.user.id).toBe(person.id);
    expect(me.body.memberships).toEqual([{ channelId: channel.id, channelName: "Sign-out Channel", role: "owner" }]);
    await visitor.get(`/api/channels/${channel.id}/episodes`).expect(200);

    const signedOut = await visitor.send("post", "/api/auth/sign-out").expect(200);
    expect(signedOut.body.user).toBeNull();
    const after = await visitor.get("/api/auth/me").expect(200);
    expect(after.body).toMatchObject({ user: null, memberships: [] });
    const denied = await visitor.get(`/api/channels/${channel.id}/episodes`).expect(401);
    expect(denied.body.error.code).toBe("unauthenticated");
  });

  it("when the password is wrong, then sign-in answers 401 with a clear message and starts no session", async () => {
    const person = await createUser(app.db);
    const visitor = await app.visitor();
    const response = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: "not-the-password" }).expect(401);
    expect(response.body).toEqual({ error: { code: "unauthenticated", message: NO_MATCH } });
    expect((await visitor.get("/api/auth/me").expect(200)).body.user).toBeNull();
  });

  it("when the e-mail has no account, then sign-in answers the same 401 as a wrong password", async () => {
    const visitor = await app.visitor();
    const response = await visitor.send("post", "/api/auth/sign-in", { email: uniqueEmail("nobody"), password: "whatever-it-is" }).expect(401);
    expect(response.body).toEqual({ error: { code: "unauthenticated", message: NO_MATCH } });
  });

  it("when a visitor holding a session signs in, then the session cookie changes and the old cookie alone is not signed in", async () => {
    const person = await createUser(app.db);
    const earlier = await createUser(app.db);
    const visitor = await app.visitor();
    // A visitor who is not signed in holds no session at all; one who is signs in again as someone else.
    const first = await visitor.send("post", "/api/auth/sign-in", { email: earlier.email, password: earlier.password }).expect(200);
    const before = sessionCookieOf(first);
    visitor.csrf = first.body.csrfToken;

    const signIn = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(200);
    const after = sessionCookieOf(signIn);
    expect(after.pair).not.toBe(before.pair);
    expect(sidOf(after.pair)).not.toBe(sidOf(before.pair));

    const withOldCookie = await request(app.server).get("/api/auth/me").set("Cookie", before.pair).expect(200);
    expect(withOldCookie.body.user).toBeNull();
    const withNewCookie = await request(app.server).get("/api/auth/me").set("Cookie", after.pair).expect(200);
    expect(withNewCookie.body.user.id).toBe(person.id);

    const oldRows = await app.database.pool.query("select 1 from session where sid = $1", [sidOf(before.pair)]);
    expect(oldRows.rowCount).toBe(0);
  });

  it("when the session cookie is set, then it is HttpOnly and SameSite=Lax", async () => {
    const person = await createUser(app.db);
    const visitor = await app.visitor();
    const signIn = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(200);
    const { attributes } = sessionCookieOf(signIn);
    expect(attributes).toMatch(/(^|; )HttpOnly(;|$)/i);
    expect(attributes).toMatch(/(^|; )SameSite=Lax(;|$)/i);
    expect(attributes).toMatch(/(^|; )Path=\/(;|$)/);
  });
});

describe("session expiry", () => {
  it("when a signed-in person makes requests in a row, then the session's expiry is written once, not on every read", async () => {
    const person = await createUser(app.db);
    const visitor = await app.visitor();
    const signIn = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(200);
    const sid = sidOf(sessionCookieOf(signIn).pair);
    // Every write of a row gives it a new row version (xmin), even one that stores the same second.
    const rowVersion = async () => (await app.database.pool.query<{ xmin: string }>("select xmin::text from session where sid = $1", [sid])).rows[0]!.xmin;
    const atSignIn = await rowVersion();
    await visitor.get("/api/auth/me").expect(200);
    const afterFirst = await rowVersion();
    expect(afterFirst).not.toBe(atSignIn);
    for (let i = 0; i < 3; i++) await visitor.get("/api/auth/me").expect(200);
    expect(await rowVersion()).toBe(afterFirst);
  });
});

describe("forged requests (CSRF)", () => {
  it("when a sign-up carries no token, then it answers 403 csrf_failed and makes no account", async () => {
    const visitor = await app.visitor();
    const body = signUpBody();
    const usersBefore = await countRows(app, "users");
    const response = await visitor.agent.post("/api/auth/sign-up").send(body).expect(403);
    expect(response.body.error).toEqual({ code: "csrf_failed", message: "This form has expired or came from another site. Reload the page and try again." });
    expect(await countRows(app, "users")).toBe(usersBefore);
    expect(await userExists(app, body.email)).toBe(false);
  });

  it("when a sign-up carries a wrong token, then it answers 403 csrf_failed and makes no account", async () => {
    const visitor = await app.visitor();
    const body = signUpBody();
    const response = await visitor.agent.post("/api/auth/sign-up").set(CSRF_HEADER, `${visitor.csrf.slice(0, -2)}xx`).send(body).expect(403);
    expect(response.body.error.code).toBe("csrf_failed");
    expect(await userExists(app, body.email)).toBe(false);
  });

  it("when a request comes with no session at all, then a write answers 403 csrf_failed", async () => {
    const body = signUpBody();
    const response = await request(app.server).post("/api/auth/sign-up").set(CSRF_HEADER, "anything").send(body).expect(403);
    expect(response.body.error.code).toBe("csrf_failed");
    expect(await userExists(app, body.email)).toBe(false);
  });

  it("when a signed-in person's write carries another session's token, then it answers 403 and creates no channel", async () => {
    const person = await createUser(app.db);
    const victim = await app.signedIn(person);
    const attacker = await app.visitor();
    const channelsBefore = await countRows(app, "channels");
    const response = await victim.agent.post("/api/channels").set(CSRF_HEADER, attacker.csrf).send({ name: "Forged Channel" }).expect(403);
    expect(response.body.error.code).toBe("csrf_failed");
    expect(await countRows(app, "channels")).toBe(channelsBefore);
    // The same person with their own token is let through: the 403 was about the token alone.
    await victim.send("post", "/api/channels", { name: "Real Channel" }).expect(201);
  });
});

describe("request bodies", () => {
  it("when the e-mail is malformed and the password short, then sign-up answers 400 with a message per field and writes nothing", async () => {
    const visitor = await app.visitor();
    const usersBefore = await countRows(app, "users");
    const response = await visitor.send("post", "/api/auth/sign-up", signUpBody({ email: "not-an-address", password: "short" })).expect(400);
    expect(response.body.error).toMatchObject({
      code: "validation_failed",
      message: expect.any(String),
      fields: { email: expect.stringMatching(/valid e-mail/), password: expect.stringMatching(/at least 10/) },
    });
    expect(await countRows(app, "users")).toBe(usersBefore);
  });

  it("when the body has a field the route does not know, then it answers 400 and writes nothing", async () => {
    const visitor = await app.visitor();
    const body = signUpBody({ isAdmin: true });
    const response = await visitor.send("post", "/api/auth/sign-up", body).expect(400);
    expect(response.body.error.code).toBe("validation_failed");
    expect(JSON.stringify(response.body.error.fields)).toMatch(/isAdmin/);
    expect(await userExists(app, body.email)).toBe(false);
  });

  it("when the body is not valid JSON, then it answers 400", async () => {
    const visitor = await app.visitor();
    const response = await visitor.agent
      .post("/api/auth/sign-up")
      .set(CSRF_HEADER, visitor.csrf)
      .set("Content-Type", "application/json")
      .send('{"name": "Hana", "email": ')
      .expect(400);
    expect(response.body.error.code).toBe("validation_failed");
  });

  it("when the body is plain text, then it answers 415", async () => {
    const visitor = await app.visitor();
    const response = await visitor.agent
      .post("/api/auth/sign-up")
      .set(CSRF_HEADER, visitor.csrf)
      .set("Content-Type", "text/plain")
      .send("name=Hana&email=hana@example.com")
      .expect(415);
    expect(response.body.error.code).toBe("unsupported_media_type");
  });

  it("when the body is over 100 kB, then it answers 413 and writes nothing", async () => {
    const visitor = await app.visitor();
    const body = signUpBody({ name: "x".repeat(101 * 1024) });
    const response = await visitor.send("post", "/api/auth/sign-up", body).expect(413);
    expect(response.body.error.code).toBe("payload_too_large");
    expect(await userExists(app, body.email)).toBe(false);
  });
});

// Passport's default instance is process-wide, so only the first app a test file starts reads sessions
// back (server/http/session.ts); the apps below only count sign-in attempts and never need one.
describe("sign-in limits per account", () => {
  let limited: TestApp;
  beforeAll(async () => {
    limited = await startTestApp({ signInLimits: { perAccount: 3, perAddress: 1000, windowMs: 60_000 } });
  });
  afterAll(() => limited.close());

  it("when one account gets more wrong passwords than allowed, then sign-in answers 429, even with the right password", async () => {
    const person = await createUser(limited.db);
    const visitor = await limited.visitor();
    for (let attempt = 0; attempt < 3; attempt++) {
      await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: `wrong-${attempt}` }).expect(401);
    }
    const blocked = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: "wrong-again" }).expect(429);
    expect(blocked.body).toEqual({ error: { code: "rate_limited", message: expect.stringMatching(/too many/i) } });

    const rightButBlocked = await (await limited.visitor()).send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(429);
    expect(rightButBlocked.body.error.code).toBe("rate_limited");
  });

  it("when one account is blocked, then another account from the same address still signs in", async () => {
    const blocked = await createUser(limited.db);
    const other = await createUser(limited.db);
    const visitor = await limited.visitor();
    const answers: number[] = [];
    for (let attempt = 0; attempt < 4; attempt++) {
      answers.push((await visitor.send("post", "/api/auth/sign-in", { email: blocked.email, password: `wrong-${attempt}` })).status);
    }
    expect(answers).toEqual([401, 401, 401, 429]);
    await visitor.send("post", "/api/auth/sign-in", { email: blocked.email, password: blocked.password }).expect(429);
    const signedIn = await visitor.send("post", "/api/auth/sign-in", { email: other.email, password: other.password }).expect(200);
    expect(signedIn.body.user.id).toBe(other.id);
  });
});

describe("sign-in limits per address", () => {
  let limited: TestApp;
  beforeAll(async () => {
    limited = await startTestApp({ signInLimits: { perAccount: 1000, perAddress: 3, windowMs: 60_000 } });
  });
  afterAll(() => limited.close());

  it("when one address tries more accounts than allowed, then sign-in answers 429 whatever the e-mail", async () => {
    const visitor = await limited.visitor();
    for (let attempt = 0; attempt < 3; attempt++) {
      await visitor.send("post", "/api/auth/sign-in", { email: uniqueEmail("spray"), password: "guess-guess-guess" }).expect(401);
    }
    const blocked = await visitor.send("post", "/api/auth/sign-in", { email: uniqueEmail("spray"), password: "guess-guess-guess" }).expect(429);
    expect(blocked.body).toEqual({ error: { code: "rate_limited", message: expect.any(String) } });
  });
});
