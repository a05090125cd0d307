import { z } from "zod";
import type { Database } from "../db/client";
import { callerOf } from "../http/guards";
import { channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { changePageSettings, confirmAddress, pageSettings, publicPage, stopNews, submitSuggestion, type PageContext } from "./page.service";

const page = "/api/suggestion-pages/:channelId";
const tokenSchema = z.strictObject({ token: z.string({ error: "The link is incomplete." }).min(10, "The link is incomplete.").max(200, "The link is not valid.") });
const pageId = (value: unknown) => parseId(value, "Suggestion page");

/** The public suggestion page (no account), the links mailed to viewers, and the page's settings. */
export function pageRoutes(ctx: PageContext): RouteSpec[] {
  const db: Database = ctx.db;
  return [
    { method: "get", path: page, access: publicAccess, handler: async (req, res) => res.json({ page: await publicPage(db, pageId(req.params.channelId)) }) },
    {
      method: "post",
      path: `${page}/suggestions`,
      access: publicAccess,
      bodyLimit: 16_384,
      handler: async (req, res) => res.status(201).json(await submitSuggestion(ctx, pageId(req.params.channelId), req.ip ?? "", req.body)),
    },
    {
      method: "post",
      path: "/api/suggestion-addresses/confirm",
      access: publicAccess,
      handler: async (req, res) => res.json(await confirmAddress(db, parseBody(tokenSchema, req.body).token)),
    },
    {
      method: "post",
      path: "/api/suggestion-addresses/stop",
      access: publicAccess,
      handler: async (req, res) => {
        await stopNews(db, ctx.tokens, parseBody(tokenSchema, req.body).token);
        res.json({ stopped: true });
      },
    },
    { method: "get", path: "/api/channels/:channelId/intake/page", access: channelAccess("intake", "R"), handler: async (req, res) => res.json({ page: await pageSettings(db, callerOf(req).channelId) }) },
    {
      method: "put",
      path: "/api/channels/:channelId/intake/page",
      access: channelAccess("intakePage", "W", "Only the owner and producers open, close and word the suggestion page."),
      handler: async (req, res) => res.json({ page: await changePageSettings(db, callerOf(req).channelId, req.body) }),
    },
  ];
}
