import { searchQuerySchema } from "../../shared/search/schemas";
import type { RouteSpec } from "../http/route-table";
import { channelAccess } from "../http/route-table";
import { callerOf } from "../http/guards";
import { parseBody } from "../http/validate";
import type { AppDeps } from "../seams/app-deps";
import { search } from "./search.service";

/** Search across the channel: every member may search; what they find is what their role reads. */
export function searchRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/search",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const { q } = parseBody(searchQuerySchema, req.query);
        res.json(await search(db, callerOf(req), q));
      },
    },
  ];
}
