import { and, eq, isNull, ne, notInArray, sql } from "drizzle-orm";
import type { Database } from "../db/client";
import { memberships, users } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";
import { deals, deliverables, remindersSent, sponsorSettings, sponsors } from "../db/schema/sponsors";
import type { Db } from "./deals.repository";

/** Every open, dated item of a live deal on an episode that isn't archived, with its owner (still a member) and the channel's lead time. */
export async function reminderCandidates(db: Database) {
  const owner = sql`coalesce(${deliverables.ownerId}, ${deals.createdBy})`;
  return db
    .select({
      id: deliverables.id,
      channelId: deliverables.channelId,
      kind: deliverables.kind,
      title: deliverables.title,
      status: deliverables.status,
      dueDate: deliverables.dueDate,
      episodeId: episodes.id,
      episodeTitle: episodes.title,
      company: sponsors.company,
      ownerId: users.id,
      ownerEmail: users.email,
      ownerName: users.name,
      ownerTimeZone: users.timeZone,
      ownerRole: memberships.role,
      daysBefore: sponsorSettings.reminderDaysBefore,
    })
    .from(deliverables)
    .innerJoin(deals, eq(deals.id, deliverables.dealId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .innerJoin(users, eq(users.id, owner))
    // The owner must still belong to the channel, in a role that may see the item.
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.channelId, deliverables.channelId)))
    .leftJoin(sponsorSettings, eq(sponsorSettings.channelId, deliverables.channelId))
    .where(
      and(
        notInArray(deliverables.status, ["approved", "done"]),
        sql`${deliverables.dueDate} is not null`,
        ne(deals.state, "cancelled"),
        isNull(episodes.archivedAt),
      ),
    );
}

/** Records one reminder; false when it was recorded before (another scan, another instance). */
export async function recordReminder(db: Db, reminder: typeof remindersSent.$inferInsert): Promise<boolean> {
  const inserted = await db.insert(remindersSent).values(reminder).onConflictDoNothing().returning({ id: remindersSent.deliverableId });
  return inserted.length > 0;
}
