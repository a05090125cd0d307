import { feedRequestSchema } from "../../shared/calendar/feeds";
import { callerOf, signedInUser } from "../http/guards";
import { anyAccount, channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import type { AppDeps } from "../seams/app-deps";
import type { CalendarSource } from "../seams/calendar-sources";
import { endFeed, feedsOf, feedText, makeFeed } from "./feeds.service";

const channelFeed = "/api/channels/:channelId/calendar-feed";

/**
 * Each member's private feed per channel: made, remade and ended by its member from the account page;
 * fetched by calendar apps with the secret in the address as the only key.
 */
export function feedRoutes(deps: AppDeps, sources: readonly CalendarSource[]): RouteSpec[] {
  const db = deps.database.db;
  const appUrl = deps.env.APP_URL;
  return [
    {
      method: "get",
      path: "/api/account/calendar-feeds",
      access: anyAccount,
      handler: async (req, res) => res.json({ feeds: await feedsOf(db, signedInUser(req).id) }),
    },
    {
      method: "post",
      path: channelFeed,
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const { scope } = parseBody(feedRequestSchema, req.body);
        res.status(201).json({ feed: await makeFeed(db, callerOf(req), scope, appUrl) });
      },
    },
    {
      method: "delete",
      path: channelFeed,
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        await endFeed(db, callerOf(req));
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: "/api/calendar-feeds/:token/kerf.ics",
      access: publicAccess,
      handler: async (req, res) => {
        const text = await feedText(db, sources, String(req.params.token), appUrl);
        // Private to the one who holds the address; calendar apps poll, and may ask again after five minutes.
        res.set({ "Content-Type": "text/calendar; charset=utf-8", "Cache-Control": "private, max-age=300", "Content-Disposition": 'inline; filename="kerf.ics"' });
        res.send(text);
      },
    },
  ];
}
