import type { z } from "zod";
import type { shootDayPatchSchema, shootDaySchema, shotPatchSchema, shotSchema, ShootDayView, ShotView } from "../../shared/rushes/schemas";
import { membersAmong } from "../db/channel-scope";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import * as repo from "./shoot.repository";
import { episodeInChannel } from "./uploads.repository";
import type { RushesContext } from "./rushes.context";

type ShootDayBody = z.infer<typeof shootDaySchema>;
type ShootDayPatch = z.infer<typeof shootDayPatchSchema>;
type ShotBody = z.infer<typeof shotSchema>;
type ShotPatch = z.infer<typeof shotPatchSchema>;

async function checkCrew(ctx: RushesContext, caller: Caller, crewIds: string[]): Promise<string[]> {
  const unique = [...new Set(crewIds)];
  const found = await membersAmong(ctx.db, caller.channelId, unique);
  if (found.length !== unique.length) {
    throw new AppError("validation_failed", "Some fields need attention.", { crewIds: "Everyone on a shoot day must be a member of this channel." });
  }
  return unique;
}

async function views(ctx: RushesContext, rows: Awaited<ReturnType<typeof repo.listShootDays>>): Promise<ShootDayView[]> {
  const ids = rows.map((r) => r.id);
  const [crew, counts] = await Promise.all([repo.crewOf(ctx.db, ids), repo.shotCounts(ctx.db, ids)]);
  return rows.map((row) => {
    const c = counts.find((x) => x.shootDayId === row.id);
    return {
      id: row.id,
      episodeId: row.episodeId,
      day: row.day,
      place: row.place,
      callTime: row.callTime,
      notes: row.notes,
      crew: crew.filter((x) => x.shootDayId === row.id).map(({ userId, name }) => ({ userId, name })),
      shotCount: c?.total ?? 0,
      missingCount: c?.missing ?? 0,
    };
  });
}

export async function listShootDays(ctx: RushesContext, caller: Caller, episodeId: string) {
  return views(ctx, await repo.listShootDays(ctx.db, caller.channelId, episodeId));
}

export async function createShootDay(ctx: RushesContext, caller: Caller, episodeId: string, body: ShootDayBody) {
  const crewIds = await checkCrew(ctx, caller, body.crewIds);
  const id = await ctx.db.transaction(async (tx) => {
    const row = await repo.insertShootDay(tx, { channelId: caller.channelId, episodeId, day: body.day, place: body.place, callTime: body.callTime, notes: body.notes });
    await repo.replaceCrew(tx, row.id, crewIds);
    return row.id;
  });
  return getShootDay(ctx, caller, id).then((v) => v.shootDay);
}

/** The crew's view of a day: the day, its shots, and the ones still to capture. */
export async function getShootDay(ctx: RushesContext, caller: Caller, shootDayId: string) {
  const row = await repo.findShootDay(ctx.db, caller.channelId, shootDayId);
  if (!row) throw notFound("Shoot day");
  const [view] = await views(ctx, [row]);
  const episode = await episodeInChannel(ctx.db, caller.channelId, row.episodeId);
  const shots = (await repo.listShots(ctx.db, caller.channelId, { shootDayId })) as ShotView[];
  return { shootDay: view!, episodeTitle: episode?.title ?? "", shots, missing: shots.filter((s) => s.status === "planned") };
}

export async function updateShootDay(ctx: RushesContext, caller: Caller, shootDayId: string, patch: ShootDayPatch) {
  const row = await repo.findShootDay(ctx.db, caller.channelId, shootDayId);
  if (!row) throw notFound("Shoot day");
  const crewIds = patch.crewIds ? await checkCrew(ctx, caller, patch.crewIds) : null;
  await ctx.db.transaction(async (tx) => {
    const { crewIds: _crew, ...fields } = patch;
    await repo.updateShootDay(tx, caller.channelId, shootDayId, fields);
    if (crewIds) await repo.replaceCrew(tx, shootDayId, crewIds);
  });
  return (await getShootDay(ctx, caller, shootDayId)).shootDay;
}

export async function deleteShootDay(ctx: RushesContext, caller: Caller, shootDayId: string) {
  if (!(await repo.deleteShootDay(ctx.db, caller.channelId, shootDayId))) throw notFound("Shoot day");
}

async function checkShootDay(ctx: RushesContext, caller: Caller, episodeId: string, shootDayId: string | null | undefined) {
  if (!shootDayId) return;
  const day = await repo.findShootDay(ctx.db, caller.channelId, shootDayId);
  if (!day || day.episodeId !== episodeId) {
    throw new AppError("validation_failed", "Some fields need attention.", { shootDayId: "Choose a shoot day of this episode." });
  }
}

export async function listShots(ctx: RushesContext, caller: Caller, episodeId: string): Promise<ShotView[]> {
  return (await repo.listShots(ctx.db, caller.channelId, { episodeId })) as ShotView[];
}

async function shotView(ctx: RushesContext, caller: Caller, shotId: string): Promise<ShotView> {
  const shot = await repo.findShot(ctx.db, caller.channelId, shotId);
  if (!shot) throw notFound("Shot");
  const all = (await repo.listShots(ctx.db, caller.channelId, { episodeId: shot.episodeId })) as ShotView[];
  return all.find((s) => s.id === shotId)!;
}

export async function createShot(ctx: RushesContext, caller: Caller, episodeId: string, body: ShotBody) {
  await checkShootDay(ctx, caller, episodeId, body.shootDayId);
  const { id } = await ctx.db.transaction(async (tx) => {
    const position = await repo.nextShotPosition(tx, caller.channelId, episodeId);
    return repo.insertShot(tx, { channelId: caller.channelId, episodeId, position, ...body });
  });
  return shotView(ctx, caller, id);
}

export async function updateShot(ctx: RushesContext, caller: Caller, shotId: string, patch: ShotPatch) {
  const shot = await repo.findShot(ctx.db, caller.channelId, shotId);
  if (!shot) throw notFound("Shot");
  await checkShootDay(ctx, caller, shot.episodeId, patch.shootDayId);
  await ctx.db.transaction(async (tx) => {
    await repo.updateShot(tx, caller.channelId, shotId, patch);
    // Planned or dropped as asked; a linked clip still makes it captured.
    if (patch.status) await repo.refreshShotStatus(tx, shotId);
  });
  return shotView(ctx, caller, shotId);
}

export async function deleteShot(ctx: RushesContext, caller: Caller, shotId: string) {
  if (!(await repo.deleteShot(ctx.db, caller.channelId, shotId))) throw notFound("Shot");
}
