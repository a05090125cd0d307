import { declineSchema, ideaWordingSchema, judgementSchema, mergeSchema } from "../../shared/intake/schemas";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { decideIdea, ideaDetail, judgeIdea, listIdeas, mergeIdeas, promoteIdea, splitSuggestion, type IdeasContext } from "./ideas.service";
import { addByHand } from "./suggestions.service";

const base = "/api/channels/:channelId/intake";
const idea = `${base}/ideas/:ideaId`;

/** Ideas and their suggestions: any member reads, enters, groups and weighs; putting one on the slate needs episodes W. */
export function ideaRoutes(ctx: IdeasContext): RouteSpec[] {
  const { db } = ctx;
  const read = channelAccess("intake", "R");
  const write = channelAccess("intake", "W");
  return [
    { method: "get", path: `${base}/ideas`, access: read, handler: async (req, res) => res.json(await listIdeas(db, callerOf(req), req.query)) },
    { method: "get", path: idea, access: read, handler: async (req, res) => res.json(await ideaDetail(db, callerOf(req), idOf(req, "ideaId"))) },
    { method: "post", path: `${base}/suggestions`, access: write, handler: async (req, res) => res.status(201).json(await addByHand(db, callerOf(req), req.body)) },
    {
      method: "post",
      path: `${idea}/merge`,
      access: write,
      handler: async (req, res) => res.json({ idea: await mergeIdeas(db, callerOf(req), idOf(req, "ideaId"), parseBody(mergeSchema, req.body).otherIdeaId) }),
    },
    {
      method: "post",
      path: `${base}/suggestions/:suggestionId/split`,
      access: write,
      body: "none",
      handler: async (req, res) => res.status(201).json({ idea: await splitSuggestion(db, callerOf(req), idOf(req, "suggestionId")) }),
    },
    {
      method: "put",
      path: `${idea}/judgement`,
      access: write,
      handler: async (req, res) => res.json({ idea: await judgeIdea(db, callerOf(req), idOf(req, "ideaId"), parseBody(judgementSchema, req.body)) }),
    },
    {
      method: "put",
      path: `${idea}/wording`,
      access: write,
      handler: async (req, res) => res.json({ idea: await decideIdea(db, callerOf(req), idOf(req, "ideaId"), parseBody(ideaWordingSchema, req.body)) }),
    },
    {
      method: "post",
      path: `${idea}/decline`,
      access: write,
      handler: async (req, res) => res.json({ idea: await decideIdea(db, callerOf(req), idOf(req, "ideaId"), { status: "declined", reason: parseBody(declineSchema, req.body).reason }) }),
    },
    { method: "post", path: `${idea}/park`, access: write, body: "none", handler: async (req, res) => res.json({ idea: await decideIdea(db, callerOf(req), idOf(req, "ideaId"), { status: "parked" }) }) },
    { method: "post", path: `${idea}/reopen`, access: write, body: "none", handler: async (req, res) => res.json({ idea: await decideIdea(db, callerOf(req), idOf(req, "ideaId"), { status: "open" }) }) },
    {
      method: "post",
      path: `${idea}/promote`,
      access: channelAccess("episodes", "W", "Crew can weigh ideas but not put them on the slate."),
      body: "none",
      handler: async (req, res) => res.status(201).json(await promoteIdea(ctx, callerOf(req), idOf(req, "ideaId"))),
    },
  ];
}
