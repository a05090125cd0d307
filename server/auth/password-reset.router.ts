import { passwordResetRequestSchema, passwordResetSchema } from "../../shared/auth/account";
import { publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { describeMe } from "./auth.service";
import { requestPasswordReset, resetPassword } from "./password-reset.service";
import { passwordResetRateLimit, resetLinkRateLimit, type SignInLimits } from "./rate-limits";
import type { VerificationDeps } from "./verification.service";

/** "Forgot password": a mailed link, then a new password that signs the account out everywhere. */
export function passwordResetRoutes(deps: VerificationDeps, limits: SignInLimits): RouteSpec[] {
  return [
    {
      method: "post",
      path: "/api/auth/password-reset",
      access: publicAccess,
      before: [passwordResetRateLimit(deps.db, limits)],
      handler: async (req, res) => {
        const { email } = parseBody(passwordResetRequestSchema, req.body);
        res.status(202).json(await requestPasswordReset(deps, email));
      },
    },
    {
      method: "post",
      path: "/api/auth/password-reset/complete",
      access: publicAccess,
      before: [resetLinkRateLimit(deps.db, limits)],
      handler: async (req, res) => {
        const input = parseBody(passwordResetSchema, req.body);
        await resetPassword(deps, req, input);
        res.json(await describeMe(deps.db, req));
      },
    },
  ];
}
