import { and, eq, inArray } from "drizzle-orm";
import type { Role } from "../../shared/access/roles";
import type { Database } from "../db/client";
import { memberships, users } from "../db/schema/accounts";

/** A member's current address and role in a channel; null once they have left it. */
export async function findMemberAddress(db: Database, channelId: string, userId: string) {
  const [row] = await db
    .select({ email: users.email, name: users.name, role: memberships.role, mailOptOuts: users.mailOptOuts, timeZone: users.timeZone })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.channelId, channelId), eq(memberships.userId, userId)));
  return row ?? null;
}

/** The members of a channel who hold one of these roles now. */
export async function listMembersInRoles(db: Database, channelId: string, roles: Role[]) {
  return db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.channelId, channelId), inArray(memberships.role, roles)));
}
