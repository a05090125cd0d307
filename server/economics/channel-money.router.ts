import { moneySettingsSchema } from "../../shared/economics/schemas";
import type { Database } from "../db/client";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { changeSettings, channelMoney, channelMoneyCsv } from "./channel.service";

const money = "/api/channels/:channelId/money";

/** The channel's margins by month, its export and its money settings: owner and producer only. */
export function channelMoneyRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("money", "R");
  const write = channelAccess("money", "W");
  return [
    { method: "get", path: money, access: read, handler: async (req, res) => res.json({ money: await channelMoney(db, callerOf(req).channelId) }) },
    {
      method: "get",
      path: `${money}.csv`,
      access: read,
      handler: async (req, res) => {
        // RFC 4180, section 3: text/csv, with the optional header parameter saying the first line names the columns.
        res.type("text/csv; charset=utf-8; header=present").attachment("channel-money.csv").send(await channelMoneyCsv(db, callerOf(req).channelId));
      },
    },
    {
      method: "put",
      path: `${money}/settings`,
      access: write,
      handler: async (req, res) => res.json({ settings: await changeSettings(db, callerOf(req), parseBody(moneySettingsSchema, req.body)) }),
    },
  ];
}
