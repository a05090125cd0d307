import { z } from "zod";
import { stageLengthsSchema } from "../../shared/slate/schedule";
import type { Database } from "../db/client";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { saveStageLengths, slateStateOf } from "./slate.repository";

const stageLengthsBody = z.strictObject({ stageLengths: stageLengthsSchema });

/** The channel's stage lengths, a channel setting: owner W, producer R (the spec's "members and settings" row). */
export function settingsRoutes(db: Database): RouteSpec[] {
  return [
    {
      // Stage lengths are channel settings: owner W, producer R (the spec's members and settings row).
      method: "get",
      path: "/api/channels/:channelId/slate/settings",
      access: channelAccess("members", "R"),
      handler: async (req, res) => {
        const { stageLengths, custom } = await slateStateOf(db, callerOf(req).channelId);
        res.json({ stageLengths, custom });
      },
    },
    {
      method: "put",
      path: "/api/channels/:channelId/slate/settings",
      access: channelAccess("members", "W"),
      handler: async (req, res) => {
        const { stageLengths } = parseBody(stageLengthsBody, req.body);
        await saveStageLengths(db, callerOf(req).channelId, stageLengths);
        res.json({ stageLengths, custom: true });
      },
    },
  ];
}
