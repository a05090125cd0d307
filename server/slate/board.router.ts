import type { EpisodeTitles } from "../../shared/slate/schemas";
import { boardFilterKeys, boardFiltersSchema } from "../../shared/slate/schemas";
import type { Database } from "../db/client";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import type { SlatePlugs } from "../seams/slate-plugs";
import { createBoardKeeper } from "./board.service";
import { episodeTitles } from "./episodes.repository";
import { peopleOf } from "./slate.repository";

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

/** The board, and the short lists pickers need: episode titles and the channel's people (the spec's "episodes" row). */
export function boardRoutes(db: Database, plugs: SlatePlugs): RouteSpec[] {
  const boards = createBoardKeeper();
  return [
    {
      method: "get",
      path: "/api/channels/:channelId/episodes",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const filters = boardFilters(req.query as Record<string, unknown>);
        // Our preference, not the header's order: browsers list gzip first but brotli is smaller.
        const encodings = (["br", "gzip"] as const).filter((name) => req.acceptsEncodings(name) === name);
        const board = await boards.load(db, plugs, callerOf(req).channelId, callerOf(req), filters, { encodings });
        res.set({ ETag: board.etag, "Cache-Control": "private, no-cache", Vary: "Accept-Encoding" }).type("json");
        if (req.fresh) return res.status(304).end();
        if ("encoding" in board) return res.set({ "Content-Encoding": board.encoding, "Content-Length": String(board.body.length) }).end(board.body);
        res.set("Content-Length", String(board.head.length + board.tail.length));
        res.write(board.head);
        res.end(board.tail);
      },
    },
    {
      method: "get",
      path: "/api/channels/:channelId/episode-titles",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        const answer: EpisodeTitles = { episodes: await episodeTitles(db, callerOf(req).channelId) };
        res.json(answer);
      },
    },
    {
      method: "get",
      path: "/api/channels/:channelId/slate/people",
      access: channelAccess("episodes", "R"),
      handler: async (req, res) => {
        res.json({ people: await peopleOf(db, callerOf(req).channelId) });
      },
    },
  ];
}
