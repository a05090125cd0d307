import { and, eq, isNull, lt, sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { passwordResets } from "../db/schema/accounts";

/** A new link ends the account's earlier ones (only the newest mail works) and forgets those expired. */
export async function replaceResetLink(db: Queryable, values: { userId: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.delete(passwordResets).where(and(eq(passwordResets.userId, values.userId), lt(passwordResets.expiresAt, sql`now()`)));
  await db.update(passwordResets).set({ usedAt: sql`now()` }).where(and(eq(passwordResets.userId, values.userId), isNull(passwordResets.usedAt)));
  await db.insert(passwordResets).values(values);
}

export async function findResetLink(db: Queryable, tokenHash: string) {
  const [row] = await db
    .select({ id: passwordResets.id, userId: passwordResets.userId, expiresAt: passwordResets.expiresAt, usedAt: passwordResets.usedAt })
    .from(passwordResets)
    .where(eq(passwordResets.tokenHash, tokenHash));
  return row ?? null;
}

/** Marks a link used; false when it already was, or has expired (two tabs at once: one wins). */
export async function claimResetLink(db: Queryable, id: string): Promise<boolean> {
  const rows = await db
    .update(passwordResets)
    .set({ usedAt: sql`now()` })
    .where(and(eq(passwordResets.id, id), isNull(passwordResets.usedAt), sql`${passwordResets.expiresAt} > now()`))
    .returning({ id: passwordResets.id });
  return rows.length > 0;
}
