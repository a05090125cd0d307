import fc from "fast-check";
import type request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../../server/app";
import type { RouteSpec } from "../../server/http/route-table";
import { allRecipes, fillPath, makeAccessWorld } from "../support/access-world";
import { rowsSnapshot } from "../support/rows-snapshot";
import { cpuMsPerCall, deeplyNested, plainClient, timeRequests } from "../support/server-timing";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import type { AccessWorld, Recipe } from "./access/matrix";

/*
 * Every write route gets at least BODIES_PER_ROUTE generated bad requests: bodies that are wrong in
 * type, shape or size (routes that take a body), or ids that are malformed or belong to another
 * channel (routes that act on a path alone). Each must answer 4xx in the one error shape and change no
 * row. The routes come from the app's own table and their valid calls from the access matrix's
 * recipes (tests/api/access/), so a new route without a recipe fails here too.
 */
/*
 * 50 per route: about 6,000 generated requests over the 120 write routes, a minute or so on a 2-core
 * machine. At 200 (24,000 requests) this one property took about 290 s, longer than any other file
 * and a fifth of the whole unit and API run. Each run draws new cases (fast-check seeds from the clock,
 * and prints the seed of a failure to replay it), so the runs cover more between them than any one does.
 */
const BODIES_PER_ROUTE = 50;
const writeMethods = new Set(["post", "put", "patch", "delete"]);

let app: TestApp;
let world: AccessWorld;
let recipes: Record<string, Recipe>;
let otherChannel: { channelId: string; episodeId: string };
const tally = { routes: 0, requests: 0, fiveHundreds: 0 };

const routeName = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;

const snapshot = () => rowsSnapshot(app);

const weirdStrings = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom("", " ", "\u0000", "\uD800", "\u202Eevil", "👩🏽‍🔧".repeat(50), "'; drop table users; --", "<script>alert(1)</script>", "2026-13-45", "25:61:61:99", "NaN", "-0"),
  fc.string({ unit: "grapheme", minLength: 1000, maxLength: 3000 }),
);
const weirdNumbers = fc.oneof(fc.integer(), fc.double(), fc.constantFrom(-1, 0, 2 ** 53, -(2 ** 53), 1e308, -1e308));
const anyValue = fc.oneof(weirdStrings, weirdNumbers, fc.boolean(), fc.constant(null), fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }), fc.dictionary(fc.string({ maxLength: 10 }), fc.jsonValue({ maxDepth: 1 }), { maxKeys: 4 }));

/** A value whose JSON type differs from the one a valid body has at that key. */
function wrongTypeFor(valid: unknown): fc.Arbitrary<unknown> {
  if (typeof valid === "string") return fc.oneof(weirdNumbers, fc.boolean(), fc.constant(null), fc.array(weirdStrings, { maxLength: 3 }), fc.dictionary(fc.string({ maxLength: 10 }), weirdStrings, { maxKeys: 3 }));
  if (typeof valid === "number") return fc.oneof(weirdStrings, fc.boolean(), fc.constant(null), fc.array(weirdNumbers, { maxLength: 3 }));
  if (typeof valid === "boolean") return fc.oneof(weirdStrings, weirdNumbers, fc.constant(null));
  if (Array.isArray(valid)) return fc.oneof(weirdStrings, weirdNumbers, fc.dictionary(fc.string({ maxLength: 10 }), weirdNumbers, { maxKeys: 3 }));
  return fc.oneof(weirdStrings, weirdNumbers, fc.boolean());
}

/**
 * Bodies that no schema may accept: not an object at all; or the valid body with an unknown field
 * added (request schemas are strict) and besides that some fields dropped and others replaced by odd
 * values, or one field given the wrong type. The unknown field makes each one invalid for certain.
 */
