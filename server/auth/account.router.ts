import { emailChangeSchema, passwordChangeSchema, profileSchema } from "../../shared/auth/account";
import { signedInUser } from "../http/guards";
import { anyAccount, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { accountSessions, accountSettings, changePassword, changeProfile, requestEmailChange, signOutOtherSessions } from "./account.service";
import { currentPasswordRateLimit, type SignInLimits } from "./rate-limits";
import type { VerificationDeps } from "./verification.service";

/** The signed-in person's own account: settings, address, password and sessions. */
export function accountRoutes(deps: VerificationDeps, limits: SignInLimits): RouteSpec[] {
  const { db } = deps;
  return [
    {
      method: "get",
      path: "/api/account",
      access: anyAccount,
      handler: async (req, res) => res.json({ account: await accountSettings(db, signedInUser(req).id) }),
    },
    {
      method: "put",
      path: "/api/account",
      access: anyAccount,
      handler: async (req, res) => {
        const input = parseBody(profileSchema, req.body);
        res.json({ account: await changeProfile(db, req, signedInUser(req).id, input) });
      },
    },
    {
      method: "post",
      path: "/api/account/email",
      access: anyAccount,
      before: [currentPasswordRateLimit(db, limits, "email")],
      handler: async (req, res) => {
        const input = parseBody(emailChangeSchema, req.body);
        res.status(202).json(await requestEmailChange(deps, signedInUser(req), input));
      },
    },
    {
      method: "post",
      path: "/api/account/password",
      access: anyAccount,
      before: [currentPasswordRateLimit(db, limits, "password")],
      handler: async (req, res) => {
        const input = parseBody(passwordChangeSchema, req.body);
        res.json(await changePassword(db, req, signedInUser(req).id, input));
      },
    },
    {
      method: "get",
      path: "/api/account/sessions",
      access: anyAccount,
      handler: async (req, res) => res.json(await accountSessions(db, req, signedInUser(req).id)),
    },
    {
      method: "post",
      path: "/api/account/sessions/sign-out-others",
      access: anyAccount,
      body: "none",
      handler: async (req, res) => res.json(await signOutOtherSessions(db, req, signedInUser(req).id)),
    },
  ];
}
