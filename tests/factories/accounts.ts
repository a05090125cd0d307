import { randomUUID } from "node:crypto";
import type { Role } from "../../shared/access/roles";
import type { Database } from "../../server/db/client";
import { hash } from "@node-rs/argon2";
import { channels, memberships, users } from "../../server/db/schema/accounts";

export const FACTORY_PASSWORD = "correct-horse-battery";

/**
 * Accounts made straight in a test database get argon2id at a light cost (1 MiB, 1 pass) instead of
 * Kerf's own (19 MiB, 2 passes, server/auth/password.ts): the server checks a hash by the parameters
 * written in it, so signing in works the same, at about a tenth of the CPU. The access matrix alone
 * signs in about a thousand times. Accounts made through Kerf's routes still get Kerf's own cost.
 */
export function factoryPasswordHash(password: string): Promise<string> {
  return hash(password, { memoryCost: 1024, timeCost: 1 });
}

/** An account whose address is confirmed, unless `verified: false` (then Kerf sends nothing to others for it). */
export async function createUser(db: Database, overrides: { email?: string; name?: string; password?: string; timeZone?: string; verified?: boolean } = {}) {
  const password = overrides.password ?? FACTORY_PASSWORD;
  const [user] = await db
    .insert(users)
    .values({
      email: overrides.email ?? `person-${randomUUID().slice(0, 8)}@example.com`,
      name: overrides.name ?? "Test Person",
      timeZone: overrides.timeZone ?? "UTC",
      passwordHash: await factoryPasswordHash(password),
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
