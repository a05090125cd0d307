import type { Request } from "express";
import type { Me, SignUpInput } from "../../shared/auth/schemas";
import type { Database } from "../db/client";
import type { ChannelStarters } from "../seams/channel-starters";
import { addChannelWithOwner, listMembershipsOf } from "../channels/channels.repository";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import { csrfTokenFor } from "../http/csrf";
import { SESSION_COOKIE } from "../http/session";
import { describeDevice } from "./devices";
import { decoyHash, hashPassword, passwordMatches } from "./password";
import { findUserWithHashByEmail, insertUser } from "./users.repository";
import { queueVerificationMail, type VerificationDeps } from "./verification.service";

export async function checkCredentials(db: Database, email: string, password: string): Promise<Express.User | null> {
  const found = await findUserWithHashByEmail(db, email);
  const ok = await passwordMatches(found?.passwordHash ?? decoyHash, password);
  if (!found || !ok) return null;
  const { passwordHash: _hash, ...user } = found;
  return user;
}

/** The account, its first channel and the mail that confirms its address: all three, or none. */
export async function signUp(deps: VerificationDeps & ChannelStarters, input: SignUpInput): Promise<Express.User> {
  const passwordHash = await hashPassword(input.password);
  return inTransaction(deps.db, async (tx, sql) => {
    const user = await insertUser(tx, { email: input.email, name: input.name, passwordHash, ...(input.timeZone ? { timeZone: input.timeZone } : {}) });
    if (!user) throw new AppError("conflict", "An account with that e-mail already exists.", { email: "An account with that e-mail already exists; sign in instead." });
    await addChannelWithOwner(tx, input.channelName, user.id, deps.channelStarters);
    await queueVerificationMail(deps, tx, sql, user.id);
    return user;
  });
}

/**
 * passport 0.6+ regenerates the session inside req.login, which is what defeats session fixation.
 * The new session notes when it started and from what, for the account's list of sessions.
 */
export async function startSession(req: Request, user: Express.User): Promise<void> {
  await new Promise<void>((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
  req.session.startedAt = new Date().toISOString();
  req.session.device = describeDevice(req.get("user-agent"));
}

/**
 * passport's logout clears the user and regenerates the session; the fresh, empty session it leaves
 * would then be stored for fourteen days. A signed-out visitor keeps nothing: it goes too.
 */
export async function endSession(req: Request): Promise<void> {
  await new Promise<void>((resolve, reject) => req.logout((error) => (error ? reject(error) : resolve())));
  await new Promise<void>((resolve, reject) => req.session.destroy((error) => (error ? reject(error) : resolve())));
  req.res?.clearCookie(SESSION_COOKIE, { path: "/" });
}

export async function describeMe(db: Database, req: Request): Promise<Me> {
  const csrfToken = csrfTokenFor(req);
  if (!req.user) return { user: null, memberships: [], csrfToken };
  const memberships = await listMembershipsOf(db, req.user.id);
  return { user: req.user, memberships, csrfToken };
}
