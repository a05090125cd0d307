import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import { clipRoutes } from "./clips.router";
import { exportRoutes } from "./exports.router";
import { footageLinkRoutes } from "./footage-links.router";
import { shootRoutes } from "./shoot.router";
import { stillRoutes } from "./stills.router";
import { uploadRoutes } from "./uploads.router";

/** Footage (uploads, clips and marks, photos, exports), shoot days and the shot list. */
export function rushesRoutes(deps: AppDeps): RouteSpec[] {
  const ctx = { db: deps.database.db, storage: deps.storage, jobs: deps.jobs };
  return [...uploadRoutes(ctx), ...clipRoutes(ctx), ...exportRoutes(ctx), ...footageLinkRoutes(ctx), ...stillRoutes(ctx), ...shootRoutes(ctx)];
}
