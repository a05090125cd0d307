import { verifyEmailSchema, type VerifyEmailAnswer } from "../../shared/auth/schemas";
import { signedInUser } from "../http/guards";
import { anyAccount, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { describeMe } from "./auth.service";
import { resendVerification, verifyEmail, type VerificationDeps } from "./verification.service";

/** Confirming an account's address: the link's page posts its token here; a signed-in person may ask for another mail. */
export function verificationRoutes(deps: VerificationDeps): RouteSpec[] {
  return [
    {
      method: "post",
      path: "/api/auth/verify-email",
      access: publicAccess,
      handler: async (req, res) => {
        const { token } = parseBody(verifyEmailSchema, req.body);
        const { confirmed } = await verifyEmail(deps, req, token);
        res.json({ confirmed, me: await describeMe(deps.db, req) } satisfies VerifyEmailAnswer);
      },
    },
    {
      method: "post",
      path: "/api/auth/verification-mail",
      access: anyAccount,
      body: "none",
      handler: async (req, res) => res.json(await resendVerification(deps, signedInUser(req))),
    },
  ];
}
