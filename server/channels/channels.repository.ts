import { and, asc, eq, gt, isNull, sql } from "drizzle-orm";
import type { Role } from "../../shared/access/roles";
import type { Database, Queryable } from "../db/client";
import { channels, invitations, memberships, users } from "../db/schema/accounts";

export async function listMembershipsOf(db: Database, userId: string) {
  return db
    .select({ channelId: channels.id, channelName: channels.name, role: memberships.role })
    .from(memberships)
    .innerJoin(channels, eq(channels.id, memberships.channelId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(channels.name));
}

export async function listMembers(db: Database, channelId: string) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.joinedAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(users.name));
}

export async function listOpenInvitations(db: Database, channelId: string) {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      invitedBy: users.name,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(
      and(
        eq(invitations.channelId, channelId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, sql`now()`),
      ),
    )
    .orderBy(asc(invitations.createdAt));
}

export async function insertChannelWithOwner(db: Queryable, name: string, ownerId: string) {
  return db.transaction(async (tx) => {
    const [channel] = await tx.insert(channels).values({ name }).returning();
    if (!channel) throw new Error("channel insert returned nothing");
    await tx.insert(memberships).values({ channelId: channel.id, userId: ownerId, role: "owner" });
    return channel;
  });
}

/**
 * Changes a role or removes a member unless that would leave the channel without an owner.
 * The owner count is read under a row lock on the channel so two owners demoting each other at once
 * cannot both succeed.
 */
export async function changeMembershipKeepingAnOwner(
  db: Database,
  channelId: string,
  userId: string,
  change: { role: Role } | "remove",
): Promise<"done" | "missing" | "last_owner"> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select id from channels where id = ${channelId} for update`);
    const [current] = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.channelId, channelId), eq(memberships.userId, userId)));
    if (!current) return "missing";
    const losesOwner = current.role === "owner" && (change === "remove" || change.role !== "owner");
    if (losesOwner) {
      const [{ owners } = { owners: 0 }] = await tx
        .select({ owners: sql<number>`count(*)::int` })
        .from(memberships)
        .where(and(eq(memberships.channelId, channelId), eq(memberships.role, "owner")));
      if (owners <= 1) return "last_owner";
    }
    const where = and(eq(memberships.channelId, channelId), eq(memberships.userId, userId));
    if (change === "remove") await tx.delete(memberships).where(where);
    else await tx.update(memberships).set({ role: change.role }).where(where);
    return "done";
  });
}

export async function insertInvitation(
  db: Database,
  values: { channelId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
) {
  const [row] = await db.insert(invitations).values(values).returning({ id: invitations.id });
  if (!row) throw new Error("invitation insert returned nothing");
  return row;
}

export async function findInvitationByHash(db: Database, tokenHash: string) {
  const rows = await db
    .select({
      id: invitations.id,
      channelId: invitations.channelId,
      channelName: channels.name,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
    })
    .from(invitations)
    .innerJoin(channels, eq(channels.id, invitations.channelId))
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  return rows[0] ?? null;
}

/**
 * Marks the invitation used and adds the membership in one transaction: only one caller can claim a
 * link (single use even under a race), and a person who is already a member doesn't burn it.
 */
export async function claimInvitation(
  db: Database,
  invitation: { id: string; channelId: string; role: Role },
  userId: string,
): Promise<"joined" | "used" | "already_member"> {
  try {
    return await db.transaction(async (tx) => {
      if (!(await markInvitationUsed(tx, invitation.id, userId))) return "used";
      const joined = await tx.insert(memberships).values({ channelId: invitation.channelId, userId, role: invitation.role }).onConflictDoNothing().returning();
      // Throwing undoes the claim above, so the link stays open.
      if (joined.length === 0) throw new AlreadyMember();
      return "joined";
    });
  } catch (error) {
    if (error instanceof AlreadyMember) return "already_member";
    throw error;
  }
}

class AlreadyMember extends Error {}

async function markInvitationUsed(db: Pick<Database, "update">, invitationId: string, userId: string) {
  const rows = await db
    .update(invitations)
    .set({ acceptedAt: sql`now()`, acceptedBy: userId })
    .where(
      and(
        eq(invitations.id, invitationId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, sql`now()`),
      ),
    )
    .returning({ id: invitations.id });
  return rows.length > 0;
}

export async function revokeInvitation(db: Database, channelId: string, invitationId: string) {
  const rows = await db
    .update(invitations)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(invitations.id, invitationId), eq(invitations.channelId, channelId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .returning({ id: invitations.id });
  return rows.length > 0;
}
