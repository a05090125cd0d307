import { reviewDecisionSchema, reviewPinSchema, sendReviewSchema } from "../../shared/sponsors/schemas";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { addPin, cutPlayer, decide, reviewPage, revokeLink, sendReviewLink, type ReviewDeps } from "./review.service";

const deal = "/api/channels/:channelId/deals/:dealId";

/** Review links: sent and withdrawn by the roles that run deliverables; the sponsor's page is public, its signed token the only key. */
export function reviewRoutes(review: ReviewDeps): RouteSpec[] {
  return [
    {
      method: "post",
      path: `${deal}/review-links`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const input = parseBody(sendReviewSchema, req.body);
        res.status(201).json(await sendReviewLink(review, callerOf(req), idOf(req, "dealId"), input));
      },
    },
    {
      method: "delete",
      path: `${deal}/review-links/:linkId`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        await revokeLink(review.db, callerOf(req), idOf(req, "dealId"), idOf(req, "linkId"));
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: "/api/review/:token",
      access: publicAccess,
      handler: async (req, res) => {
        res.set("Cache-Control", "no-store");
        res.json(await reviewPage(review, String(req.params.token)));
      },
    },
    {
      method: "post",
      path: "/api/review/:token/decision",
      access: publicAccess,
      handler: async (req, res) => {
        const input = parseBody(reviewDecisionSchema, req.body);
        res.json(await decide(review, String(req.params.token), input));
      },
    },
    {
      // A comment pinned to a moment of the segment, within the public routes' body limit.
      method: "post",
      path: "/api/review/:token/pins",
      access: publicAccess,
      handler: async (req, res) => {
        const input = parseBody(reviewPinSchema, req.body);
        res.status(201).json({ pin: await addPin(review, String(req.params.token), input) });
      },
    },
    {
      // The members' player of the cut the sponsor reviews (the pins come with the deal).
      method: "get",
      path: `${deal}/cut/player`,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        res.json(await cutPlayer(review, callerOf(req), idOf(req, "dealId")));
      },
    },
  ];
}
