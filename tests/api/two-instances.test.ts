import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { CSRF_HEADER } from "../../server/http/csrf";
import { createCrewedChannel } from "../factories/accounts";
import { createTestDatabase, type TestDatabase } from "../support/database";
import { startTestApp, type TestApp } from "../support/test-app";

let database: TestDatabase;
let first: TestApp;
let second: TestApp;
beforeAll(async () => {
  database = await createTestDatabase();
  first = await startTestApp({ database });
  second = await startTestApp({ database });
});
afterAll(async () => {
  await first.close();
  await second.close();
  await database.drop();
});

describe("two app instances on one database", () => {
  it("when a person signs in on one instance, then the other serves their session and accepts its CSRF token", async () => {
    const { channel, owner } = await createCrewedChannel(first.db, "Twin Servers");
    const onFirst = await first.signedIn(owner);
    const cookie = (await onFirst.get("/api/auth/me")).request.cookies;
    expect(cookie).toContain("kerf.sid");

    const me = await request(second.server).get("/api/auth/me").set("Cookie", cookie).expect(200);
    expect(me.body.user.email).toBe(owner.email);
    await request(second.server)
      .post("/api/channels")
      .set("Cookie", cookie)
      .set(CSRF_HEADER, onFirst.csrf)
      .send({ name: "Made on the second" })
      .expect(201);
    await request(second.server).get(`/api/channels/${channel.id}/members`).set("Cookie", cookie).expect(200);
  });
});
