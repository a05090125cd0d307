import { addHours } from "date-fns";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import type { Request } from "express";
import type { VerificationMailAnswer } from "../../shared/auth/schemas";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import type { Jobs } from "../jobs/queue";
import { hashLinkToken, newLinkToken } from "../mail/link-tokens";
import { accountShare, mailKind, type MailRenderers } from "../mail/mail-jobs";
import { takeMailQuota } from "../mail/quotas";
import { markEmailVerified } from "./users.repository";
import { claimVerification, deleteExpiredVerifications, findAccountToVerify, findVerificationByHash, insertVerification, moveToAddress, replaceAddressChangeLink } from "./verification.repository";

export const VERIFICATION_LIFETIME_HOURS = 24;

export interface VerificationDeps {
  db: Database;
  appUrl: string;
  jobs: Pick<Jobs, "enqueueMail">;
}

/** A confirmation mail: its link is made when the mail is sent, so the queue never holds a usable one. */
const verificationMail = mailKind<{ userId: string }>("verification");
/** A link that moves the account to a new address, mailed to that address: the change happens when it is opened. */
const addressChangeMail = mailKind<{ userId: string; email: string }>("address-change");

type Executor = Parameters<Parameters<typeof inTransaction>[1]>[1];

/** Counts one confirmation mail against the account and queues it, inside the caller's transaction. */
export async function queueVerificationMail(deps: VerificationDeps, tx: Database, sql: Executor, userId: string): Promise<void> {
  await takeMailQuota(tx, "verification", { userId });
  await deps.jobs.enqueueMail(verificationMail.job({ userId }, accountShare(userId)), { db: sql });
}

export function verificationMailRenderer(deps: Pick<VerificationDeps, "db" | "appUrl">): MailRenderers {
  return verificationMail.renderer(async ({ userId }) => {
    const account = await findAccountToVerify(deps.db, userId);
    if (!account) return { skip: "the account was deleted" };
    if (account.verifiedAt) return { skip: "the address is already confirmed" };
    const { token, hash } = newLinkToken();
    await deleteExpiredVerifications(deps.db, userId);
    const expiresAt = addHours(new Date(), VERIFICATION_LIFETIME_HOURS);
    await insertVerification(deps.db, { userId, email: account.email, tokenHash: hash, expiresAt });
    return {
      send: {
        to: account.email,
        subject: "Confirm your address for Kerf",
        text: [
          `Hello ${account.name},`,
          "",
          "Open this link to confirm that this address is yours:",
          `${deps.appUrl}/verify/${token}`,
          "",
          `It works once and expires in ${VERIFICATION_LIFETIME_HOURS} hours, at ${formatInstantNamingZone(expiresAt, account.timeZone)}. Until the address is confirmed you can use Kerf, but it won't send invitations or review links for you.`,
          "",
          "If you didn't make a Kerf account, ignore this message.",
        ].join("\n"),
      },
    };
  });
}

/** Queues the mail to a new address inside the caller's transaction (which has counted it against the account). */
export async function queueAddressChangeMail(deps: VerificationDeps, sql: Executor, userId: string, email: string): Promise<void> {
  await deps.jobs.enqueueMail(addressChangeMail.job({ userId, email }, accountShare(userId)), { db: sql });
}

export function addressChangeMailRenderer(deps: Pick<VerificationDeps, "db" | "appUrl">): MailRenderers {
  return addressChangeMail.renderer(async ({ userId, email }) => {
    const account = await findAccountToVerify(deps.db, userId);
    if (!account) return { skip: "the account was deleted" };
    if (account.email === email) return { skip: "the account already uses this address" };
    const { token, hash } = newLinkToken();
    const expiresAt = addHours(new Date(), VERIFICATION_LIFETIME_HOURS);
    await replaceAddressChangeLink(deps.db, { userId, email, tokenHash: hash, expiresAt });
    return {
      send: {
        to: email,
        subject: "Confirm your new address for Kerf",
        text: [
          `Hello ${account.name},`,
          "",
          `You asked Kerf to use this address instead of ${account.email}. Open this link to make the change:`,
          `${deps.appUrl}/verify/${token}`,
          "",
          `It works once and expires in ${VERIFICATION_LIFETIME_HOURS} hours, at ${formatInstantNamingZone(expiresAt, account.timeZone)}. Until then Kerf keeps writing to ${account.email}, and you sign in with it.`,
          "",
          "If you didn't ask for this, ignore this message: nothing changes.",
        ].join("\n"),
      },
    };
  });
}

/** Another confirmation mail for the signed-in account, within its allowance. */
export async function resendVerification(deps: VerificationDeps, user: Express.User): Promise<VerificationMailAnswer> {
  if (user.emailVerified) return { sentTo: null };
  await inTransaction(deps.db, (tx, sql) => queueVerificationMail(deps, tx, sql, user.id));
  return { sentTo: user.email };
}

const invalidLink = () => new AppError("not_found", "This confirmation link is not valid. Check that you copied all of it, or send a new one from Kerf.");

/** Opens a confirmation link: once, before it expires, and only for the address it was mailed to. */
export async function verifyEmail(deps: VerificationDeps, req: Request, token: string): Promise<{ confirmed: string }> {
  const link = await findVerificationByHash(deps.db, hashLinkToken(token));
  if (!link) throw invalidLink();
  if (link.changesAddress) return changeAddress(deps, req, link);
  if (link.email !== link.currentEmail) throw new AppError("gone", "This link was for an address the account no longer uses.");
  if (link.usedAt) {
    if (link.verifiedAt) throw new AppError("gone", `This link has already been used: ${link.email} is confirmed.`);
    throw new AppError("gone", "This link has already been used. Sign in and send a new one.");
  }
  if (link.expiresAt.getTime() <= Date.now()) throw new AppError("gone", "This link has expired. Sign in and send a new one from the notice at the top of the page.");
  const claimed = await inTransaction(deps.db, async (tx) => {
    if (!(await claimVerification(tx, link.id))) return false;
    await markEmailVerified(tx, link.userId);
    return true;
  });
  if (!claimed) throw new AppError("gone", "This link has already been used.");
  // The session's copy of the account was read before this request confirmed it.
  if (req.user?.id === link.userId) req.user.emailVerified = true;
  return { confirmed: link.email };
}

type Link = NonNullable<Awaited<ReturnType<typeof findVerificationByHash>>>;

/** Opens a link to a new address: once, before it expires, while no other account has taken the address. */
async function changeAddress(deps: VerificationDeps, req: Request, link: Link): Promise<{ confirmed: string }> {
  if (link.usedAt) {
    if (link.currentEmail === link.email) throw new AppError("gone", `This link has already been used: your account now uses ${link.email}.`);
    throw new AppError("gone", "This link has already been used.");
  }
  if (link.expiresAt.getTime() <= Date.now()) throw new AppError("gone", "This link has expired. Ask for the change again on your account page.");
  const changed = await inTransaction(deps.db, async (tx) => {
    if (!(await claimVerification(tx, link.id))) return "used" as const;
    if (!(await moveToAddress(tx, link.userId, link.email))) return "taken" as const;
    return "changed" as const;
  });
  if (changed === "used") throw new AppError("gone", "This link has already been used.");
  if (changed === "taken") throw new AppError("conflict", `${link.email} now belongs to another Kerf account, so yours keeps ${link.currentEmail}.`);
  if (req.user?.id === link.userId) Object.assign(req.user, { email: link.email, emailVerified: true });
  return { confirmed: link.email };
}
