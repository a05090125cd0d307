import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { SignInLimits } from "../../server/auth/rate-limits";
import { createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

/*
 * Findings: the per-address sign-in limit counted successes too; five wrong passwords from anyone
 * locked the account itself for fifteen minutes; sign-up had no limit. The app runs here behind a
 * trusted proxy, so each visitor can call from an address of its own (X-Forwarded-For).
 */
const from = (visitor: Visitor, address: string) => ({
  signIn: (email: string, password: string) => visitor.agent.post("/api/auth/sign-in").set("x-csrf-token", visitor.csrf).set("x-forwarded-for", address).send({ email, password }),
  signUp: (body: object) => visitor.agent.post("/api/auth/sign-up").set("x-csrf-token", visitor.csrf).set("x-forwarded-for", address).send(body),
});

async function appWith(limits: SignInLimits): Promise<TestApp> {
  return startTestApp({ signInLimits: limits, trustProxy: true });
}

describe("the per-address limit", () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await appWith({ perAccount: 1000, perAddress: 3, windowMs: 60_000 });
  });
  afterAll(() => app.close());

  it("when one address signs in successfully many times, then it is not limited; its failures are", async () => {
    const person = await createUser(app.db);
    // Six people behind one office address sign in (each in a browser of its own).
    for (let i = 0; i < 6; i++) expect((await from(await app.visitor(), "192.0.2.10").signIn(person.email, person.password)).status).toBe(200);
    const office = from(await app.visitor(), "192.0.2.10");
    for (let i = 0; i < 3; i++) expect((await office.signIn(uniqueEmail("guess"), "guess-guess-guess")).status).toBe(401);
    const blocked = await office.signIn(uniqueEmail("guess"), "guess-guess-guess");
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe("rate_limited");
  });
});

describe("wrong passwords for one account", () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await appWith({ perAccount: 3, perAccountEverywhere: 7, perAddress: 1000, windowMs: 60_000 });
  });
  afterAll(() => app.close());

  it("when an attacker sends wrong passwords for a victim's account, then the attacker's address is slowed and the victim still signs in from theirs", async () => {
    const victim = await createUser(app.db);
    const attacker = from(await app.visitor(), "203.0.113.7");
    for (let i = 0; i < 3; i++) expect((await attacker.signIn(victim.email, `wrong-${i}`)).status).toBe(401);
    expect((await attacker.signIn(victim.email, "wrong-again")).status).toBe(429);
    // Even the right password from the attacker's address waits out the window.
    expect((await attacker.signIn(victim.email, victim.password)).status).toBe(429);

    const home = from(await app.visitor(), "198.51.100.20");
    const signedIn = await home.signIn(victim.email, victim.password);
    expect(signedIn.status).toBe(200);
    expect(signedIn.body.user.id).toBe(victim.id);
  });

  it("when wrong passwords come from many addresses, then past the account's own ceiling every address waits", async () => {
    const target = await createUser(app.db);
    // Seven failures in all, at most three from any one address.
    const addresses = ["203.0.113.21", "203.0.113.22", "203.0.113.23"];
    let sent = 0;
    for (const address of addresses) {
      const guesser = from(await app.visitor(), address);
      for (let i = 0; i < 3 && sent < 7; i++, sent++) expect((await guesser.signIn(target.email, `guess-${sent}`)).status).toBe(401);
    }
    const fresh = from(await app.visitor(), "203.0.113.99");
    expect((await fresh.signIn(target.email, "one-more-guess")).status).toBe(429);
  });
});

describe("signing up", () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await appWith({ perAccount: 5, perAddress: 1000, signUpsPerAddress: 2, windowMs: 60_000 });
  });
  afterAll(() => app.close());

  const body = () => ({ name: "Sia Signup", email: uniqueEmail("signup-limit"), password: "a-long-enough-password", channelName: "Limit Channel" });
  const accounts = async () => (await app.database.pool.query<{ n: number }>("select count(*)::int as n from users")).rows[0]!.n;

  it("when one address signs up more often than allowed, then it answers 429 and makes no account; other addresses still sign up", async () => {
    const one = from(await app.visitor(), "192.0.2.50");
    // A form sent back for a mistake doesn't count.
    expect((await one.signUp({ ...body(), email: "not-an-address" })).status).toBe(400);
    expect((await one.signUp(body())).status).toBe(201);
    expect((await from(await app.visitor(), "192.0.2.50").signUp(body())).status).toBe(201);
    const before = await accounts();
    const third = await from(await app.visitor(), "192.0.2.50").signUp(body());
    expect(third.status).toBe(429);
    expect(third.body.error).toMatchObject({ code: "rate_limited", message: expect.stringMatching(/sign-ups/i) });
    expect(await accounts()).toBe(before);

    expect((await from(await app.visitor(), "192.0.2.51").signUp(body())).status).toBe(201);
  });
});
