import { randomUUID } from "node:crypto";
import { expect } from "vitest";
import { addMember, createChannel, createUser } from "../../factories/accounts";
import { createInvitation, createVerification, uniqueEmail } from "../../factories/invitations";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * Accounts, channels, members and invitations: owner W, producer R, editor and crew nothing (the
 * spec's "members, invitations, channel settings" row); episodes: everyone reads.
 * "outsider" is the owner of another channel: it must learn nothing of this one (404, not 403).
 */
export const access: FeatureAccess = {
  rows: [
    // route                                                      visitor owner producer editor crew outsider
    ["GET /api/health",                                            ok,   ok,   ok,   ok,   ok,   ok],
    ["GET /api/auth/me",                                           ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/auth/sign-in",                                     ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/auth/sign-up",                                     ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/auth/sign-out",                                    401,  ok,   ok,   ok,   ok,   ok],
    ["POST /api/auth/verify-email",                                ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/auth/verification-mail",                           401,  ok,   ok,   ok,   ok,   ok],
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
  ],
  recipes: foundationRecipes,
};

function foundationRecipes({ app, world }: AccessContext): Record<string, Recipe> {
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

  const readableInvitation = createInvitation(app.db, { channelId: world.channel.id, invitedBy: world.owner });

  return {
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
    "POST /api/auth/verify-email": {
      ok: 200,
      // A fresh account's own link: anyone holding it may open it, signed in or not.
      prepare: async () => {
        const fresh = await createUser(app.db, { verified: false });
        return { body: { token: await createVerification(app.db, fresh) } };
      },
    },
    "POST /api/auth/verification-mail": { ok: 200 },
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
      prepare: async () => ({ params: { token: (await readableInvitation).token } }),
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
}
