import type request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../../server/app";
import { allRecipes, featureAccess, fillPath, makeAccessWorld } from "../support/access-world";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import { callers, ok, type AccessWorld, type Caller, type Cell, type Recipe } from "./access/matrix";

const matrix = featureAccess.flatMap((access) => access.rows);

const callerNames: Record<Caller, string> = {
  visitor: "a signed-out visitor",
  owner: "the owner",
  producer: "the producer",
  editor: "the editor",
  crew: "a crew member",
  outsider: "a member of another channel",
};
const errorCodes = { 401: "unauthenticated", 403: "forbidden", 404: "not_found" } as const;

let app: TestApp;
let world: AccessWorld;
let recipes: Record<string, Recipe> = {};
let checked = 0;

async function agentFor(caller: Caller): Promise<Visitor> {
  // A fresh session per cell: a sign-in, sign-up or sign-out in one cell must not change the next.
  return caller === "visitor" ? app.visitor() : app.signedIn(world.people[caller]);
}

async function checkCell(route: string, caller: Caller, expected: Cell): Promise<void> {
  const recipe = recipes[route];
  if (!recipe) throw new Error(`no recipe for ${route}`);
  const [method, template] = route.split(" ") as [string, string];
  const agent = await agentFor(caller);
  const prepared = (await recipe.prepare?.({ caller, person: caller === "visitor" ? null : world.people[caller] })) ?? {};
  const path = fillPath(template, { channelId: world.channel.id, ...prepared.params });
  const response: request.Response =
    method === "GET" ? await agent.get(path) : await agent.send(method.toLowerCase() as "post" | "put" | "patch" | "delete", path, prepared.body);

  const seen = `${route} as ${caller} answered ${response.status} ${JSON.stringify(response.body)}`;
  if (expected === ok) {
    expect(response.status, seen).toBe(recipe.ok);
  } else {
    expect(response.status, seen).toBe(expected);
    expect(response.body.error?.code, seen).toBe(errorCodes[expected]);
    await prepared.intact?.();
  }
  checked++;
}

beforeAll(async () => {
  app = await startTestApp();
  world = await makeAccessWorld(app);
  recipes = allRecipes(app, world);
});
afterAll(async () => {
  console.log(`access matrix: ${checked} cells over ${matrix.length} routes`);
  await app.close();
});

describe("the access matrix", () => {
  it("when the app's routes are listed, then the matrix names every one of them and no other", () => {
    const routes = apiRoutes(app.deps).map((spec) => `${spec.method.toUpperCase()} ${spec.path}`);
    const named = matrix.map(([route]) => route);
    expect(new Set(named).size, "a route is named twice in the matrix").toBe(named.length);
    expect([...named].sort()).toEqual([...routes].sort());
    expect(Object.keys(recipes).sort()).toEqual([...routes].sort());
  });
});

for (const [route, ...cells] of matrix) {
  describe(route, () => {
    callers.forEach((caller, index) => {
      const expected = cells[index]!;
      const outcome = expected === ok ? "it does its job" : `it answers ${expected}`;
      it(`when ${callerNames[caller]} calls it, then ${outcome}`, () => checkCell(route, caller, expected));
    });
  });
}