function badBodies(valid: Record<string, unknown>): fc.Arbitrary<unknown> {
  const keys = Object.keys(valid);
  const notAnObject = fc.oneof(fc.array(anyValue, { maxLength: 4 }), weirdStrings.map((s) => [s]));
  const unknownKey = fc.string({ minLength: 1, maxLength: 20 }).filter((k) => !keys.includes(k) && k !== "__proto__");
  const extraField = fc.record({ extra: unknownKey, value: anyValue, drop: fc.subarray(keys), replace: fc.dictionary(fc.constantFrom(...(keys.length ? keys : ["x"])), anyValue, { maxKeys: 3 }) }).map(
    ({ extra, value, drop, replace }) => {
      const body: Record<string, unknown> = { ...valid, ...replace };
      for (const key of drop) delete body[key];
      body[extra] = value;
      return body;
    },
  );
  if (keys.length === 0) return fc.oneof(notAnObject, extraField);
  const wrongType = fc
    .tuple(fc.constantFrom(...keys), unknownKey, anyValue)
    .chain(([key, extra, extraValue]) => wrongTypeFor(valid[key]).map((value) => ({ ...valid, [key]: value, [extra]: extraValue })));
  return fc.oneof(notAnObject, extraField, wrongType);
}

/** Path parameters that name nothing this caller may touch. */
function badParams(valid: Record<string, string>): fc.Arbitrary<Record<string, string>> {
  const names = Object.keys(valid).filter((name) => name !== "channelId");
  const badId = fc.oneof(
    fc.uuid().map(String),
    fc.constantFrom("0", "-1", "null", "undefined", "%00", "../../etc/passwd", "00000000-0000-0000-0000-000000000000", otherChannel.episodeId, "x".repeat(300)),
    fc.string({ minLength: 1, maxLength: 60 }),
  );
  if (names.length === 0) return fc.constant({ ...valid, channelId: otherChannel.channelId });
  return fc.record(Object.fromEntries(names.map((name) => [name, badId]))).map((params) => ({ ...valid, ...params }));
}

function expectRefusal(response: request.Response, label: string): void {
  tally.requests++;
  if (response.status >= 500) tally.fiveHundreds++;
  const seen = `${label} answered ${response.status} ${JSON.stringify(response.body).slice(0, 300)}`;
  expect(response.status, seen).toBeGreaterThanOrEqual(400);
  expect(response.status, seen).toBeLessThan(500);
  expect(response.body?.error, seen).toMatchObject({ code: expect.any(String), message: expect.any(String) });
}

async function sendRaw(agent: Visitor, spec: RouteSpec, path: string, body: string, contentType: string) {
  return agent.agent[spec.method](path).set("x-csrf-token", agent.csrf).set("content-type", contentType).send(body);
}

type Path = (string | number)[];
type Json = unknown;

/** Every value in a body (leaves, arrays and objects alike) with its path. */
function nodes(value: Json, path: Path = []): { path: Path; value: Json }[] {
  const inner = typeof value === "object" && value !== null ? Object.entries(value).flatMap(([key, v]) => nodes(v, [...path, Array.isArray(value) ? Number(key) : key])) : [];
  return [{ path, value }, ...inner];
}

/** A copy of the body with the value at `path` replaced. */
function replaced(body: Json, path: Path, value: Json): Json {
  if (path.length === 0) return value;
  const [head, ...rest] = path as [string | number, ...Path];
  const copy = (Array.isArray(body) ? [...body] : { ...(body as object) }) as Record<string | number, Json>;
  copy[head] = replaced(copy[head], rest, value);
  return copy;
}

const isDateField = (path: Path) => /(Date|On|At)$|^day$/.test(String(path[path.length - 1] ?? ""));
const extremeDates = ["9999-12-31", "0000-01-01", "1899-12-31", "2101-01-01", "+275760-09-13", "9999-12-31T23:59:59Z", "0000-01-01T00:00:00Z"];
/** Text that shows nothing, or hides controls or direction overrides: refused by the text rule everywhere. */
const hiddenTexts = ["\u200B\u200B\u200B", "\uFEFF\u200B", "\u2060\u200D", "\u3164", "x\u202Ey", "x\u2066y", "x\u0000y", "x\u0007y", "x\u0085y", "x\uD800y"];

