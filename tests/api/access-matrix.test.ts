import { randomUUID } from "node:crypto";
import type request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../../server/app";
import { addMember, createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createInvitation, uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

const callers = ["visitor", "owner", "producer", "editor", "crew", "outsider"] as const;
type Caller = (typeof callers)[number];

/** "ok": the route does its job; 401 signed out; 403 the role may not; 404 not a member of this channel. */
type Cell = "ok" | 401 | 403 | 404;
const ok = "ok";

/*
 * Who may call what: the spec's "People and roles" table (members, invitations and channel settings:
 * owner W, producer R, editor and crew nothing; episodes: everyone reads), written out by hand per
 * route, deliberately not computed from shared/access/roles.ts, so a wrong grant there fails here.
 * "outsider" is the owner of another channel: it must learn nothing of this one (404, not 403).
 */
const matrix: [route: string, visitor: Cell, owner: Cell, producer: Cell, editor: Cell, crew: Cell, outsider: Cell][] = [
  // route                                                      visitor owner producer editor crew outsider
  ["GET /api/health",                                            ok,   ok,   ok,   ok,   ok,   ok],
  ["GET /api/auth/me",                                           ok,   ok,   ok,   ok,   ok,   ok],
  ["POST /api/auth/sign-in",                                     ok,   ok,   ok,   ok,   ok,   ok],
  ["POST /api/auth/sign-up",                                     ok,   ok,   ok,   ok,   ok,   ok],
  ["POST /api/auth/sign-out",                                    401,  ok,   ok,   ok,   ok,   ok],
  ["POST /api/channels",                                         401,  ok,   ok,   ok,   ok,   ok],
  ["GET /api/channels/:channelId/members",                       401,  ok,   ok,   403,  403,  404],
  ["POST /api/channels/:channelId/invitations",                  401,  ok,   403,  403,  403,  404],
  ["DELETE /api/channels/:channelId/invitations/:invitationId",  401,  ok,   403,  403,  403,  404],
  ["PATCH /api/channels/:channelId/members/:userId",             401,  ok,   403,  403,  403,  404],
  ["DELETE /api/channels/:channelId/members/:userId",            401,  ok,   403,  403,  403,  404],
  ["GET /api/invitations/:token",                                ok,   ok,   ok,   ok,   ok,   ok],
  ["POST /api/invitations/:token/accept",                        ok,   ok,   ok,   ok,   ok,   ok],
  ["GET /api/channels/:channelId/episodes",                      401,  ok,   ok,   ok,   ok,   404],
  ["GET /api/channels/:channelId/episodes/:episodeId",           401,  ok,   ok,   ok,   ok,   404],
];

const callerNames: Record<Caller, string> = {
  visitor: "a signed-out visitor",
  owner: "the owner",
  producer: "the producer",
  editor: "the editor",
  crew: "a crew member",
  outsider: "a member of another channel",
};
const errorCodes = { 401: "unauthenticated", 403: "forbidden", 404: "not_found" } as const;

type Person = Awaited<ReturnType<typeof createUser>>;

let app: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;
let checked = 0;

/** The channel every cell aims at, one account per role, and someone from elsewhere. */
async function makeWorld() {
  const crewed = await createCrewedChannel(app.db, "Matrix Channel");
  const outsider = await createUser(app.db, { name: "Ozzy Outsider" });
  await createChannel(app.db, outsider, "Elsewhere");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Matrix episode" });
  const readableInvitation = await createInvitation(app.db, { channelId: crewed.channel.id, invitedBy: crewed.owner });
  const { owner, producer, editor, crew } = crewed;
  const people: Record<Exclude<Caller, "visitor">, Person> = { owner, producer, editor, crew, outsider };
  return { channel: crewed.channel, owner: crewed.owner, people, episode, readableInvitation };
}

interface Call {
  caller: Caller;
  /** The signed-in caller's account; null for the visitor. */
  person: Person | null;
}

interface Prepared {
  /** Path parameters besides :channelId, which is always the matrix channel. */
  params?: Record<string, string>;
  body?: object;
  /** Run after a refusal: the refused write left its rows as they were. */
  intact?: () => Promise<void>;
}

interface Recipe {
  /** The status when the caller is let through. */
  ok: number;
  /** Fresh rows for this one call, so no cell depends on another's. */
  prepare?: (call: Call) => Promise<Prepared>;
}

async function freshCrewMember() {
  const member = await createUser(app.db, { name: "Fresh Crew" });
  await addMember(app.db, world.channel.id, member, "crew");
  return member;
}

async function roleOf(userId: string): Promise<string | null> {
  const result = await app.database.pool.query<{ role: string }>("select role from memberships where channel_id = $1 and user_id = $2", [
    world.channel.id,
    userId,
  ]);
  return result.rows[0]?.role ?? null;
}

const recipes: Record<string, Recipe> = {
  "GET /api/health": { ok: 200 },
  "GET /api/auth/me": { ok: 200 },
  "POST /api/auth/sign-in": {
    ok: 200,
    prepare: async ({ person }) => {
      const who = person ?? (await createUser(app.db));
      return { body: { email: who.email, password: who.password } };
    },
  },
  "POST /api/auth/sign-up": {
    ok: 201,
    prepare: async () => ({ body: { name: "New Host", email: uniqueEmail("matrix-signup"), password: "a-long-enough-password", channelName: "New Rig" } }),
  },
  "POST /api/auth/sign-out": { ok: 200 },
  "POST /api/channels": {
    ok: 201,
    prepare: async () => {
      const name = `Side ${randomUUID().slice(0, 8)}`;
      return {
        body: { name },
        intact: async () => expect((await app.database.pool.query("select 1 from channels where name = $1", [name])).rowCount).toBe(0),
      };
    },
  },
  "GET /api/channels/:channelId/members": { ok: 200 },
  "POST /api/channels/:channelId/invitations": {
    ok: 201,
    prepare: async () => {
      const email = uniqueEmail("matrix-invite");
      return {
        body: { email, role: "crew" },
        intact: async () => expect((await app.database.pool.query("select 1 from invitations where email = $1", [email])).rowCount).toBe(0),
      };
    },
  },
  "DELETE /api/channels/:channelId/invitations/:invitationId": {
    ok: 204,
    prepare: async () => {
      const invitation = await createInvitation(app.db, { channelId: world.channel.id, invitedBy: world.owner });
      return {
        params: { invitationId: invitation.id },
        intact: async () => {
          const row = await app.database.pool.query("select revoked_at from invitations where id = $1", [invitation.id]);
          expect(row.rows).toEqual([{ revoked_at: null }]);
        },
      };
    },
  },
  "PATCH /api/channels/:channelId/members/:userId": {
    ok: 200,
    prepare: async () => {
      const member = await freshCrewMember();
      return { params: { userId: member.id }, body: { role: "editor" }, intact: async () => expect(await roleOf(member.id)).toBe("crew") };
    },
  },
  "DELETE /api/channels/:channelId/members/:userId": {
    ok: 204,
    prepare: async () => {
      const member = await freshCrewMember();
      return { params: { userId: member.id }, intact: async () => expect(await roleOf(member.id)).toBe("crew") };
    },
  },
  "GET /api/invitations/:token": {
    ok: 200,
    prepare: async () => ({ params: { token: world.readableInvitation.token } }),
  },
  "POST /api/invitations/:token/accept": {
    ok: 200,
    // An invitation into a channel of its own, which no caller belongs to yet.
    prepare: async ({ person }) => {
      const host = await createUser(app.db, { name: "Other Host" });
      const side = await createChannel(app.db, host, "Side Channel");
      const invitation = await createInvitation(app.db, { channelId: side.id, invitedBy: host, email: person?.email });
      return { params: { token: invitation.token }, body: person ? {} : { name: "Nia Newcomer", password: "a-long-enough-password" } };
    },
  },
  "GET /api/channels/:channelId/episodes": { ok: 200 },
  "GET /api/channels/:channelId/episodes/:episodeId": {
    ok: 200,
    prepare: async () => ({ params: { episodeId: world.episode.id } }),
  },
};

function fill(template: string, params: Record<string, string>): string {
  return template.replace(/:(\w+)/g, (_match, name: string) => {
    const value = params[name];
    if (value === undefined) throw new Error(`no value for :${name} in ${template}`);
    return encodeURIComponent(value);
  });
}

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
  const path = fill(template, { channelId: world.channel.id, ...prepared.params });
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
  world = await makeWorld();
});
afterAll(async () => {
  console.log(`access matrix: ${checked} cells`);
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
