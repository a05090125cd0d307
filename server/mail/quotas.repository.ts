import { and, asc, eq, gt, lt, sql } from "drizzle-orm";
import type { Database } from "../db/client";
import { mailQuotaUses } from "../db/schema/mail";

/**
 * Holds a scope's lock until the transaction ends, so two instances counting the same allowance at
 * once take turns (a transaction-level advisory lock: nothing to clean up, released on commit or rollback).
 */
export async function lockScope(tx: Pick<Database, "execute">, scope: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${scope}, 0))`);
}

/** The scope's sends since `since`, oldest first. */
export async function usesSince(db: Database, scope: string, since: Date) {
  return db
    .select({ mails: mailQuotaUses.mails, sentAt: mailQuotaUses.sentAt })
    .from(mailQuotaUses)
    .where(and(eq(mailQuotaUses.scope, scope), gt(mailQuotaUses.sentAt, since)))
    .orderBy(asc(mailQuotaUses.sentAt));
}

export async function recordUse(db: Database, scope: string, mails: number, sentAt: Date): Promise<void> {
  await db.insert(mailQuotaUses).values({ scope, mails, sentAt });
}

/** Forgets sends older than `before`. */
export async function deleteUsesBefore(db: Database, before: Date): Promise<number> {
  const rows = await db.delete(mailQuotaUses).where(lt(mailQuotaUses.sentAt, before)).returning({ id: mailQuotaUses.id });
  return rows.length;
}
