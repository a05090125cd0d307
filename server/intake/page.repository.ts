import { and, eq, gt, isNull, sql } from "drizzle-orm";
import type { ColumnMapping } from "../../shared/intake/schemas";
import type { Queryable } from "../db/client";
import { channels } from "../db/schema/accounts";
import { intakeContacts, intakePageHits, intakePages } from "../db/schema/intake";

/** The channel's name and its page's settings (a channel that never set its page has it closed). */
export async function pageOf(db: Queryable, channelId: string) {
  const [row] = await db
    .select({ name: channels.name, open: intakePages.open, prompt: intakePages.prompt, mapping: intakePages.mapping })
    .from(channels)
    .leftJoin(intakePages, eq(intakePages.channelId, channels.id))
    .where(eq(channels.id, channelId));
  if (!row) return null;
  return { name: row.name, open: row.open ?? false, prompt: row.prompt ?? "", mapping: row.mapping ?? null };
}

export async function savePage(db: Queryable, channelId: string, values: { open?: boolean; prompt?: string; mapping?: ColumnMapping }) {
  await db
    .insert(intakePages)
    .values({ channelId, ...values })
    .onConflictDoUpdate({ target: intakePages.channelId, set: { ...values, updatedAt: new Date() } });
}

export async function lockScope(tx: Queryable, scope: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${scope}, 0))`);
}

export async function hitsSince(tx: Queryable, scope: string, since: Date): Promise<number> {
  const [row] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(intakePageHits)
    .where(and(eq(intakePageHits.scope, scope), gt(intakePageHits.at, since)));
  return row?.n ?? 0;
}

export async function recordHit(tx: Queryable, scope: string, at: Date): Promise<void> {
  await tx.insert(intakePageHits).values({ scope, at });
}

/** The channel's contact for this address, made if new; `made` says whether it is. */
export async function contactFor(tx: Queryable, channelId: string, email: string): Promise<{ id: string; made: boolean; confirmed: boolean }> {
  const inserted = await tx.insert(intakeContacts).values({ channelId, email }).onConflictDoNothing().returning({ id: intakeContacts.id });
  if (inserted[0]) return { id: inserted[0].id, made: true, confirmed: false };
  const [row] = await tx
    .select({ id: intakeContacts.id, confirmedAt: intakeContacts.confirmedAt, unsubscribedAt: intakeContacts.unsubscribedAt })
    .from(intakeContacts)
    .where(and(eq(intakeContacts.channelId, channelId), eq(intakeContacts.email, email)));
  // An address that unsubscribed and now ticks the box again asks for news again: it confirms anew.
  if (row!.unsubscribedAt) {
    await tx.update(intakeContacts).set({ unsubscribedAt: null, confirmedAt: null, confirmHash: null }).where(eq(intakeContacts.id, row!.id));
    return { id: row!.id, made: true, confirmed: false };
  }
  return { id: row!.id, made: false, confirmed: row!.confirmedAt !== null };
}

export async function contactToMail(db: Queryable, contactId: string) {
  const [row] = await db
    .select({ id: intakeContacts.id, email: intakeContacts.email, confirmedAt: intakeContacts.confirmedAt, unsubscribedAt: intakeContacts.unsubscribedAt, channelName: channels.name })
    .from(intakeContacts)
    .innerJoin(channels, eq(channels.id, intakeContacts.channelId))
    .where(eq(intakeContacts.id, contactId));
  return row ?? null;
}

export async function setConfirmHash(db: Queryable, contactId: string, hash: string): Promise<boolean> {
  const rows = await db
    .update(intakeContacts)
    .set({ confirmHash: hash })
    .where(and(eq(intakeContacts.id, contactId), isNull(intakeContacts.confirmedAt)))
    .returning({ id: intakeContacts.id });
  return rows.length > 0;
}

export async function confirmByHash(db: Queryable, hash: string): Promise<{ channelName: string } | null> {
  const rows = await db
    .update(intakeContacts)
    .set({ confirmedAt: new Date(), confirmHash: null })
    .where(eq(intakeContacts.confirmHash, hash))
    .returning({ channelId: intakeContacts.channelId });
  if (!rows[0]) return null;
  const page = await pageOf(db, rows[0].channelId);
  return { channelName: page?.name ?? "" };
}

export async function unsubscribe(db: Queryable, contactId: string): Promise<boolean> {
  const rows = await db.update(intakeContacts).set({ unsubscribedAt: new Date() }).where(eq(intakeContacts.id, contactId)).returning({ id: intakeContacts.id });
  return rows.length > 0;
}
