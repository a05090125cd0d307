import { settingsInputSchema, speakingRateSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { settingsOf } from "./settings.service";
import { saveReminderDaysBefore, saveSpeakingRate } from "./sponsors.repository";

const base = "/api/channels/:channelId";

/** The sponsors' settings: reminder lead time ("deliverables") and each host's speaking rate ("sponsors"). */
export function settingsRoutes(db: Database): RouteSpec[] {
  return [
    {
      method: "get",
      path: `${base}/sponsor-settings`,
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => res.json({ settings: await settingsOf(db, callerOf(req).channelId) }),
    },
    {
      method: "put",
      path: `${base}/sponsor-settings`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const { reminderDaysBefore: days } = parseBody(settingsInputSchema, req.body);
        const { channelId } = callerOf(req);
        await saveReminderDaysBefore(db, channelId, days);
        res.json({ settings: await settingsOf(db, channelId) });
      },
    },
    {
      method: "put",
      path: `${base}/speaking-rates/:userId`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const { channelId } = callerOf(req);
        const { wordsPerMinute } = parseBody(speakingRateSchema, req.body);
        await saveSpeakingRate(db, channelId, idOf(req, "userId"), wordsPerMinute);
        res.json({ settings: await settingsOf(db, channelId) });
      },
    },
  ];
}
