import type { z } from "zod";
import type { shootDayPatchSchema, shootDaySchema, shotPatchSchema, shotSchema, ShootDayView, ShotView } from "../../shared/rushes/schemas";
import { AppError, notFound } from "../http/app-error";
import type { MemberContext } from "../http/route-table";
import * as repo from "./shoot.repository";
import { episodeInChannel } from "./uploads.repository";
import type { RushesContext } from "./uploads.service";

type ShootDayBody = z.infer<typeof shootDaySchema>;
type ShootDayPatch = z.infer<typeof shootDayPatchSchema>;
type ShotBody = z.infer<typeof shotSchema>;
type ShotPatch = z.infer<typeof shotPatchSchema>;

async function episodeOrNotFound(ctx: RushesContext, member: MemberContext, episodeId: string) {
  const episode = await episodeInChannel(ctx.db, member.channelId, episodeId);
  if (!episode) throw notFound("Episode");
  return episode;
}

async function checkCrew(ctx: RushesContext, member: MemberContext, crewIds: string[]): Promise<string[]> {
  const unique = [...new Set(crewIds)];
  const found = await repo.membersAmong(ctx.db, member.channelId, unique);
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

export async function listShootDays(ctx: RushesContext, member: MemberContext, episodeId: string) {
  await episodeOrNotFound(ctx, member, episodeId);
  return views(ctx, await repo.listShootDays(ctx.db, member.channelId, episodeId));
}

export async function createShootDay(ctx: RushesContext, member: MemberContext, episodeId: string, body: ShootDayBody) {
  await episodeOrNotFound(ctx, member, episodeId);
  const crewIds = await checkCrew(ctx, member, body.crewIds);
  const id = await ctx.db.transaction(async (tx) => {
    const row = await repo.insertShootDay(tx, { channelId: member.channelId, episodeId, day: body.day, place: body.place, callTime: body.callTime, notes: body.notes });
    await repo.replaceCrew(tx, row.id, crewIds);
    return row.id;
  });
  return getShootDay(ctx, member, id).then((v) => v.shootDay);
}

/** The crew's view of a day: the day, its shots, and the ones still to capture. */
export async function getShootDay(ctx: RushesContext, member: MemberContext, shootDayId: string) {
  const row = await repo.findShootDay(ctx.db, member.channelId, shootDayId);
  if (!row) throw notFound("Shoot day");
  const [view] = await views(ctx, [row]);
  const episode = await episodeInChannel(ctx.db, member.channelId, row.episodeId);
  const shots = (await repo.listShots(ctx.db, member.channelId, { shootDayId })) as ShotView[];
  return { shootDay: view!, episodeTitle: episode?.title ?? "", shots, missing: shots.filter((s) => s.status === "planned") };
}

export async function updateShootDay(ctx: RushesContext, member: MemberContext, shootDayId: string, patch: ShootDayPatch) {
  const row = await repo.findShootDay(ctx.db, member.channelId, shootDayId);
  if (!row) throw notFound("Shoot day");
  const crewIds = patch.crewIds ? await checkCrew(ctx, member, patch.crewIds) : null;
  await ctx.db.transaction(async (tx) => {
    const { crewIds: _crew, ...fields } = patch;
    await repo.updateShootDay(tx, member.channelId, shootDayId, fields);
    if (crewIds) await repo.replaceCrew(tx, shootDayId, crewIds);
  });
  return (await getShootDay(ctx, member, shootDayId)).shootDay;
}

export async function deleteShootDay(ctx: RushesContext, member: MemberContext, shootDayId: string) {
  if (!(await repo.deleteShootDay(ctx.db, member.channelId, shootDayId))) throw notFound("Shoot day");
}

async function checkShootDay(ctx: RushesContext, member: MemberContext, episodeId: string, shootDayId: string | null | undefined) {
  if (!shootDayId) return;
  const day = await repo.findShootDay(ctx.db, member.channelId, shootDayId);
  if (!day || day.episodeId !== episodeId) {
    throw new AppError("validation_failed", "Some fields need attention.", { shootDayId: "Choose a shoot day of this episode." });
  }
}

export async function listShots(ctx: RushesContext, member: MemberContext, episodeId: string): Promise<ShotView[]> {
  await episodeOrNotFound(ctx, member, episodeId);
  return (await repo.listShots(ctx.db, member.channelId, { episodeId })) as ShotView[];
}

async function shotView(ctx: RushesContext, member: MemberContext, shotId: string): Promise<ShotView> {
  const shot = await repo.findShot(ctx.db, member.channelId, shotId);
  if (!shot) throw notFound("Shot");
  const all = (await repo.listShots(ctx.db, member.channelId, { episodeId: shot.episodeId })) as ShotView[];
  return all.find((s) => s.id === shotId)!;
}

export async function createShot(ctx: RushesContext, member: MemberContext, episodeId: string, body: ShotBody) {
  await episodeOrNotFound(ctx, member, episodeId);
  await checkShootDay(ctx, member, episodeId, body.shootDayId);
  const position = await repo.nextShotPosition(ctx.db, episodeId);
  const { id } = await repo.insertShot(ctx.db, { channelId: member.channelId, episodeId, position, ...body });
  return shotView(ctx, member, id);
}

export async function updateShot(ctx: RushesContext, member: MemberContext, shotId: string, patch: ShotPatch) {
  const shot = await repo.findShot(ctx.db, member.channelId, shotId);
  if (!shot) throw notFound("Shot");
  await checkShootDay(ctx, member, shot.episodeId, patch.shootDayId);
  await ctx.db.transaction(async (tx) => {
    await repo.updateShot(tx, member.channelId, shotId, patch);
    // Planned or dropped as asked; a linked clip still makes it captured.
    if (patch.status) await repo.refreshShotStatus(tx, shotId);
  });
  return shotView(ctx, member, shotId);
}

export async function deleteShot(ctx: RushesContext, member: MemberContext, shotId: string) {
  if (!(await repo.deleteShot(ctx.db, member.channelId, shotId))) throw notFound("Shot");
}
