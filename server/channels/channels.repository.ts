import { and, asc, eq, gt, isNull, ne, sql } from "drizzle-orm";
import { rolesAllowed, type Role } from "../../shared/access/roles";
import type { ChannelStarter } from "../seams/channel-starters";
import type { Database } from "../db/client";
import { channels, invitations, memberships, users } from "../db/schema/accounts";
import { findUserById, insertUser, markEmailVerified } from "../auth/users.repository";

/** Not used, withdrawn, closed or expired. */
const isOpen = and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt), isNull(invitations.closedAt), gt(invitations.expiresAt, sql`now()`));

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
        isOpen,
      ),
    )
    .orderBy(asc(invitations.createdAt));
}


export async function insertChannelWithOwner(db: Database, name: string, ownerId: string, starters: readonly ChannelStarter[]) {
  return db.transaction((tx) => addChannelWithOwner(tx, name, ownerId, starters));
}

/** The channel, its owner's membership and what each feature starts it with, inside the caller's transaction. */
export async function addChannelWithOwner(tx: Database, name: string, ownerId: string, starters: readonly ChannelStarter[]) {
  const [channel] = await tx.insert(channels).values({ name }).returning();
  if (!channel) throw new Error("channel insert returned nothing");
  await tx.insert(memberships).values({ channelId: channel.id, userId: ownerId, role: "owner" });
  for (const start of starters) await start(tx, channel.id);
  return channel;
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
    await lockChannel(tx, channelId);
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
    // Invitations speak for the channel only while their sender may still manage its members.
    if (change === "remove" || !rolesAllowed("members", "W").includes(change.role)) await revokeInvitationsSentBy(tx, channelId, userId);
    return "done";
  });
}

async function revokeInvitationsSentBy(tx: Pick<Database, "update">, channelId: string, userId: string) {
  await tx
    .update(invitations)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(invitations.channelId, channelId), eq(invitations.invitedBy, userId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), isNull(invitations.closedAt)));
}

/**
 * Holds the channel's row until the transaction ends. Every change to who is in a channel takes it
 * first (inviting, joining, changing a role, removing): they run one at a time per channel, and in one
 * lock order, so a join never crosses an invitation to the same address or deadlocks with its sender's
 * removal. "No key update" leaves the channel's other rows (episodes, comments) free to be written meanwhile.
 */
export async function lockChannel(tx: Pick<Database, "execute">, channelId: string) {
  await tx.execute(sql`select id from channels where id = ${channelId} for no key update`);
}

export async function isMemberByEmail(db: Database, channelId: string, email: string): Promise<boolean> {
  const rows = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.channelId, channelId), eq(users.email, email)))
    .limit(1);
  return rows.length > 0;
}

