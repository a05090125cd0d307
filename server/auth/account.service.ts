import { createHash } from "node:crypto";
import type { Request } from "express";
import type { AccountSessions, AccountSettings, EmailChangeAnswer, EmailChangeInput, PasswordChangeInput, ProfileInput, SignedOutAnswer } from "../../shared/auth/account";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError, staleSave } from "../http/app-error";
import { SESSION_MAX_AGE_MS } from "../http/session";
import { takeMailQuota } from "../mail/quotas";
import { findAccountSettings, findPasswordHash, setPasswordHash, updateProfile } from "./account.repository";
import { hashPassword, passwordMatches } from "./password";
import { deleteSessionsOf, listSessionsOf } from "./sessions.repository";
import { queueAddressChangeMail, type VerificationDeps } from "./verification.service";

export async function accountSettings(db: Database, userId: string): Promise<AccountSettings> {
  const account = await findAccountSettings(db, userId);
  if (!account) throw new AppError("unauthenticated", "Sign in to continue.");
  return account;
}

/** Name, time zone and mail topics, against the version the form opened with. */
export async function changeProfile(db: Database, req: Request, userId: string, input: ProfileInput): Promise<AccountSettings> {
  const { version, ...values } = input;
  return inTransaction(db, async (tx) => {
    const saved = await updateProfile(tx, userId, version, values);
    const account = await findAccountSettings(tx, userId);
    if (!account) throw new AppError("unauthenticated", "Sign in to continue.");
    if (!saved) throw staleSave("account", account);
    // The session's copy of the account was read before this request changed it.
    if (req.user) Object.assign(req.user, { name: account.name, timeZone: account.timeZone });
    return account;
  });
}

const wrongPassword = () => new AppError("validation_failed", "That is not your current password.", { currentPassword: "That is not your current password." });

async function checkCurrentPassword(db: Database, userId: string, password: string): Promise<void> {
  const hash = await findPasswordHash(db, userId);
  if (!hash || !(await passwordMatches(hash, password))) throw wrongPassword();
}

/** A new address takes effect only once the link mailed to it is opened; until then the account keeps its own. */
export async function requestEmailChange(deps: VerificationDeps, user: Express.User, input: EmailChangeInput): Promise<EmailChangeAnswer> {
  await checkCurrentPassword(deps.db, user.id, input.currentPassword);
  if (input.email === user.email) throw new AppError("validation_failed", "That is already your address.", { email: "That is already your address." });
  await inTransaction(deps.db, async (tx, sql) => {
    await takeMailQuota(tx, "verification", { userId: user.id });
    await queueAddressChangeMail(deps, sql, user.id, input.email);
  });
  return { pendingEmail: input.email };
}

/** A new password, with the current one; every other session of the account ends, this one stays. */
export async function changePassword(db: Database, req: Request, userId: string, input: PasswordChangeInput): Promise<SignedOutAnswer> {
  await checkCurrentPassword(db, userId, input.currentPassword);
  const passwordHash = await hashPassword(input.newPassword);
  const signedOut = await inTransaction(db, async (tx) => {
    await setPasswordHash(tx, userId, passwordHash);
    return deleteSessionsOf(tx, userId, req.sessionID);
  });
  return { signedOut };
}

/** The list's handle for a session: not its id, which is the secret the cookie carries. */
const sessionKey = (sid: string) => createHash("sha256").update(sid).digest("base64url").slice(0, 16);

interface StoredSession {
  startedAt?: unknown;
  device?: unknown;
}

export async function accountSessions(db: Database, req: Request, userId: string): Promise<AccountSessions> {
  const rows = await listSessionsOf(db, userId);
  const sessions = rows.map((row) => {
    const stored = row.sess as StoredSession;
    const current = row.sid === req.sessionID;
    return {
      key: sessionKey(row.sid),
      startedAt: typeof stored.startedAt === "string" ? stored.startedAt : null,
      // The store moves `expire` on at most every ten minutes; this request is seen now.
      lastSeenAt: current ? new Date().toISOString() : new Date(Number(row.expireEpoch) * 1000 - SESSION_MAX_AGE_MS).toISOString(),
      device: typeof stored.device === "string" ? stored.device : "Unknown browser",
      current,
    };
  });
  sessions.sort((a, b) => Number(b.current) - Number(a.current) || b.lastSeenAt.localeCompare(a.lastSeenAt));
  return { sessions };
}

export async function signOutOtherSessions(db: Database, req: Request, userId: string): Promise<SignedOutAnswer> {
  return { signedOut: await deleteSessionsOf(db, userId, req.sessionID) };
}
