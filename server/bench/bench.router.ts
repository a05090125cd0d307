import type { AppDeps } from "../app";
import type { RouteSpec } from "../http/route-table";

export function benchRoutes(_deps: AppDeps): RouteSpec[] {
  return [];
}
