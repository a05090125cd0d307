import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import type { CalendarPlugs } from "./calendar.service";
import { entriesRoutes } from "./entries.router";
import { feedRoutes } from "./feeds.router";

/** The channel's calendar and each member's iCalendar feed. */
export function calendarRoutes(deps: AppDeps, plugs: CalendarPlugs): RouteSpec[] {
  return [...entriesRoutes(deps.database.db, plugs), ...feedRoutes(deps, plugs.sources)];
}
