import { randomUUID } from "node:crypto";
import os from "node:os";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../../server/app";
import { CSRF_HEADER } from "../../server/http/csrf";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { fillPath } from "../support/access-world";
import { cpuMsPerCall, deeplyNested, plainClient, timeRequests } from "../support/server-timing";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

/*
 * Finding: a body nested thousands of levels deep used to cost the only event loop seconds (a
 * recursive scan that copied its path at every level) and past ~7,000 levels answered 500. Every
 * JSON body is now measured before it is parsed: deeper than 32 levels answers 400 at once.
 */
let app: TestApp;
let anonymous: Visitor;
let owner: Visitor;
let commentsPath: string;

const writeMethods = new Set(["post", "put", "patch", "delete"]);
const sendJson = (visitor: Visitor, method: "post" | "put" | "patch" | "delete", path: string, text: string) =>
  visitor.agent[method](path).set(CSRF_HEADER, visitor.csrf).set("content-type", "application/json").send(text);

beforeAll(async () => {
  app = await startTestApp();
  anonymous = await app.visitor();
  const crewed = await createCrewedChannel(app.db, "Deep Channel");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Deep episode" });
  owner = await app.signedIn(crewed.owner);
  commentsPath = `/api/channels/${crewed.channel.id}/episodes/${episode.id}/comments`;
});
afterAll(() => app.close());

describe("deeply nested bodies", () => {
  it("when a 6,000-deep body reaches each public write route, then each answers 400 in the error shape, costing under 5 ms of CPU", async () => {
    const publicWrites = apiRoutes(app.deps).filter((spec) => spec.access.kind === "public" && writeMethods.has(spec.method) && spec.body !== "none");
    expect(publicWrites.length).toBeGreaterThanOrEqual(4);
    const body = deeplyNested(6000);
    const client = plainClient(app.server);
    const timing = timeRequests(app.server);
    try {
      for (const spec of publicWrites) {
        const path = fillPath(spec.path, { token: "a".repeat(43), channelId: randomUUID() });
        const response = await sendJson(anonymous, spec.method as "post", path, body);
        expect(response.status, `${spec.method} ${spec.path}`).toBe(400);
        expect(response.body.error).toMatchObject({ code: "validation_failed", message: expect.stringMatching(/nested/i) });
        const cpu = await cpuMsPerCall(50, async () => expect((await client.send(spec.method.toUpperCase(), path, body)).status).toBe(400));
        console.log(`deep body to ${spec.method.toUpperCase()} ${spec.path}: ${cpu.toFixed(2)} ms of CPU per request (server and client together)`);
        expect(cpu).toBeLessThan(5);
      }
    } finally {
      timing.stop();
      client.close();
    }
    console.log(`deep bodies: median ${timing.median().toFixed(2)} ms, average ${timing.average().toFixed(2)} ms from headers to answer inside the server (machine load ${os.loadavg()[0]!.toFixed(1)})`);
  });

  it("when a signed-in write gets a body 40,000 levels deep, then it answers 400, not 500, and writes nothing", async () => {
    const before = await app.database.pool.query("select count(*)::int as n from episode_comments");
    const response = await sendJson(owner, "post", commentsPath, deeplyNested(40_000, "body"));
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("validation_failed");
    expect((await app.database.pool.query("select count(*)::int as n from episode_comments")).rows).toEqual(before.rows);
  });

  it("when a body is 33 levels deep, then it is refused, and 32 levels reach the route's own checks", async () => {
    const tooDeep = await sendJson(owner, "post", commentsPath, deeplyNested(32, "body"));
    expect(tooDeep.status).toBe(400);
    expect(tooDeep.body.error.message).toMatch(/nested/i);
    const deepEnough = await sendJson(owner, "post", commentsPath, deeplyNested(31, "body"));
    expect(deepEnough.status).toBe(400);
    expect(deepEnough.body.error.fields).toHaveProperty("body");
  });

  it("when the nesting hides inside strings, then brackets in text are not counted", async () => {
    const text = JSON.stringify({ body: `${"[{".repeat(500)} quoted \\" still text ${"]}".repeat(500)}`.slice(0, 3900) });
    await sendJson(owner, "post", commentsPath, text).expect(201);
  });
});

describe("long lists", () => {
  it("when a body holds a list of 20,000 entries, then it answers 400 before any of it is read into objects", async () => {
    const path = commentsPath.replace(/episodes\/.*$/, "clips/00000000-0000-4000-8000-000000000000");
    const body = JSON.stringify({ tags: new Array(20_000).fill("a") });
    const response = await sendJson(owner, "patch", path, body);
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/too long/);
    const client = plainClient(app.server);
    try {
      expect(await cpuMsPerCall(50, async () => expect((await client.send("PATCH", path, body)).status).toBe(400))).toBeLessThan(5);
    } finally {
      client.close();
    }
  });

  it("when a list has 1,000 entries, then the route's own checks answer", async () => {
    const response = await sendJson(owner, "post", commentsPath, JSON.stringify({ body: "x", extra: new Array(1000).fill(0) }));
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toHaveProperty("_");
  });
});

describe("body size per route", () => {
  it("when an anonymous form gets a 20 kB body, then it answers 413 and makes no account", async () => {
    const users = await app.database.pool.query("select count(*)::int as n from users");
    const response = await sendJson(anonymous, "post", "/api/auth/sign-up", JSON.stringify({ name: "x".repeat(20_000), email: "big@example.com", password: "long-enough-password", channelName: "Big" }));
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("payload_too_large");
    expect((await app.database.pool.query("select count(*)::int as n from users")).rows).toEqual(users.rows);
  });

  it("when a signed-in write gets a 60 kB body, then its own checks answer (the default limit is larger)", async () => {
    const response = await sendJson(owner, "post", commentsPath, JSON.stringify({ body: "y".repeat(60_000) }));
    expect(response.status).toBe(400);
    expect(response.body.error.fields.body).toMatch(/4,000/);
  });

  it("when JSON arrives in a charset other than UTF-8, then it answers 415", async () => {
    const response = await owner.agent.post(commentsPath).set(CSRF_HEADER, owner.csrf).set("content-type", "application/json; charset=utf-16le").send(Buffer.from(JSON.stringify({ body: "hi" }), "utf16le"));
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe("unsupported_media_type");
  });
});
