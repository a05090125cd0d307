import { and, asc, count, eq, inArray, sql } from "drizzle-orm";
import type { Database, Queryable } from "../db/client";
import { nextNumber } from "../db/counters";
import { users } from "../db/schema/accounts";
import { shootDayCrew, shootDays, shots } from "../db/schema/rushes";

type Executor = Pick<Database, "select" | "insert" | "update" | "delete" | "execute">;

export async function listShootDays(db: Executor, channelId: string, episodeId: string) {
  return db
    .select()
    .from(shootDays)
    .where(and(eq(shootDays.channelId, channelId), eq(shootDays.episodeId, episodeId)))
    .orderBy(asc(shootDays.day), asc(shootDays.createdAt));
}

export async function findShootDay(db: Executor, channelId: string, shootDayId: string) {
  const rows = await db
    .select()
    .from(shootDays)
    .where(and(eq(shootDays.id, shootDayId), eq(shootDays.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function crewOf(db: Executor, shootDayIds: string[]) {
  if (shootDayIds.length === 0) return [];
  return db
    .select({ shootDayId: shootDayCrew.shootDayId, userId: users.id, name: users.name })
    .from(shootDayCrew)
    .innerJoin(users, eq(users.id, shootDayCrew.userId))
    .where(inArray(shootDayCrew.shootDayId, shootDayIds))
    .orderBy(asc(users.name));
}

export async function replaceCrew(db: Executor, shootDayId: string, userIds: string[]) {
  await db.delete(shootDayCrew).where(eq(shootDayCrew.shootDayId, shootDayId));
  if (userIds.length > 0) await db.insert(shootDayCrew).values(userIds.map((userId) => ({ shootDayId, userId })));
}

export async function insertShootDay(db: Executor, values: typeof shootDays.$inferInsert) {
  const [row] = await db.insert(shootDays).values(values).returning();
  if (!row) throw new Error("shoot day insert returned nothing");
  return row;
}

export async function updateShootDay(db: Executor, channelId: string, shootDayId: string, values: Partial<typeof shootDays.$inferInsert>) {
  if (Object.keys(values).length === 0) return;
  await db
    .update(shootDays)
    .set(values)
    .where(and(eq(shootDays.id, shootDayId), eq(shootDays.channelId, channelId)));
}

export async function deleteShootDay(db: Executor, channelId: string, shootDayId: string) {
  const rows = await db
    .delete(shootDays)
    .where(and(eq(shootDays.id, shootDayId), eq(shootDays.channelId, channelId)))
    .returning({ id: shootDays.id });
  return rows.length > 0;
}

// Written out in full: inside a one-table select Drizzle leaves column names unqualified.
const clipCount = sql<number>`(select count(*)::int from clips linked where linked.shot_id = "shots"."id")`;

export async function listShots(db: Executor, channelId: string, filter: { episodeId?: string; shootDayId?: string }) {
  return db
    .select({
      id: shots.id,
      episodeId: shots.episodeId,
      shootDayId: shots.shootDayId,
      description: shots.description,
      kind: shots.kind,
      priority: shots.priority,
      status: shots.status,
      position: shots.position,
      clipCount,
    })
    .from(shots)
    .where(
      and(
        eq(shots.channelId, channelId),
        filter.episodeId ? eq(shots.episodeId, filter.episodeId) : undefined,
        filter.shootDayId ? eq(shots.shootDayId, filter.shootDayId) : undefined,
      ),
    )
    .orderBy(sql`case ${shots.priority} when 'must' then 0 when 'normal' then 1 else 2 end`, asc(shots.position), asc(shots.createdAt));
}

export async function shotCounts(db: Executor, shootDayIds: string[]) {
  if (shootDayIds.length === 0) return [];
  return db
    .select({ shootDayId: shots.shootDayId, total: count(), missing: sql<number>`count(*) filter (where ${shots.status} = 'planned')::int` })
    .from(shots)
    .where(inArray(shots.shootDayId, shootDayIds))
    .groupBy(shots.shootDayId);
}

export async function findShot(db: Executor, channelId: string, shotId: string) {
  const rows = await db
    .select()
    .from(shots)
    .where(and(eq(shots.id, shotId), eq(shots.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function nextShotPosition(db: Queryable, channelId: string, episodeId: string): Promise<number> {
  const atLeast = sql`select coalesce(max(${shots.position}), -1) + 1 from ${shots} where ${shots.channelId} = ${channelId} and ${shots.episodeId} = ${episodeId}`;
  return nextNumber(db, { scope: "shot_position", ownerId: episodeId, channelId, atLeast });
}

export async function insertShot(db: Executor, values: typeof shots.$inferInsert) {
  const [row] = await db.insert(shots).values(values).returning({ id: shots.id });
  if (!row) throw new Error("shot insert returned nothing");
  return row;
}

export async function updateShot(db: Executor, channelId: string, shotId: string, values: Partial<typeof shots.$inferInsert>) {
  if (Object.keys(values).length === 0) return;
  await db
    .update(shots)
    .set(values)
    .where(and(eq(shots.id, shotId), eq(shots.channelId, channelId)));
}

export async function deleteShot(db: Executor, channelId: string, shotId: string) {
  const rows = await db
    .delete(shots)
    .where(and(eq(shots.id, shotId), eq(shots.channelId, channelId)))
    .returning({ id: shots.id });
  return rows.length > 0;
}

/** A shot is captured while a clip is linked to it; without clips a captured shot is planned again. */
export async function refreshShotStatus(db: Executor, shotId: string) {
  await db.execute(sql`
    update shots set status = case
      when exists (select 1 from clips where clips.shot_id = ${shotId}) then 'captured'::shot_status
      when status = 'captured' then 'planned'::shot_status
      else status end
    where id = ${shotId}`);
}
