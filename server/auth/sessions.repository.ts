import { and, asc, eq, gt, ne, sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { sessions } from "../db/schema/accounts";

/** The account's sessions that have not expired (PostgreSQL computes `user_id` from the session's data). */
export async function listSessionsOf(db: Queryable, userId: string) {
  return db
    // `expire` is a timestamp without zone written in the database session's zone: read back through it, as epoch seconds.
    .select({ sid: sessions.sid, sess: sessions.sess, expireEpoch: sql<string>`extract(epoch from ${sessions.expire}::timestamptz)` })
    .from(sessions)
    .where(and(eq(sessions.userId, userId), gt(sessions.expire, sql`now()`)))
    .orderBy(asc(sessions.sid));
}

/** Ends the account's sessions, all of them or all but `keepSid`; answers how many ended. */
export async function deleteSessionsOf(db: Queryable, userId: string, keepSid?: string): Promise<number> {
  const rows = await db
    .delete(sessions)
    .where(keepSid ? and(eq(sessions.userId, userId), ne(sessions.sid, keepSid)) : eq(sessions.userId, userId))
    .returning({ sid: sessions.sid });
  return rows.length;
}
