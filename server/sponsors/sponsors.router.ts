import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import { dealRoutes } from "./deals.router";
import { deliverableRoutes } from "./deliverables.router";
import { deskRoutes } from "./desk.router";
import { directoryRoutes } from "./directory.router";
import { reviewTokens } from "./review-token";
import { reviewRoutes } from "./review.router";
import { settingsRoutes } from "./settings.router";
import { templateRoutes } from "./templates.router";

/** Sponsors and their contacts, deal templates, deals, deliverables, review links, the desk and the settings. */
export function sponsorsRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  const review = {
    db,
    appUrl: deps.env.APP_URL,
    tokens: reviewTokens(deps.env.SESSION_SECRET),
    storage: deps.storage,
    jobs: deps.jobs,
  };
  return [
    ...directoryRoutes(db),
    ...templateRoutes(db),
    ...settingsRoutes(db),
    ...dealRoutes(db),
    ...deliverableRoutes(db),
    ...reviewRoutes(review),
    ...deskRoutes(db),
  ];
}
