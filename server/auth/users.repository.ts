import { eq } from "drizzle-orm";
import type { Database, Queryable } from "../db/client";
import { users } from "../db/schema/accounts";

const publicColumns = { id: users.id, email: users.email, name: users.name, timeZone: users.timeZone };

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

export async function insertUser(db: Queryable, values: { email: string; name: string; passwordHash: string }) {
  const rows = await db.insert(users).values(values).onConflictDoNothing({ target: users.email }).returning(publicColumns);
  return rows[0] ?? null;
}
