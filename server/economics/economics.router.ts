import type { RouteSpec } from "../http/route-table";
import type { AppDeps } from "../seams/app-deps";
import { channelMoneyRoutes } from "./channel-money.router";
import { episodeMoneyRoutes } from "./episode-money.router";

/** Money: each episode's costs and income, and the channel's margins by month. */
export function economicsRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  return [...episodeMoneyRoutes(db, deps.storage), ...channelMoneyRoutes(db)];
}
