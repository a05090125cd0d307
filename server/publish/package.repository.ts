import { and, asc, eq } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { memberships, users } from "../db/schema/accounts";
import { publishPackages } from "../db/schema/publish";
import { episodes } from "../db/schema/slate";
import { nextVersion } from "../db/versions";

export type PackageRow = typeof publishPackages.$inferSelect;
type PackageValues = Omit<typeof publishPackages.$inferInsert, "id" | "channelId" | "episodeId" | "version" | "createdAt" | "updatedAt">;

export async function findPackage(db: Queryable, channelId: string, episodeId: string): Promise<PackageRow | null> {
  const [row] = await db.select().from(publishPackages).where(and(eq(publishPackages.channelId, channelId), eq(publishPackages.episodeId, episodeId)));
  return row ?? null;
}

/** The first save: null when another first save got there before (the caller answers 409). */
export async function insertPackage(db: Queryable, channelId: string, episodeId: string, values: PackageValues & { timeZone: string }) {
  const [row] = await db.insert(publishPackages).values({ ...values, channelId, episodeId }).onConflictDoNothing().returning();
  return row ?? null;
}

/** A save against `version`: null when the version has moved on. */
export async function updatePackage(db: Queryable, channelId: string, episodeId: string, version: number, values: Partial<PackageValues>) {
  const [row] = await db
    .update(publishPackages)
    .set({ ...values, version: nextVersion(publishPackages.version), updatedAt: new Date() })
    .where(and(eq(publishPackages.channelId, channelId), eq(publishPackages.episodeId, episodeId), eq(publishPackages.version, version)))
    .returning();
  return row ?? null;
}

export async function clearThumbnailChoice(db: Queryable, channelId: string, thumbnailId: string) {
  await db
    .update(publishPackages)
    .set({ thumbnailId: null, version: nextVersion(publishPackages.version), updatedAt: new Date() })
    .where(and(eq(publishPackages.channelId, channelId), eq(publishPackages.thumbnailId, thumbnailId)));
}

/** The channel's zone until the package names its own: the owner's. */
export async function ownerTimeZone(db: Queryable, channelId: string): Promise<string> {
  const [row] = await db
    .select({ timeZone: users.timeZone })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.channelId, channelId), eq(memberships.role, "owner")))
    .orderBy(asc(memberships.joinedAt))
    .limit(1);
  return row?.timeZone ?? "UTC";
}

/** The channel's members by role: the description's credits. */
export async function membersByRole(db: Queryable, channelId: string) {
  return db
    .select({ role: memberships.role, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(users.name));
}

/** The episode's own words for its summary: the question the video answers. */
export async function episodeSummary(db: Queryable, channelId: string, episodeId: string): Promise<string> {
  const [row] = await db.select({ question: episodes.question }).from(episodes).where(and(eq(episodes.channelId, channelId), eq(episodes.id, episodeId)));
  return row?.question ?? "";
}
