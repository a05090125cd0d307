import { calendarDateSchema } from "../../shared/fields/dates";
import { calendarRangeSchema } from "../../shared/calendar/entries";
import { z } from "zod";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { calendarView, previewPublishMove, type CalendarPlugs } from "./calendar.service";

const previewSchema = z.strictObject({ date: calendarDateSchema });

/** The calendar's days for every member, and what a publish-date move would shift for those who may move it. */
export function entriesRoutes(db: Database, plugs: CalendarPlugs): RouteSpec[] {
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/calendar",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const range = parseBody(calendarRangeSchema, req.query);
        res.json({ calendar: await calendarView(db, plugs, callerOf(req), range) });
      },
    },
    {
      // Changes nothing: the move is made in a transaction that is rolled back (calendar.service.ts).
      method: "post",
      path: "/api/channels/:channelId/calendar/episodes/:episodeId/publish-preview",
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const { date } = parseBody(previewSchema, req.body);
        res.json({ preview: await previewPublishMove(db, plugs, callerOf(req), idOf(req, "episodeId"), date) });
      },
    },
  ];
}
