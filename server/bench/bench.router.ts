import type { AppDeps } from "../seams/app-deps";
import type { RouteSpec } from "../http/route-table";
import { buildLogRoutes } from "./build-log.router";
import { buildPhotoRoutes } from "./build-photos.router";
import { resultsCardRoutes } from "./results-card.router";
import { runsRoutes } from "./runs.router";
import { shelfRoutes } from "./shelf.router";
import { testPlanRoutes } from "./test-plan.router";

/** The test plan sheet, the bench shelf, bench runs, the build log and its photos, the results card. */
export function benchRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  return [
    ...testPlanRoutes(db), ...shelfRoutes(db), ...runsRoutes(db), ...buildLogRoutes(db, deps.storage), ...buildPhotoRoutes(db, deps.storage),
    ...resultsCardRoutes({ db, storage: deps.storage, jobs: deps.jobs, chromiumPath: deps.env.CHROMIUM_PATH }),
  ];
}
