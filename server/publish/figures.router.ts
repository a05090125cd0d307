import { figureColumnsSchema, figureDaySchema, figuresInputSchema } from "../../shared/publish/figures";
import { AppError } from "../http/app-error";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { changeFigureColumns, enterFigures, figuresView } from "./figures.service";
import type { PublishContext } from "./publish.context";

const figures = "/api/channels/:channelId/episodes/:episodeId/publish/figures";

function dayOf(value: unknown): number {
  const day = figureDaySchema.safeParse(value);
  if (!day.success) throw new AppError("validation_failed", "Some fields need attention.", { day: "The day is a whole number of days after go-live, up to ten years." });
  return day.data;
}

/** The figures after go-live (the publish package's row of the spec), and the channel's export columns. */
export function figureRoutes(ctx: PublishContext): RouteSpec[] {
  return [
    {
      method: "get",
      path: figures,
      access: channelAccess("publish", "R"),
      handler: async (req, res) => res.json({ figures: await figuresView(ctx, ctx.db, callerOf(req).channelId, idOf(req, "episodeId")) }),
    },
    {
      method: "put",
      path: `${figures}/:day`,
      access: channelAccess("publish", "W"),
      valueParams: ["day"],
      handler: async (req, res) => {
        const input = parseBody(figuresInputSchema, req.body);
        res.json({ figures: await enterFigures(ctx, callerOf(req), idOf(req, "episodeId"), dayOf(req.params.day), input) });
      },
    },
    {
      method: "put",
      path: "/api/channels/:channelId/publish/figure-columns",
      access: channelAccess("publish", "W"),
      handler: async (req, res) => {
        const columns = parseBody(figureColumnsSchema, req.body);
        res.json({ columns: await changeFigureColumns(ctx, callerOf(req).channelId, columns) });
      },
    },
  ];
}
