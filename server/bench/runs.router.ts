import { runInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { memberOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { changeRun, createRun, episodeRuns, episodeRunsCsv, removeRun } from "./runs.service";

const runs = "/api/channels/:channelId/episodes/:episodeId/bench-runs";
const episodeOf = (req: { params: Record<string, unknown> }) => parseId(req.params.episodeId, "Episode");

/** A file name any system accepts: the episode's title in plain letters and digits. */
const fileName = (title: string) => `bench-runs-${title.normalize("NFKD").replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase().slice(0, 60) || "episode"}.csv`;

/** Bench runs: owner, producer and crew write; the editor reads (the spec's "bench" row). */
export function runsRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("bench", "R");
  const write = channelAccess("bench", "W");
  return [
    { method: "get", path: runs, access: read, handler: async (req, res) => res.json({ runs: await episodeRuns(db, memberOf(req).channelId, episodeOf(req)) }) },
    {
      method: "get",
      path: `${runs}.csv`,
      access: read,
      handler: async (req, res) => {
        const { title, csv } = await episodeRunsCsv(db, memberOf(req).channelId, episodeOf(req));
        // RFC 4180, section 3: text/csv, with the optional header parameter saying the first line names the columns.
        res.type("text/csv; charset=utf-8; header=present").attachment(fileName(title)).send(csv);
      },
    },
    {
      method: "post",
      path: runs,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const input = parseBody(runInputSchema, req.body);
        res.status(201).json({ run: await createRun(db, memberOf(req), episodeId, input) });
      },
    },
    {
      method: "put",
      path: `${runs}/:runId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const runId = parseId(req.params.runId, "Run");
        const input = parseBody(runInputSchema, req.body);
        res.json({ run: await changeRun(db, memberOf(req).channelId, episodeId, runId, input) });
      },
    },
    {
      method: "delete",
      path: `${runs}/:runId`,
      access: write,
      handler: async (req, res) => {
        await removeRun(db, memberOf(req).channelId, episodeOf(req), parseId(req.params.runId, "Run"));
        res.status(204).end();
      },
    },
  ];
}
