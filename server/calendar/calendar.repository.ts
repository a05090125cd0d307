import { asc, eq } from "drizzle-orm";
import type { CalendarMember } from "../../shared/calendar/entries";
import type { Queryable } from "../db/client";
import { memberships, users } from "../db/schema/accounts";

/** The channel's members by name, for the member filter and the conflict messages. */
export async function membersOf(db: Queryable, channelId: string): Promise<CalendarMember[]> {
  return db
    .select({ id: users.id, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(users.name), asc(users.id));
}