/**
 * Bodies built from a route's valid body that the route must refuse: 6,000 and 33 levels deep, long
 * arrays, each date field made extreme, each text field made hidden or invisible.
 */
function hostileBodies(valid: Record<string, Json>): { kind: string; body: Json | string }[] {
  const all = nodes(valid).filter((n) => n.path.length > 0);
  const firstKey = Object.keys(valid)[0] ?? "x";
  const hostile: { kind: string; body: Json | string }[] = [
    { kind: "deep", body: deeplyNested(6000, firstKey) },
    { kind: "deep", body: deeplyNested(32, firstKey) },
    { kind: "long array", body: new Array(20_000).fill(0) },
  ];
  for (const { path, value } of all) {
    if (Array.isArray(value)) {
      const element = value[0] ?? "x";
      const count = Math.min(5_000, Math.max(200, Math.floor(50_000 / JSON.stringify(element).length)));
      hostile.push({ kind: "long array", body: replaced(valid, path, new Array(count).fill(element)) });
    }
    if (isDateField(path)) for (const date of extremeDates) hostile.push({ kind: "extreme date", body: replaced(valid, path, date) });
    if (typeof value === "string" && !/password/i.test(String(path[path.length - 1]))) {
      for (const text of hiddenTexts) hostile.push({ kind: "hidden text", body: replaced(valid, path, text) });
    }
  }
  return hostile;
}

beforeAll(async () => {
  app = await startTestApp({ signInLimits: { perAccount: 10_000, perAddress: 100_000, signUpsPerAddress: 100_000, windowMs: 60_000 } });
  world = await makeAccessWorld(app);
  recipes = allRecipes(app, world);
  const elsewhere = await makeAccessWorld(app);
  otherChannel = { channelId: elsewhere.channel.id, episodeId: elsewhere.episode.id };
});
afterAll(async () => {
  console.log(`fuzz: ${tally.routes} write routes, ${tally.requests} requests (at least ${BODIES_PER_ROUTE} generated per route), ${tally.fiveHundreds} answered 5xx`);
  await app.close();
});

