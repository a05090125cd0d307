import { shootDayPatchSchema, shootDaySchema, shotPatchSchema, shotSchema } from "../../shared/rushes/schemas";
import { channelPeople } from "../db/channel-scope";
import { AppError } from "../http/app-error";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import type { RushesContext } from "./rushes.context";
import * as shoot from "./shoot.service";

const C = "/api/channels/:channelId";
const episode = `${C}/episodes/:episodeId`;

/** Shoot days and the shot list: every role writes them (the spec's "shoot days, shot list" row). */
export function shootRoutes(ctx: RushesContext): RouteSpec[] {
  const read = channelAccess("shoot", "R");
  const write = channelAccess("shoot", "W");
  return [
    {
      method: "get",
      path: `${episode}/shoot-days`,
      access: read,
      handler: async (req, res) => res.json({ shootDays: await shoot.listShootDays(ctx, callerOf(req), idOf(req, "episodeId")) }),
    },
    {
      method: "post",
      path: `${episode}/shoot-days`,
      access: write,
      handler: async (req, res) => {
        const body = parseBody(shootDaySchema, req.body);
        res.status(201).json({ shootDay: await shoot.createShootDay(ctx, callerOf(req), idOf(req, "episodeId"), body) });
      },
    },
    {
      method: "get",
      path: `${C}/shoot-crew`,
      access: read,
      handler: async (req, res) => res.json({ people: await channelPeople(ctx.db, callerOf(req).channelId) }),
    },
    {
      method: "get",
      path: `${C}/shoot-days/:shootDayId`,
      access: read,
      handler: async (req, res) => res.json(await shoot.getShootDay(ctx, callerOf(req), idOf(req, "shootDayId"))),
    },
    {
      method: "patch",
      path: `${C}/shoot-days/:shootDayId`,
      access: write,
      handler: async (req, res) => {
        const patch = parseBody(shootDayPatchSchema, req.body);
        res.json({ shootDay: await shoot.updateShootDay(ctx, callerOf(req), idOf(req, "shootDayId"), patch) });
      },
    },
    {
      method: "delete",
      path: `${C}/shoot-days/:shootDayId`,
      access: write,
      body: "none",
      handler: async (req, res) => {
        await shoot.deleteShootDay(ctx, callerOf(req), idOf(req, "shootDayId"));
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: `${episode}/shots`,
      access: read,
      handler: async (req, res) => res.json({ shots: await shoot.listShots(ctx, callerOf(req), idOf(req, "episodeId")) }),
    },
    {
      method: "post",
      path: `${episode}/shots`,
      access: write,
      handler: async (req, res) => {
        const body = parseBody(shotSchema, req.body);
        res.status(201).json({ shot: await shoot.createShot(ctx, callerOf(req), idOf(req, "episodeId"), body) });
      },
    },
    {
      method: "patch",
      path: `${C}/shots/:shotId`,
      access: write,
      handler: async (req, res) => {
        const patch = parseBody(shotPatchSchema, req.body);
        if (Object.keys(patch).length === 0) throw new AppError("validation_failed", "Change at least one thing.");
        res.json({ shot: await shoot.updateShot(ctx, callerOf(req), idOf(req, "shotId"), patch) });
      },
    },
    {
      method: "delete",
      path: `${C}/shots/:shotId`,
      access: write,
      body: "none",
      handler: async (req, res) => {
        await shoot.deleteShot(ctx, callerOf(req), idOf(req, "shotId"));
        res.status(204).end();
      },
    },
  ];
}
