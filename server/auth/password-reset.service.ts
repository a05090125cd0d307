import { addHours } from "date-fns";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import type { Request } from "express";
import { PASSWORD_RESET_ANSWER, type PasswordResetInput, type PasswordResetRequestAnswer } from "../../shared/auth/account";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import { hashLinkToken, newLinkToken } from "../mail/link-tokens";
import { mailKind, type MailRenderers } from "../mail/mail-jobs";
import { takeMailQuota } from "../mail/quotas";
import { findUserIdByEmail, setPasswordHash } from "./account.repository";
import { endSession } from "./auth.service";
import { hashPassword } from "./password";
import { claimResetLink, findResetLink, replaceResetLink } from "./password-reset.repository";
import { deleteSessionsOf } from "./sessions.repository";
import type { VerificationDeps } from "./verification.service";

export const RESET_LIFETIME_HOURS = 1;

/**
 * A "set a new password" mail, queued under the address asked about. Whether an account has that
 * address is read when the mail is sent, not in the request, so the request does the same work and
 * gives the same answer either way (no account enumeration).
 */
const passwordResetMail = mailKind<{ email: string }>("password-reset");

export async function requestPasswordReset(deps: VerificationDeps, email: string): Promise<PasswordResetRequestAnswer> {
  await inTransaction(deps.db, async (tx, sql) => {
    await takeMailQuota(tx, "password_reset", { userId: email });
    await deps.jobs.enqueueMail(passwordResetMail.job({ email }, `reset:${email}`), { db: sql });
  });
  return { message: PASSWORD_RESET_ANSWER };
}

export function passwordResetMailRenderer(deps: Pick<VerificationDeps, "db" | "appUrl">): MailRenderers {
  return passwordResetMail.renderer(async ({ email }) => {
    const account = await findUserIdByEmail(deps.db, email);
    if (!account) return { skip: "no account has this address" };
    const { token, hash } = newLinkToken();
    const expiresAt = addHours(new Date(), RESET_LIFETIME_HOURS);
    await replaceResetLink(deps.db, { userId: account.id, tokenHash: hash, expiresAt });
    return {
      send: {
        to: account.email,
        subject: "Set a new password for Kerf",
        text: [
          `Hello ${account.name},`,
          "",
          "Someone (we hope you) asked to set a new password for your Kerf account. Open this link to choose one:",
          `${deps.appUrl}/new-password/${token}`,
          "",
          `It works once and expires in ${RESET_LIFETIME_HOURS} hour, at ${formatInstantNamingZone(expiresAt, account.timeZone)}. Setting the password signs you out everywhere, so you sign in again with the new one.`,
          "",
          "If you didn't ask for this, ignore this message: your password stays as it is.",
        ].join("\n"),
      },
    };
  });
}

const invalidLink = () => new AppError("not_found", "This link is not valid. Check that you copied all of it, or ask for a new one.");

/** Sets the password from a mailed link: once, within the hour; every session of the account ends, this one too. */
export async function resetPassword(deps: VerificationDeps, req: Request, input: PasswordResetInput): Promise<void> {
  const link = await findResetLink(deps.db, hashLinkToken(input.token));
  if (!link) throw invalidLink();
  if (link.usedAt) throw new AppError("gone", "This link has already been used, or a newer one was sent. Ask for a new one if you still need it.");
  if (link.expiresAt.getTime() <= Date.now()) throw new AppError("gone", "This link has expired. Ask for a new one.");
  const passwordHash = await hashPassword(input.password);
  const claimed = await inTransaction(deps.db, async (tx) => {
    if (!(await claimResetLink(tx, link.id))) return false;
    await setPasswordHash(tx, link.userId, passwordHash);
    await deleteSessionsOf(tx, link.userId);
    return true;
  });
  if (!claimed) throw new AppError("gone", "This link has already been used.");
  if (req.user?.id === link.userId) await endSession(req);
}
