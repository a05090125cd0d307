import { eq, sql } from "drizzle-orm";
import type { Database } from "../db/client";
import { users } from "../db/schema/accounts";

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
