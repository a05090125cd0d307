import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import type { EpisodeMaker } from "../seams/episode-makers";
import { ideaRoutes } from "./ideas.router";
import { importRoutes } from "./imports.router";
import { newsTokens } from "./news-token";
import { defaultPageLimits, type PageLimits } from "./page-limits";
import { pageRoutes } from "./page.router";

export interface IntakePlugs {
  makeEpisode: EpisodeMaker;
  pageLimits?: PageLimits;
}

/** Viewers' suggestions: the public page, imports, ideas and their weighing, promotion to the slate. */
export function intakeRoutes(deps: AppDeps, plugs: IntakePlugs): RouteSpec[] {
  const db = deps.database.db;
  const pageContext = { db, jobs: deps.jobs, limits: plugs.pageLimits ?? defaultPageLimits, tokens: newsTokens(deps.env.SESSION_SECRET) };
  return [...pageRoutes(pageContext), ...ideaRoutes({ db, appUrl: deps.env.APP_URL, makeEpisode: plugs.makeEpisode }), ...importRoutes(db)];
}
