import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import type { SlatePlugs } from "../seams/slate-plugs";
import { boardRoutes } from "./board.router";
import { commentRoutes } from "./comments.router";
import { episodeRoutes } from "./episodes.router";
import { settingsRoutes } from "./settings.router";

/** The board, the episode page and its schedule, history and comments; `plugs` are what other features add to them. */
export function slateRoutes(deps: AppDeps, plugs: SlatePlugs): RouteSpec[] {
  const db = deps.database.db;
  const commentDeps = { db, appUrl: deps.env.APP_URL, jobs: deps.jobs };
  return [...boardRoutes(db, plugs), ...episodeRoutes(db, plugs), ...commentRoutes(commentDeps), ...settingsRoutes(db)];
}
