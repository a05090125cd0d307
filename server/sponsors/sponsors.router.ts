import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import { dealRoutes } from "./deals.router";
import { deliverableRoutes } from "./deliverables.router";
import { deskRoutes } from "./desk.router";
import { directoryRoutes } from "./directory.router";
import { invoiceRoutes } from "./invoices.router";
import { paymentsFrom } from "./payments";
import type { PublishedVideoReader } from "../seams/published-video";
import { reportRoutes } from "./reports.router";
import { reportTokens, reviewTokens } from "./review-token";
import { reviewRoutes } from "./review.router";
import { settingsRoutes } from "./settings.router";
import { templateRoutes } from "./templates.router";

/** Sponsors and their contacts, deal templates, deals, deliverables, review links, the desk, the settings, and invoices
 * through the payments provider (they are the deals' money, so they live with the deals). */
export function sponsorsRoutes(deps: AppDeps, published: PublishedVideoReader): RouteSpec[] {
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
    ...reportRoutes(reportContext(deps, published)),
    ...invoiceRoutes({ db, payments: paymentsFrom(deps.env), jobs: deps.jobs }),
  ];
}

/** What the sponsor's report needs, for its routes, its mail and its PDF job alike. */
export function reportContext(deps: Pick<AppDeps, "database" | "storage" | "jobs" | "env">, published: PublishedVideoReader) {
  return { db: deps.database.db, storage: deps.storage, jobs: deps.jobs, published, appUrl: deps.env.APP_URL, tokens: reportTokens(deps.env.SESSION_SECRET) };
}
