import { runInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { changeRun, createRun, episodeRuns, episodeRunsCsv, removeRun } from "./runs.service";

const runs = "/api/channels/:channelId/episodes/:episodeId/bench-runs";

/** A file name any system accepts: the episode's title in plain letters and digits. */
const fileName = (title: string) => `bench-runs-${title.normalize("NFKD").replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase().slice(0, 60) || "episode"}.csv`;

/** Bench runs: owner, producer and crew write; the editor reads (the spec's "bench" row). */
export function runsRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("bench", "R");
  const write = channelAccess("bench", "W");
  return [
    { method: "get", path: runs, access: read, handler: async (req, res) => res.json({ runs: await episodeRuns(db, callerOf(req).channelId, idOf(req, "episodeId")) }) },
    {
      method: "get",
      path: `${runs}.csv`,
      access: read,
      handler: async (req, res) => {
        const { title, csv } = await episodeRunsCsv(db, callerOf(req).channelId, idOf(req, "episodeId"));
        // RFC 4180, section 3: text/csv, with the optional header parameter saying the first line names the columns.
        res.type("text/csv; charset=utf-8; header=present").attachment(fileName(title)).send(csv);
      },
    },
    {
      method: "post",
      path: runs,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const input = parseBody(runInputSchema, req.body);
        res.status(201).json({ run: await createRun(db, callerOf(req), episodeId, input) });
      },
    },
    {
      method: "put",
      path: `${runs}/:runId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const runId = idOf(req, "runId");
        const { version, input } = parseVersioned(runInputSchema, req.body);
        res.json({ run: await changeRun(db, callerOf(req).channelId, episodeId, runId, version, input) });
      },
    },
    {
      method: "delete",
      path: `${runs}/:runId`,
      access: write,
      handler: async (req, res) => {
        await removeRun(db, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "runId"));
        res.status(204).end();
      },
    },
  ];
}
