import { expect } from "vitest";
import { createUser } from "../../factories/accounts";
import { createPasswordReset, uniqueEmail } from "../../factories/invitations";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * A person's own account: any signed-in person reaches their own, and nobody else's (no route names
 * another account). "Forgot password" and its link are for signed-out visitors, so anyone may call them.
 */
export const access: FeatureAccess = {
  rows: [
    // route                                                      visitor owner producer editor crew outsider
    ["POST /api/auth/password-reset",                              ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/auth/password-reset/complete",                     ok,   ok,   ok,   ok,   ok,   ok],
    ["GET /api/account",                                           401,  ok,   ok,   ok,   ok,   ok],
    ["PUT /api/account",                                           401,  ok,   ok,   ok,   ok,   ok],
    ["POST /api/account/email",                                    401,  ok,   ok,   ok,   ok,   ok],
    ["POST /api/account/password",                                 401,  ok,   ok,   ok,   ok,   ok],
    ["GET /api/account/sessions",                                  401,  ok,   ok,   ok,   ok,   ok],
    ["POST /api/account/sessions/sign-out-others",                 401,  ok,   ok,   ok,   ok,   ok],
  ],
  recipes: accountRecipes,
};

function accountRecipes({ app }: AccessContext): Record<string, Recipe> {
  const versionOf = async (userId: string) => (await app.database.pool.query<{ version: number }>("select version from users where id = $1", [userId])).rows[0]!.version;
  return {
    "POST /api/auth/password-reset": { ok: 202, prepare: async () => ({ body: { email: uniqueEmail("matrix-reset") } }) },
    "POST /api/auth/password-reset/complete": {
      ok: 200,
      // A fresh account's own link: whoever holds it may use it, signed in or not.
      prepare: async () => {
        const fresh = await createUser(app.db);
        return { body: { token: await createPasswordReset(app.db, fresh), password: fresh.password } };
      },
    },
    "GET /api/account": { ok: 200 },
    "PUT /api/account": {
      ok: 200,
      prepare: async ({ person }) => {
        const name = "Renamed By Matrix";
        const version = person ? await versionOf(person.id) : 1;
        return {
          body: { version, name, timeZone: "Europe/Lisbon", mailOptOuts: [] },
          intact: async () => expect((await app.database.pool.query("select 1 from users where name = $1", [name])).rowCount).toBe(0),
        };
      },
    },
    "POST /api/account/email": {
      ok: 202,
      prepare: async ({ person }) => ({ body: { email: uniqueEmail("matrix-move"), currentPassword: person?.password ?? "anything" } }),
    },
    // The same password again: the matrix signs the same people in for every cell.
    "POST /api/account/password": {
      ok: 200,
      prepare: async ({ person }) => ({ body: { currentPassword: person?.password ?? "anything", newPassword: person?.password ?? "anything-long-enough" } }),
    },
    "GET /api/account/sessions": { ok: 200 },
    "POST /api/account/sessions/sign-out-others": { ok: 200 },
  };
}
