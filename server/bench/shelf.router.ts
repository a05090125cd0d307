import { partInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { addPart, changePart, partPage, removePart, shelf } from "./shelf.service";

const parts = "/api/channels/:channelId/bench/parts";

/** The bench shelf: owner, producer and crew write; the editor reads (the spec's "bench" row). */
export function shelfRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("bench", "R");
  const write = channelAccess("bench", "W");
  return [
    { method: "get", path: parts, access: read, handler: async (req, res) => res.json({ parts: await shelf(db, callerOf(req).channelId) }) },
    {
      method: "post",
      path: parts,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(partInputSchema, req.body);
        res.status(201).json({ part: await addPart(db, callerOf(req).channelId, input) });
      },
    },
    {
      method: "get",
      path: `${parts}/:partId`,
      access: read,
      handler: async (req, res) => res.json(await partPage(db, callerOf(req).channelId, idOf(req, "partId"))),
    },
    {
      method: "put",
      path: `${parts}/:partId`,
      access: write,
      handler: async (req, res) => {
        const partId = idOf(req, "partId");
        const { version, input } = parseVersioned(partInputSchema, req.body);
        res.json({ part: await changePart(db, callerOf(req).channelId, partId, version, input) });
      },
    },
    {
      method: "delete",
      path: `${parts}/:partId`,
      access: write,
      handler: async (req, res) => {
        await removePart(db, callerOf(req).channelId, idOf(req, "partId"));
        res.status(204).end();
      },
    },
  ];
}
