import { iterationInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { memberOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { addIteration, buildLog, changeIteration, removeIteration } from "./build-log.service";

const log = "/api/channels/:channelId/episodes/:episodeId/build-log";
const episodeOf = (req: { params: Record<string, unknown> }) => parseId(req.params.episodeId, "Episode");

/** The build log: owner, producer and crew write; the editor reads (the spec's "bench" row). */
export function buildLogRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("bench", "R");
  const write = channelAccess("bench", "W");
  return [
    { method: "get", path: log, access: read, handler: async (req, res) => res.json({ iterations: await buildLog(db, memberOf(req).channelId, episodeOf(req)) }) },
    {
      method: "post",
      path: log,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const input = parseBody(iterationInputSchema, req.body);
        res.status(201).json({ iteration: await addIteration(db, memberOf(req), episodeId, input) });
      },
    },
    {
      method: "put",
      path: `${log}/:iterationId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const iterationId = parseId(req.params.iterationId, "Iteration");
        const input = parseBody(iterationInputSchema, req.body);
        res.json({ iteration: await changeIteration(db, memberOf(req).channelId, episodeId, iterationId, input) });
      },
    },
    {
      method: "delete",
      path: `${log}/:iterationId`,
      access: write,
      handler: async (req, res) => {
        await removeIteration(db, memberOf(req).channelId, episodeOf(req), parseId(req.params.iterationId, "Iteration"));
        res.status(204).end();
      },
    },
  ];
}