export async function findOpenInvitationTo(db: Database, channelId: string, email: string) {
  const [row] = await db
    .select({ id: invitations.id, createdAt: invitations.createdAt, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(eq(invitations.channelId, channelId), eq(invitations.email, email), isOpen))
    .limit(1);
  return row ?? null;
}

/** Gives an open invitation the token its mail is about to carry; false if it closed meanwhile. */
export async function setInvitationToken(db: Database, invitationId: string, tokenHash: string): Promise<boolean> {
  const rows = await db.update(invitations).set({ tokenHash }).where(and(eq(invitations.id, invitationId), isOpen)).returning({ id: invitations.id });
  return rows.length > 0;
}

export async function insertInvitation(
  db: Database,
  values: { channelId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
) {
  const [row] = await db.insert(invitations).values(values).returning({ id: invitations.id });
  if (!row) throw new Error("invitation insert returned nothing");
  return row;
}

/** An invitation with its channel, who sent it and whether they may still invite (their role now, null if gone). */
function invitationsWithSender(db: Database) {
  return db
    .select({
      id: invitations.id,
      channelId: invitations.channelId,
      channelName: channels.name,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      inviterRole: memberships.role,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
      closedAt: invitations.closedAt,
      open: sql<boolean>`${isOpen}`,
    })
    .from(invitations)
    .innerJoin(channels, eq(channels.id, invitations.channelId))
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .leftJoin(memberships, and(eq(memberships.channelId, invitations.channelId), eq(memberships.userId, invitations.invitedBy)));
}

export async function findInvitationByHash(db: Database, tokenHash: string) {
  const [row] = await invitationsWithSender(db).where(eq(invitations.tokenHash, tokenHash)).limit(1);
  return row ?? null;
}

/** What an invitation's mail needs when it is sent. */
/** An invitation as its mail says it, with the zone of the account its address already has (null: none, write UTC). */
export async function findInvitationToMail(db: Database, invitationId: string) {
  const [row] = await invitationsWithSender(db).where(eq(invitations.id, invitationId));
  if (!row) return null;
  const [invitee] = await db.select({ timeZone: users.timeZone }).from(users).where(eq(users.email, row.email));
  return { ...row, inviteeTimeZone: invitee?.timeZone ?? null };
}

export type Joiner = { userId: string } | { newAccount: { email: string; name: string; passwordHash: string; timeZone?: string } };

/**
 * In one transaction: marks the invitation used, makes the newcomer's account (already confirmed:
 * the invitation reached its address), adds the membership and closes the person's other open
 * invitations to the channel. Only one caller can claim a link (single use even under a race): the
 * others find it closed (used, or withdrawn meanwhile);
 * anything refused (an account that exists, a member already) undoes the claim, so nothing is burnt.
 */
export async function claimInvitation(
  db: Database,
  invitation: { id: string; channelId: string; email: string; role: Role },
  joiner: Joiner,
): Promise<{ outcome: "joined"; user: Express.User } | { outcome: "closed" | "already_member" | "account_exists" }> {
  try {
    return await db.transaction(async (tx) => {
      await lockChannel(tx, invitation.channelId);
      if (!(await markInvitationUsed(tx, invitation.id))) return { outcome: "closed" as const };
      const user = "userId" in joiner ? await confirmAddress(tx, joiner.userId) : await insertUser(tx, { ...joiner.newAccount, emailVerifiedAt: new Date() });
      if (!user) throw new Refused("account_exists");
      await tx.update(invitations).set({ acceptedBy: user.id }).where(eq(invitations.id, invitation.id));
      const joined = await tx.insert(memberships).values({ channelId: invitation.channelId, userId: user.id, role: invitation.role }).onConflictDoNothing().returning();
      if (joined.length === 0) throw new Refused("already_member");
      await tx
        .update(invitations)
        .set({ closedAt: sql`now()` })
        .where(and(eq(invitations.channelId, invitation.channelId), eq(invitations.email, invitation.email), ne(invitations.id, invitation.id), isOpen));
      return { outcome: "joined" as const, user };
    });
  } catch (error) {
    // Throwing inside the transaction undoes the claim above, so the link stays open.
    if (error instanceof Refused) return { outcome: error.outcome };
    throw error;
  }
}

class Refused extends Error {
  constructor(readonly outcome: "already_member" | "account_exists") {
    super(outcome);
  }
}

async function confirmAddress(tx: Database, userId: string) {
  await markEmailVerified(tx, userId);
  return findUserById(tx, userId);
}

async function markInvitationUsed(db: Pick<Database, "update">, invitationId: string) {
  const rows = await db
    .update(invitations)
    .set({ acceptedAt: sql`now()` })
    .where(and(eq(invitations.id, invitationId), isOpen))
    .returning({ id: invitations.id });
  return rows.length > 0;
}

export async function revokeInvitation(db: Database, channelId: string, invitationId: string) {
  const rows = await db
    .update(invitations)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(invitations.id, invitationId), eq(invitations.channelId, channelId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), isNull(invitations.closedAt)))
    .returning({ id: invitations.id });
  return rows.length > 0;
}
