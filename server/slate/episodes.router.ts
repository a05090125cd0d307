import { z } from "zod";
import { dueOverrideSchema, episodeChangesSchema, episodeFieldsSchema, moveEpisodeSchema, versionOnlySchema } from "../../shared/slate/schemas";
import { stages } from "../../shared/slate/stages";
import type { Database } from "../db/client";
import { AppError } from "../http/app-error";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import type { SlatePlugs } from "../seams/slate-plugs";
import { createEpisode, editEpisode, episodeDetail, episodeHistory, move, overrideDueDate, setArchived, toRecord } from "./episodes.service";

const episodePath = "/api/channels/:channelId/episodes/:episodeId";
const stageParam = z.enum(stages, { error: "No such stage." });

/** An episode: its fields, stage moves, archive, due dates and history (the spec's "episodes" row). */
export function episodeRoutes(db: Database, plugs: SlatePlugs): RouteSpec[] {
  return [
    {
      method: "post",
      path: "/api/channels/:channelId/episodes",
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const fields = parseBody(episodeFieldsSchema, req.body);
        const row = await createEpisode(db, callerOf(req), fields);
        res.status(201).json({ episode: toRecord(row) });
      },
    },
    {
      method: "get",
      path: episodePath,
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const caller = callerOf(req);
        res.json(await episodeDetail(db, plugs.boardFlags, caller.channelId, idOf(req, "episodeId"), caller.timeZone));
      },
    },
    {
      method: "patch",
      path: episodePath,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const changes = parseBody(episodeChangesSchema, req.body);
        res.json({ episode: toRecord(await editEpisode(db, plugs.publishDateFollowers, callerOf(req), episodeId, changes)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/move`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const input = parseBody(moveEpisodeSchema, req.body);
        res.json({ episode: toRecord(await move(db, plugs.stageGates, callerOf(req), episodeId, input)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/archive`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const { version } = parseBody(versionOnlySchema, req.body);
        res.json({ episode: toRecord(await setArchived(db, callerOf(req), episodeId, version, true)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/restore`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const { version } = parseBody(versionOnlySchema, req.body);
        res.json({ episode: toRecord(await setArchived(db, callerOf(req), episodeId, version, false)) });
      },
    },
    {
      method: "put",
      path: `${episodePath}/due-dates/:stage`,
      access: channelAccess("episodes", "W"),
      valueParams: ["stage"],
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const stage = stageParam.safeParse(req.params.stage);
        if (!stage.success) throw new AppError("not_found", "No such stage.");
        const input = parseBody(dueOverrideSchema, req.body);
        res.json({ episode: toRecord(await overrideDueDate(db, callerOf(req), episodeId, stage.data, input)) });
      },
    },
    {
      method: "get",
      path: `${episodePath}/history`,
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        res.json(await episodeHistory(db, callerOf(req).channelId, idOf(req, "episodeId")));
      },
    },
  ];
}
