import type { AppDeps } from "../app";
import type { RouteSpec } from "../http/route-table";

export function rushesRoutes(_deps: AppDeps): RouteSpec[] {
  return [];
}
