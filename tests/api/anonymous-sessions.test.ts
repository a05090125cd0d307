import { randomBytes } from "node:crypto";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CSRF_HEADER } from "../../server/http/csrf";
import { createChannel, createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp } from "../support/test-app";

/*
 * Finding: every anonymous GET /api/auth/me stored a session row for 14 days (its CSRF token lived
 * there). Visitors who are not signed in now have no stored state at all: their CSRF token is a signed
 * double-submit token (a cookie and a header that must match, signed with the server's secret).
 */
let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const sessionRows = async () => (await app.database.pool.query<{ n: number }>("select count(*)::int as n from session")).rows[0]!.n;
const userCount = async () => (await app.database.pool.query<{ n: number }>("select count(*)::int as n from users")).rows[0]!.n;

function cookiesOf(response: request.Response): string[] {
  const header = response.headers["set-cookie"] as unknown;
  return (Array.isArray(header) ? (header as string[]) : typeof header === "string" ? [header] : []).map((c) => c.split(";")[0]!);
}

const signUpBody = () => ({ name: "Nia Newcomer", email: uniqueEmail("anon"), password: "a-long-enough-password", channelName: "Fresh Channel" });

describe("visitors who are not signed in", () => {
  it("when 1,000 anonymous visitors ask who they are, then the session table does not change", async () => {
    const before = await sessionRows();
    for (let i = 0; i < 1000; i++) {
      const response = await request(app.server).get("/api/auth/me").expect(200);
      expect(response.body.user).toBeNull();
      expect(response.body.csrfToken).toEqual(expect.any(String));
    }
    expect(await sessionRows()).toBe(before);
  }, 60_000);

  it("when one visitor keeps its cookies across calls, then it keeps one token and still stores nothing", async () => {
    const before = await sessionRows();
    const visitor = await app.visitor();
    const first = visitor.csrf;
    for (let i = 0; i < 5; i++) await visitor.refreshCsrf();
    expect(visitor.csrf).toBe(first);
    expect(await sessionRows()).toBe(before);
  });

  it("when an anonymous visitor signs up with its token, then the account is made and only then a session is stored", async () => {
    const before = await sessionRows();
    const visitor = await app.visitor();
    await visitor.send("post", "/api/auth/sign-up", signUpBody()).expect(201);
    expect(await sessionRows()).toBe(before + 1);
  });
});

describe("forged anonymous writes", () => {
  it("when a sign-up carries no token, another visitor's token or a forged one, then each answers 403 and makes no account", async () => {
    const visitor = await app.visitor();
    const other = await app.visitor();
    const users = await userCount();

    const none = await visitor.agent.post("/api/auth/sign-up").send(signUpBody());
    const othersToken = await visitor.agent.post("/api/auth/sign-up").set(CSRF_HEADER, other.csrf).send(signUpBody());
    // A token of the right shape, made up by the attacker, sent both as the cookie and the header.
    const forged = `${randomBytes(32).toString("base64url")}.${randomBytes(32).toString("base64url")}`;
    const forgedPair = await request(app.server).post("/api/auth/sign-up").set("Cookie", `kerf.csrf=${forged}`).set(CSRF_HEADER, forged).send(signUpBody());
    // A real token's random half with a signature made up for it.
    const [value] = visitor.csrf.split(".");
    const resigned = `${value}.${randomBytes(32).toString("base64url")}`;
    const resignedPair = await request(app.server).post("/api/auth/sign-up").set("Cookie", `kerf.csrf=${resigned}`).set(CSRF_HEADER, resigned).send(signUpBody());

    for (const response of [none, othersToken, forgedPair, resignedPair]) {
      expect(response.status).toBe(403);
      expect(response.body.error.code).toBe("csrf_failed");
    }
    expect(await userCount()).toBe(users);
  });

  it("when the header token is copied into a fresh client without its cookie, then the write answers 403", async () => {
    const visitor = await app.visitor();
    const response = await request(app.server).post("/api/auth/sign-up").set(CSRF_HEADER, visitor.csrf).send(signUpBody());
    expect(response.status).toBe(403);
  });
});

describe("signing in", () => {
  it("when a visitor signs in, then its token changes, the anonymous token no longer writes, and the new one does", async () => {
    const person = await createUser(app.db);
    await createChannel(app.db, person, "Rotation Channel");
    const visitor = await app.visitor();
    const anonymousToken = visitor.csrf;
    const signedIn = await visitor.send("post", "/api/auth/sign-in", { email: person.email, password: person.password }).expect(200);
    const signedInToken = signedIn.body.csrfToken as string;
    expect(signedInToken).not.toBe(anonymousToken);
    expect(cookiesOf(signedIn).some((c) => c.startsWith("kerf.sid="))).toBe(true);

    const stale = await visitor.agent.post("/api/channels").set(CSRF_HEADER, anonymousToken).send({ name: "Stale Token Channel" });
    expect(stale.status).toBe(403);
    visitor.csrf = signedInToken;
    await visitor.send("post", "/api/channels", { name: "Fresh Token Channel" }).expect(201);
    expect((await visitor.get("/api/auth/me").expect(200)).body.csrfToken).toBe(signedInToken);
  });

  it("when the same person is signed in twice, then one session's token does not write in the other", async () => {
    const person = await createUser(app.db);
    const laptop = await app.signedIn(person);
    const phone = await app.signedIn(person);
    expect(laptop.csrf).not.toBe(phone.csrf);
    const crossed = await phone.agent.post("/api/channels").set(CSRF_HEADER, laptop.csrf).send({ name: "Crossed Channel" });
    expect(crossed.status).toBe(403);
  });

  it("when a person signs out, then the session row goes and the answer's token is an anonymous one that stores nothing", async () => {
    const person = await createUser(app.db);
    const visitor = await app.signedIn(person);
    const before = await sessionRows();
    const out = await visitor.send("post", "/api/auth/sign-out").expect(200);
    expect(out.body.user).toBeNull();
    expect(await sessionRows()).toBe(before - 1);
    visitor.csrf = out.body.csrfToken;
    await visitor.refreshCsrf();
    expect(visitor.csrf).toBe(out.body.csrfToken);
    expect(await sessionRows()).toBe(before - 1);
  });
});
