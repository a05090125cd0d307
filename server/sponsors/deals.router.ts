import { createDealSchema, cutSchema, moneySchema, tieDealSchema, updateDealSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { listEpisodeDeals } from "./deals.repository";
import { createDeal, dealView, dealViews, tieDeal, updateCut, updateDeal, updateMoney } from "./deals.service";
import { catchUpPublishDates } from "./schedule.service";

const base = "/api/channels/:channelId";
const deal = `${base}/deals/:dealId`;

/** Deals: the segment's requirements ("sponsors"), the money ("fees") and the cut ("cut"). */
export function dealRoutes(db: Database): RouteSpec[] {
  return [
    {
      method: "get",
      path: `${base}/episodes/:episodeId/deals`,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        const caller = callerOf(req);
        await catchUpPublishDates(db, caller.channelId);
        res.json({ deals: await dealViews(db, caller, await listEpisodeDeals(db, caller.channelId, idOf(req, "episodeId"))) });
      },
    },
    {
      method: "post",
      path: `${base}/deals`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const input = parseBody(createDealSchema, req.body);
        res.status(201).json({ deal: await createDeal(db, callerOf(req), input) });
      },
    },
    {
      method: "get",
      path: deal,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        const caller = callerOf(req);
        await catchUpPublishDates(db, caller.channelId);
        res.json({ deal: await dealView(db, caller, idOf(req, "dealId")) });
      },
    },
    {
      method: "patch",
      path: deal,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const { version, input } = parseVersioned(updateDealSchema, req.body);
        res.json({ deal: await updateDeal(db, callerOf(req), idOf(req, "dealId"), version, input) });
      },
    },
    {
      method: "put",
      path: `${deal}/episode`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const { version, input } = parseVersioned(tieDealSchema, req.body);
        res.json({ deal: await tieDeal(db, callerOf(req), idOf(req, "dealId"), version, input) });
      },
    },
    {
      method: "put",
      path: `${deal}/money`,
      access: channelAccess("fees", "W"),
      handler: async (req, res) => {
        const { version, input } = parseVersioned(moneySchema, req.body);
        res.json({ deal: await updateMoney(db, callerOf(req), idOf(req, "dealId"), version, input) });
      },
    },
    {
      method: "put",
      path: `${deal}/cut`,
      access: channelAccess("cut", "W", "Only the editor, a producer or an owner can set the cut."),
      handler: async (req, res) => {
        const { version, input } = parseVersioned(cutSchema, req.body);
        res.json({ deal: await updateCut(db, callerOf(req), idOf(req, "dealId"), version, input) });
      },
    },
  ];
}
