import { randomUUID } from "node:crypto";
import type { Role } from "../../shared/access/roles";
import type { Database } from "../../server/db/client";
import { hashPassword } from "../../server/auth/password";
import { channels, memberships, users } from "../../server/db/schema/accounts";

export const FACTORY_PASSWORD = "correct-horse-battery";

/** An account whose address is confirmed, unless `verified: false` (then Kerf sends nothing to others for it). */
export async function createUser(db: Database, overrides: { email?: string; name?: string; password?: string; timeZone?: string; verified?: boolean } = {}) {
  const password = overrides.password ?? FACTORY_PASSWORD;
  const [user] = await db
    .insert(users)
    .values({
      email: overrides.email ?? `person-${randomUUID().slice(0, 8)}@example.com`,
      name: overrides.name ?? "Test Person",
      timeZone: overrides.timeZone ?? "UTC",
      passwordHash: await hashPassword(password),
      emailVerifiedAt: overrides.verified === false ? null : new Date(),
    })
    .returning();
  if (!user) throw new Error("user insert returned nothing");
  return { ...user, password };
}

export async function createChannel(db: Database, owner: { id: string }, name = "Test Channel") {
  const [channel] = await db.insert(channels).values({ name }).returning();
  if (!channel) throw new Error("channel insert returned nothing");
  await db.insert(memberships).values({ channelId: channel.id, userId: owner.id, role: "owner" });
  return channel;
}

export async function addMember(db: Database, channelId: string, user: { id: string }, role: Role) {
  await db.insert(memberships).values({ channelId, userId: user.id, role });
}

/** A channel with one account per role, the shape most tests start from. */
export async function createCrewedChannel(db: Database, name = "Test Channel") {
  const owner = await createUser(db, { name: "Olive Owner" });
  const channel = await createChannel(db, owner, name);
  const producer = await createUser(db, { name: "Pim Producer" });
  const editor = await createUser(db, { name: "Edda Editor" });
  const crew = await createUser(db, { name: "Cato Crew" });
  await addMember(db, channel.id, producer, "producer");
  await addMember(db, channel.id, editor, "editor");
  await addMember(db, channel.id, crew, "crew");
  return { channel, owner, producer, editor, crew };
}
