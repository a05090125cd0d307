import { and, eq, gte, sql } from "drizzle-orm";
import type { Role } from "../../shared/access/roles";
import type { Database } from "../db/client";
import { memberships, sessions, users } from "../db/schema/accounts";

const publicColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  timeZone: users.timeZone,
  emailVerified: sql<boolean>`${users.emailVerifiedAt} is not null`.as("email_verified"),
};

export async function findUserById(db: Database, id: string) {
  const rows = await db.select(publicColumns).from(users).where(eq(users.id, id)).limit(1);
  return rows[0] ?? null;
}

/**
 * A stored session that has not expired, with its person and their role in each of their channels:
 * what a signed-in request starts from, read in one query instead of three.
 */
export async function findLiveSession(db: Database, sid: string) {
  const rows = await db
    .select({
      sess: sessions.sess,
      user: publicColumns,
      roles: sql<Record<string, Role> | null>`(select json_object_agg(${memberships.channelId}, ${memberships.role}) from ${memberships} where ${memberships.userId} = ${sessions.userId})`,
    })
    .from(sessions)
    .leftJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.sid, sid), gte(sessions.expire, sql`now()`)))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  return { sess: row.sess, user: row.user?.id ? row.user : null, roles: row.roles ?? {} };
}

export async function findUserWithHashByEmail(db: Database, email: string) {
  const rows = await db
    .select({ ...publicColumns, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);
  return rows[0] ?? null;
}

export async function insertUser(db: Database, values: { email: string; name: string; passwordHash: string; timeZone?: string; emailVerifiedAt?: Date }) {
  const rows = await db.insert(users).values(values).onConflictDoNothing({ target: users.email }).returning(publicColumns);
  return rows[0] ?? null;
}

export async function markEmailVerified(db: Database, userId: string): Promise<void> {
  await db.update(users).set({ emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, now())` }).where(eq(users.id, userId));
}
