import type { Request } from "express";
import type { Me, SignUpInput } from "../../shared/auth/schemas";
import type { Database } from "../db/client";
import { insertChannelWithOwner, listMembershipsOf } from "../channels/channels.repository";
import { AppError } from "../http/app-error";
import { csrfTokenFor } from "../http/csrf";
import { decoyHash, hashPassword, passwordMatches } from "./password";
import { findUserWithHashByEmail, insertUser } from "./users.repository";

export async function checkCredentials(db: Database, email: string, password: string): Promise<Express.User | null> {
  const found = await findUserWithHashByEmail(db, email);
  const ok = await passwordMatches(found?.passwordHash ?? decoyHash, password);
  if (!found || !ok) return null;
  const { passwordHash: _hash, ...user } = found;
  return user;
}

/** The account and its first channel, both or neither. */
export async function signUp(db: Database, input: SignUpInput): Promise<Express.User> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const user = await insertUser(tx, { email: input.email, name: input.name, passwordHash });
    if (!user) throw new AppError("conflict", "An account with that e-mail already exists.", { email: "An account with that e-mail already exists; sign in instead." });
    await insertChannelWithOwner(tx, input.channelName, user.id);
    return user;
  });
}

/** passport 0.6+ regenerates the session inside req.login, which is what defeats session fixation. */
export function startSession(req: Request, user: Express.User): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
}

export function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.logout((error) => (error ? reject(error) : resolve())));
}

export async function describeMe(db: Database, req: Request): Promise<Me> {
  const csrfToken = csrfTokenFor(req);
  if (!req.user) return { user: null, memberships: [], csrfToken };
  const memberships = await listMembershipsOf(db, req.user.id);
  return { user: req.user, memberships, csrfToken };
}
