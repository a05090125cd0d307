import { iterationInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import type { Storage } from "../storage/storage";
import { addIteration, buildLog, changeIteration, removeIteration } from "./build-log.service";

const log = "/api/channels/:channelId/episodes/:episodeId/build-log";

/** The build log: owner, producer and crew write; the editor reads (the spec's "bench" row). */
export function buildLogRoutes(db: Database, storage: Storage): RouteSpec[] {
  const read = channelAccess("bench", "R");
  const write = channelAccess("bench", "W");
  return [
    { method: "get", path: log, access: read, handler: async (req, res) => res.json({ iterations: await buildLog(db, callerOf(req).channelId, idOf(req, "episodeId")) }) },
    {
      method: "post",
      path: log,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const input = parseBody(iterationInputSchema, req.body);
        res.status(201).json({ iteration: await addIteration(db, callerOf(req), episodeId, input) });
      },
    },
    {
      method: "put",
      path: `${log}/:iterationId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const iterationId = idOf(req, "iterationId");
        const { version, input } = parseVersioned(iterationInputSchema, req.body);
        res.json({ iteration: await changeIteration(db, callerOf(req).channelId, episodeId, iterationId, version, input) });
      },
    },
    {
      method: "delete",
      path: `${log}/:iterationId`,
      access: write,
      handler: async (req, res) => {
        await removeIteration(db, storage, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "iterationId"));
        res.status(204).end();
      },
    },
  ];
}
