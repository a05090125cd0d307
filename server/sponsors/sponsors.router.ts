import type { AppDeps } from "../app";
import type { RouteSpec } from "../http/route-table";

export function sponsorsRoutes(_deps: AppDeps): RouteSpec[] {
  return [];
}
