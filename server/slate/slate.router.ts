import { z } from "zod";
import { boardFilterKeys, boardFiltersSchema, commentSchema, dueOverrideSchema, episodeChangesSchema, episodeFieldsSchema, moveEpisodeSchema, versionOnlySchema } from "../../shared/slate/schemas";
import { stageLengthsSchema } from "../../shared/slate/schedule";
import { stages } from "../../shared/slate/stages";
import type { AppDeps } from "../app";
import { AppError } from "../http/app-error";
import { memberOf, signedInUser } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { loadBoard } from "./board.service";
import { addComment, listComments } from "./comments.service";
import { createEpisode, editEpisode, episodeDetail, episodeHistory, move, overrideDueDate, setArchived, toRecord } from "./episodes.service";
import { peopleOf, saveStageLengths, slateStateOf } from "./slate.repository";

const episodePath = "/api/channels/:channelId/episodes/:episodeId";
const stageParam = z.enum(stages, { error: "No such stage." });
const stageLengthsBody = z.strictObject({ stageLengths: stageLengthsSchema });

/** The query string's first value for each filter; anything else in it is ignored. */
function boardFilters(query: Record<string, unknown>) {
  const picked = Object.fromEntries(
    boardFilterKeys.flatMap((key) => {
      const value = Array.isArray(query[key]) ? query[key][0] : query[key];
      return typeof value === "string" && value !== "" ? [[key, value]] : [];
    }),
  );
  return parseBody(boardFiltersSchema, picked);
}

/** The board, the episode page and its schedule, history and comments. */
export function slateRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  const commentDeps = { db, appUrl: deps.env.APP_URL, jobs: deps.jobs };
  const episodeIdOf = (req: Parameters<RouteSpec["handler"]>[0]) => parseId(req.params.episodeId, "Episode");
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/episodes",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const filters = boardFilters(req.query as Record<string, unknown>);
        // Our preference, not the header's order: browsers list gzip first but brotli is smaller.
        const encoding = (["br", "gzip"] as const).find((name) => req.acceptsEncodings(name) === name) ?? null;
        const board = await loadBoard(db, memberOf(req).channelId, signedInUser(req), filters, { encoding });
        res.set({ ETag: board.etag, "Cache-Control": "private, no-cache", Vary: "Accept-Encoding" }).type("json");
        if (req.fresh) return res.status(304).end();
        if ("encoding" in board) return res.set({ "Content-Encoding": board.encoding, "Content-Length": String(board.body.length) }).end(board.body);
        res.set("Content-Length", String(board.head.length + board.tail.length));
        res.write(board.head);
        res.end(board.tail);
      },
    },
    {
      method: "post",
      path: "/api/channels/:channelId/episodes",
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const fields = parseBody(episodeFieldsSchema, req.body);
        const row = await createEpisode(db, memberOf(req), fields);
        res.status(201).json({ episode: toRecord(row) });
      },
    },
    {
      method: "get",
      path: episodePath,
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        res.json(await episodeDetail(db, memberOf(req).channelId, episodeIdOf(req), signedInUser(req).timeZone));
      },
    },
    {
      method: "patch",
      path: episodePath,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = episodeIdOf(req);
        const changes = parseBody(episodeChangesSchema, req.body);
        res.json({ episode: toRecord(await editEpisode(db, memberOf(req), episodeId, changes)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/move`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = episodeIdOf(req);
        const input = parseBody(moveEpisodeSchema, req.body);
        res.json({ episode: toRecord(await move(db, memberOf(req), episodeId, input)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/archive`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = episodeIdOf(req);
        const { version } = parseBody(versionOnlySchema, req.body);
        res.json({ episode: toRecord(await setArchived(db, memberOf(req), episodeId, version, true)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/restore`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = episodeIdOf(req);
        const { version } = parseBody(versionOnlySchema, req.body);
        res.json({ episode: toRecord(await setArchived(db, memberOf(req), episodeId, version, false)) });
      },
    },
    {
      method: "put",
      path: `${episodePath}/due-dates/:stage`,
      access: channelAccess("episodes", "W"),
      handler: async (req, res) => {
        const episodeId = episodeIdOf(req);
        const stage = stageParam.safeParse(req.params.stage);
        if (!stage.success) throw new AppError("not_found", "No such stage.");
        const input = parseBody(dueOverrideSchema, req.body);
        res.json({ episode: toRecord(await overrideDueDate(db, memberOf(req), episodeId, stage.data, input)) });
      },
    },
    {
      method: "get",
      path: `${episodePath}/history`,
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        res.json(await episodeHistory(db, memberOf(req).channelId, episodeIdOf(req)));
      },
    },
    {
      method: "get",
      path: `${episodePath}/comments`,
      access: channelAccess("comments", "R"),
      handler: async (req, res) => {
        res.json({ comments: await listComments(db, memberOf(req).channelId, episodeIdOf(req)) });
      },
    },
    {
      method: "post",
      path: `${episodePath}/comments`,
      access: channelAccess("comments", "W"),
      handler: async (req, res) => {
        const episodeId = episodeIdOf(req);
        const { body } = parseBody(commentSchema, req.body);
        const comment = await addComment(commentDeps, memberOf(req), signedInUser(req), episodeId, body);
        res.status(201).json({ comment });
      },
    },
    {
      method: "get",
      path: "/api/channels/:channelId/slate/people",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        res.json({ people: await peopleOf(db, memberOf(req).channelId) });
      },
    },
    {
      // Stage lengths are channel settings: owner W, producer R (the spec's members and settings row).
      method: "get",
      path: "/api/channels/:channelId/slate/settings",
      access: channelAccess("members", "R"),
      handler: async (req, res) => {
        const { stageLengths, custom } = await slateStateOf(db, memberOf(req).channelId);
        res.json({ stageLengths, custom });
      },
    },
    {
      method: "put",
      path: "/api/channels/:channelId/slate/settings",
      access: channelAccess("members", "W"),
      handler: async (req, res) => {
        const { stageLengths } = parseBody(stageLengthsBody, req.body);
        await saveStageLengths(db, memberOf(req).channelId, stageLengths);
        res.json({ stageLengths, custom: true });
      },
    },
  ];
}
