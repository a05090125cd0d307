import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { type CardContext, cardColours, cardView, changeCardColours, requestCard } from "./results-card.service";

const card = "/api/channels/:channelId/episodes/:episodeId/results-card";
const colours = "/api/channels/:channelId/results-card-colours";

/** The results card: those who write the bench ask for it; everyone who reads the bench gets it. */
export function resultsCardRoutes(ctx: CardContext): RouteSpec[] {
  return [
    { method: "get", path: card, access: channelAccess("bench", "R"), handler: async (req, res) => res.json({ card: await cardView(ctx, ctx.db, callerOf(req).channelId, idOf(req, "episodeId")) }) },
    { method: "post", path: card, access: channelAccess("bench", "W"), handler: async (req, res) => res.status(202).json({ card: await requestCard(ctx, callerOf(req), idOf(req, "episodeId")) }) },
    // The card's colours are the channel's look in the video: those who publish set them.
    { method: "get", path: colours, access: channelAccess("bench", "R"), handler: async (req, res) => res.json(await cardColours(ctx.db, callerOf(req).channelId)) },
    { method: "put", path: colours, access: channelAccess("publish", "W"), handler: async (req, res) => res.json(await changeCardColours(ctx.db, callerOf(req).channelId, req.body)) },
  ];
}
