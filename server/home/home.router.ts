import type { Database } from "../db/client";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import type { NeedSource } from "../seams/home-needs";
import { homeOf } from "./home.service";

/**
 * A member's home: what needs them today. Every role reads episodes, so every member has a home; what
 * fills it is decided per role and per area by the service.
 */
export function homeRoutes(db: Database, sources: readonly NeedSource[]): RouteSpec[] {
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/home",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => res.json({ home: await homeOf(db, sources, callerOf(req)) }),
    },
  ];
}
