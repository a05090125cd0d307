import { newDeliverableSchema, updateDeliverableSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { addDeliverable, removeDeliverable, updateDeliverable } from "./deliverables.service";

const base = "/api/channels/:channelId";

/** A deal's deliverables: owner and producer run them; whoever delivers the cut moves the cut items. */
export function deliverableRoutes(db: Database): RouteSpec[] {
  return [
    {
      method: "post",
      path: `${base}/deals/:dealId/deliverables`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const input = parseBody(newDeliverableSchema, req.body);
        res.status(201).json({ deal: await addDeliverable(db, callerOf(req), idOf(req, "dealId"), input) });
      },
    },
    {
      method: "patch",
      path: `${base}/deliverables/:deliverableId`,
      // Everyone who may write deliverables may write the cut too, so "cut" lets in both; the service
      // keeps a role that only delivers the cut to the status of the cut items.
      access: channelAccess("cut", "W", "Your role may read this item but not change it."),
      handler: async (req, res) => {
        const { version, input } = parseVersioned(updateDeliverableSchema, req.body);
        res.json({ deal: await updateDeliverable(db, callerOf(req), idOf(req, "deliverableId"), version, input) });
      },
    },
    {
      method: "delete",
      path: `${base}/deliverables/:deliverableId`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        await removeDeliverable(db, callerOf(req), idOf(req, "deliverableId"));
        res.status(204).end();
      },
    },
  ];
}
