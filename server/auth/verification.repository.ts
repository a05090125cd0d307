import { and, eq, isNull, lt, ne, sql } from "drizzle-orm";
import type { Database } from "../db/client";
import { emailVerifications, users } from "../db/schema/accounts";

export async function insertVerification(db: Database, values: { userId: string; email: string; tokenHash: string; expiresAt: Date }) {
  await db.insert(emailVerifications).values(values);
}

export async function findVerificationByHash(db: Database, tokenHash: string) {
  const [row] = await db
    .select({
      id: emailVerifications.id,
      userId: emailVerifications.userId,
      email: emailVerifications.email,
      changesAddress: emailVerifications.changesAddress,
      expiresAt: emailVerifications.expiresAt,
      usedAt: emailVerifications.usedAt,
      currentEmail: users.email,
      verifiedAt: users.emailVerifiedAt,
    })
    .from(emailVerifications)
    .innerJoin(users, eq(users.id, emailVerifications.userId))
    .where(eq(emailVerifications.tokenHash, tokenHash));
  return row ?? null;
}

/** Marks a link used; false when it already was (two clicks at once: one wins). */
export async function claimVerification(db: Database, id: string): Promise<boolean> {
  const rows = await db
    .update(emailVerifications)
    .set({ usedAt: sql`now()` })
    .where(and(eq(emailVerifications.id, id), isNull(emailVerifications.usedAt), sql`${emailVerifications.expiresAt} > now()`))
    .returning({ id: emailVerifications.id });
  return rows.length > 0;
}

/** The account a confirmation mail goes to, read when the mail is sent. */
export async function findAccountToVerify(db: Database, userId: string) {
  const [row] = await db.select({ email: users.email, name: users.name, verifiedAt: users.emailVerifiedAt, timeZone: users.timeZone }).from(users).where(eq(users.id, userId));
  return row ?? null;
}

/** Forgets an account's links that have expired, used or not. */
export async function deleteExpiredVerifications(db: Database, userId: string): Promise<void> {
  await db.delete(emailVerifications).where(and(eq(emailVerifications.userId, userId), lt(emailVerifications.expiresAt, sql`now()`)));
}

/** A new address-change link ends the account's earlier ones that were not used. */
export async function replaceAddressChangeLink(db: Database, values: { userId: string; email: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db
    .delete(emailVerifications)
    .where(and(eq(emailVerifications.userId, values.userId), eq(emailVerifications.changesAddress, true), isNull(emailVerifications.usedAt)));
  await db.insert(emailVerifications).values({ ...values, changesAddress: true });
}

/**
 * Moves the account to an address it has just proven it holds, confirmed; false when another account
 * has it. The account's other open links (for its old address or another new one) stop working.
 */
export async function moveToAddress(db: Database, userId: string, email: string): Promise<boolean> {
  const taken = await db.select({ id: users.id }).from(users).where(and(eq(users.email, email), ne(users.id, userId)));
  if (taken.length > 0) return false;
  const moved = await db
    .update(users)
    .set({ email, emailVerifiedAt: sql`now()` })
    .where(eq(users.id, userId))
    .returning({ id: users.id })
    .catch((error: { code?: string }) => {
      if (error.code === "23505") return [];
      throw error;
    });
  if (moved.length === 0) return false;
  await db.update(emailVerifications).set({ usedAt: sql`now()` }).where(and(eq(emailVerifications.userId, userId), isNull(emailVerifications.usedAt)));
  return true;
}
