import type { Request } from "express";
import { deskFilterSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { AppError } from "../http/app-error";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { desk } from "./desk.service";

function parseFilter(query: Request["query"]) {
  const filter = deskFilterSchema.safeParse({
    sponsorId: typeof query.sponsorId === "string" && query.sponsorId !== "" ? query.sponsorId : undefined,
    episodeId: typeof query.episodeId === "string" && query.episodeId !== "" ? query.episodeId : undefined,
  });
  if (!filter.success) throw new AppError("validation_failed", "The desk's filter names no sponsor or episode.");
  return filter.data;
}

/** The desk: every open item of the channel's live deals, grouped for the producer's morning look. */
export function deskRoutes(db: Database): RouteSpec[] {
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/desk",
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => res.json(await desk(db, callerOf(req), parseFilter(req.query))),
    },
  ];
}
