import { dealRateSchema, newEntrySchema } from "../../shared/economics/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import type { Storage } from "../storage/storage";
import { addEntry, addReceipt, episodeMoney, removeEntry, setDealRate } from "./entries.service";

const money = "/api/channels/:channelId/episodes/:episodeId/money";

/** An episode's costs and income: owner and producer only (the spec's "costs and income of episodes"). */
export function episodeMoneyRoutes(db: Database, storage: Storage): RouteSpec[] {
  const read = channelAccess("money", "R");
  const write = channelAccess("money", "W");
  return [
    { method: "get", path: money, access: read, handler: async (req, res) => res.json({ money: await episodeMoney(db, storage, callerOf(req).channelId, idOf(req, "episodeId")) }) },
    {
      method: "post",
      path: `${money}/entries`,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(newEntrySchema, req.body);
        res.status(201).json({ entry: await addEntry(db, callerOf(req), idOf(req, "episodeId"), input) });
      },
    },
    {
      method: "delete",
      path: `${money}/entries/:entryId`,
      access: write,
      handler: async (req, res) => {
        await removeEntry(db, storage, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "entryId"));
        res.status(204).end();
      },
    },
    {
      method: "post",
      path: `${money}/entries/:entryId/receipt`,
      access: write,
      body: "multipart",
      handler: async (req, res) => {
        res.status(201).json({ receipt: await addReceipt(db, storage, callerOf(req), idOf(req, "episodeId"), idOf(req, "entryId"), req, res) });
      },
    },
    {
      method: "put",
      path: `${money}/deals/:dealId/rate`,
      access: write,
      handler: async (req, res) => {
        const { rate } = parseBody(dealRateSchema, req.body);
        await setDealRate(db, callerOf(req), idOf(req, "episodeId"), idOf(req, "dealId"), rate!);
        res.status(204).end();
      },
    },
  ];
}
