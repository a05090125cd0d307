import { and, desc, eq, gt, isNull, ne, sql } from "drizzle-orm";
import type { MailTopic } from "../../shared/auth/account";
import type { Queryable } from "../db/client";
import { emailVerifications, passwordResets, users } from "../db/schema/accounts";

const settingsColumns = {
  id: users.id,
  name: users.name,
  email: users.email,
  emailVerified: sql<boolean>`${users.emailVerifiedAt} is not null`.as("email_verified"),
  timeZone: users.timeZone,
  mailOptOuts: users.mailOptOuts,
  version: users.version,
};

/** The account's settings, with the newest address change still waiting for its link. */
export async function findAccountSettings(db: Queryable, userId: string) {
  const [row] = await db.select(settingsColumns).from(users).where(eq(users.id, userId));
  if (!row) return null;
  const [pending] = await db
    .select({ email: emailVerifications.email })
    .from(emailVerifications)
    .where(
      and(
        eq(emailVerifications.userId, userId),
        eq(emailVerifications.changesAddress, true),
        isNull(emailVerifications.usedAt),
        gt(emailVerifications.expiresAt, sql`now()`),
        ne(emailVerifications.email, row.email),
      ),
    )
    .orderBy(desc(emailVerifications.createdAt))
    .limit(1);
  return { ...row, mailOptOuts: row.mailOptOuts as MailTopic[], pendingEmail: pending?.email ?? null };
}

/** Saves the profile if the account is still at `version`; false when someone moved it on. */
export async function updateProfile(db: Queryable, userId: string, version: number, values: { name: string; timeZone: string; mailOptOuts: MailTopic[] }): Promise<boolean> {
  const rows = await db
    .update(users)
    .set({ ...values, version: sql`${users.version} + 1` })
    .where(and(eq(users.id, userId), eq(users.version, version)))
    .returning({ id: users.id });
  return rows.length > 0;
}

export async function findPasswordHash(db: Queryable, userId: string): Promise<string | null> {
  const [row] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, userId));
  return row?.passwordHash ?? null;
}

/** A new password ends every link that could set another one. */
export async function setPasswordHash(db: Queryable, userId: string, passwordHash: string): Promise<void> {
  await db.update(users).set({ passwordHash }).where(eq(users.id, userId));
  await db.update(passwordResets).set({ usedAt: sql`now()` }).where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

export async function findUserIdByEmail(db: Queryable, email: string) {
  const [row] = await db.select({ id: users.id, name: users.name, email: users.email, timeZone: users.timeZone }).from(users).where(eq(users.email, email));
  return row ?? null;
}

export async function emailTaken(db: Queryable, email: string): Promise<boolean> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return Boolean(row);
}