describe("bad input on every write route", () => {
  it("when the app's write routes are listed, then every one has a recipe to fuzz from", () => {
    const writes = apiRoutes(app.deps).filter((spec) => writeMethods.has(spec.method));
    expect(writes.filter((spec) => !recipes[routeName(spec)]).map(routeName)).toEqual([]);
  });

  const writes = () => apiRoutes(app.deps).filter((spec) => writeMethods.has(spec.method));
  it("when each write route gets generated bad requests, then every answer is a 4xx in the error shape and no row changes", async () => {
    for (const spec of writes()) {
      const recipe = recipes[routeName(spec)]!;
      const agent = await app.signedIn(world.people.owner);
      const prepared = (await recipe.prepare?.({ caller: "owner", person: world.people.owner })) ?? {};
      const params = { channelId: world.channel.id, ...prepared.params };
      const takesBody = spec.method !== "delete" && spec.body !== "none" && prepared.body !== undefined;
      const before = await snapshot();

      const label = routeName(spec);
      if (takesBody) {
        const path = fillPath(spec.path, params);
        await fc.assert(
          fc.asyncProperty(badBodies(prepared.body as Record<string, unknown>), async (body) => {
            expectRefusal(await agent.send(spec.method as "post", path, body), `${label} with ${JSON.stringify(body).slice(0, 200)}`);
          }),
          { numRuns: BODIES_PER_ROUTE },
        );
        expectRefusal(await sendRaw(agent, spec, path, '{"broken": ', "application/json"), `${label} malformed JSON`);
        expect((await sendRaw(agent, spec, path, "hello", "text/plain")).status, `${label} text/plain`).toBe(415);
        expect((await sendRaw(agent, spec, path, JSON.stringify({ pad: "x".repeat(Math.max(200_000, (spec.bodyLimit ?? 0) + 1)) }), "application/json")).status, `${label} oversized`).toBe(413);
        tally.requests += 3;
      } else if (spec.path.includes(":")) {
        await fc.assert(
          fc.asyncProperty(badParams(params), async (bad) => {
            expectRefusal(await agent.send(spec.method as "delete", fillPath(spec.path, bad)), `${label} at ${JSON.stringify(bad)}`);
          }),
          { numRuns: BODIES_PER_ROUTE },
        );
      } else {
        // A write with neither body nor path (sign-out) has nothing a caller could get wrong.
        continue;
      }
      expect(await snapshot(), `${label} changed rows`).toBe(before);
      tally.routes++;
    }
    expect(tally.fiveHundreds).toBe(0);
  }, 600_000);

  it("when each write route gets deep nesting, long arrays, extreme dates and invisible text, then every answer is a 4xx, no row changes, and 6,000 levels answer 400 for under 5 ms of CPU", async () => {
    const timing = timeRequests(app.server);
    const client = plainClient(app.server);
    const deepCpu: number[] = [];
    const seen = { deep: 0, "long array": 0, "extreme date": 0, "hidden text": 0 } as Record<string, number>;
    try {
      for (const spec of writes()) {
        if (spec.body === "none") continue;
        const recipe = recipes[routeName(spec)]!;
        const agent = await app.signedIn(world.people.owner);
        const prepared = (await recipe.prepare?.({ caller: "owner", person: world.people.owner })) ?? {};
        const path = fillPath(spec.path, { channelId: world.channel.id, ...prepared.params });
        const label = routeName(spec);
        const before = await snapshot();
        // A route that takes no body (a delete) ignores a parsed one; only a body too deep to parse must be refused.
        const hostile = prepared.body === undefined ? hostileBodies({}).filter((h) => h.kind === "deep") : hostileBodies(prepared.body as Record<string, Json>);
        for (const { kind, body } of hostile) {
          const text = typeof body === "string" ? body : JSON.stringify(body);
          const response = await agent.agent[spec.method](path).set("x-csrf-token", agent.csrf).set("content-type", "application/json").set("x-timing-label", kind).send(text);
          expectRefusal(response, `${label} with ${kind} ${text.slice(0, 120)}`);
          if (kind === "deep") expect(response.status, `${label} deep`).toBe(spec.body === "multipart" ? 415 : 400);
          seen[kind]!++;
        }
        // The server's cost of a 6,000-deep body, on a connection of its own (refused before sessions load).
        if (spec.body !== "multipart") deepCpu.push(await cpuMsPerCall(10, async () => expect((await client.send(spec.method.toUpperCase(), path, deeplyNested(6000))).status).toBe(400), 3));
        expect(await snapshot(), `${label} changed rows`).toBe(before);
      }
    } finally {
      timing.stop();
      client.close();
    }
    const deep = timing.timings.filter((t) => t.label === "deep" && t.status === 400);
    const isDeep = (t: { label: string }) => t.label === "deep";
    const cpu = deepCpu.reduce((sum, ms) => sum + ms, 0) / deepCpu.length;
    console.log(
      `fuzz (hostile shapes): ${JSON.stringify(seen)}; a 6,000-deep body costs ${cpu.toFixed(2)} ms of CPU (server and client, average of ${deepCpu.length} routes) and takes ${timing.median(isDeep).toFixed(2)} ms from headers to answer (median; average ${timing.average(isDeep).toFixed(2)} ms)`,
    );
    expect(deep.length).toBeGreaterThan(100);
    expect(seen["extreme date"]).toBeGreaterThan(0);
    expect(cpu).toBeLessThan(5);
    expect(tally.fiveHundreds).toBe(0);
  }, 600_000);
});
