import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import type { GoLiveFollower, PublishSource } from "../seams/publish-sources";
import { figureRoutes } from "./figures.router";
import { packageRoutes } from "./package.router";
import { thumbnailRoutes } from "./thumbnails.router";

export interface PublishPlugs {
  sources: readonly PublishSource[];
  goLiveFollowers: readonly GoLiveFollower[];
}

/** The publish package (titles, description, chapters, thumbnails, time), its gate, going live and the figures after. */
export function publishRoutes(deps: AppDeps, plugs: PublishPlugs): RouteSpec[] {
  const ctx = { db: deps.database.db, storage: deps.storage, ...plugs };
  return [...packageRoutes(ctx), ...thumbnailRoutes(ctx), ...figureRoutes(ctx)];
}
