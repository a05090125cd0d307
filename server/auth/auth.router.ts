import { signInSchema, signUpSchema } from "../../shared/auth/schemas";
import { AppError } from "../http/app-error";
import { anyAccount, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { checkCredentials, describeMe, endSession, signUp, startSession } from "./auth.service";
import { signInRateLimits, signUpRateLimit, type SignInLimits } from "./rate-limits";
import type { VerificationDeps } from "./verification.service";
import type { ChannelStarters } from "../seams/channel-starters";

export function authRoutes(deps: VerificationDeps & ChannelStarters, limits: SignInLimits): RouteSpec[] {
  const { db } = deps;
  return [
    {
      method: "get",
      path: "/api/auth/me",
      access: publicAccess,
      handler: async (req, res) => res.json(await describeMe(db, req)),
    },
    {
      method: "post",
      path: "/api/auth/sign-in",
      access: publicAccess,
      before: signInRateLimits(db, limits),
      handler: async (req, res) => {
        const input = parseBody(signInSchema, req.body);
        const user = await checkCredentials(db, input.email, input.password);
        if (!user) throw new AppError("unauthenticated", "That e-mail and password don't match an account.");
        await startSession(req, user);
        res.json(await describeMe(db, req));
      },
    },
    {
      method: "post",
      path: "/api/auth/sign-up",
      access: publicAccess,
      before: [signUpRateLimit(db, limits)],
      handler: async (req, res) => {
        const input = parseBody(signUpSchema, req.body);
        const user = await signUp(deps, input);
        await startSession(req, user);
        res.status(201).json(await describeMe(db, req));
      },
    },
    {
      method: "post",
      path: "/api/auth/sign-out",
      access: anyAccount,
      body: "none",
      handler: async (req, res) => {
        await endSession(req);
        res.json(await describeMe(db, req));
      },
    },
  ];
}
