import type { Request } from "express";
import {
  createDealSchema,
  cutSchema,
  deskFilterSchema,
  moneySchema,
  newDeliverableSchema,
  reviewDecisionSchema,
  sendReviewSchema,
  updateDealSchema,
  updateDeliverableSchema,
} from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { AppError, notFound } from "../http/app-error";
import { memberOf, signedInUser } from "../http/guards";
import { channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { findEpisodeInChannel, listEpisodeDeals } from "./deals.repository";
import { createDeal, dealView, dealViews, updateCut, updateDeal, updateMoney, type Viewer } from "./deals.service";
import { addDeliverable, removeDeliverable, updateDeliverable } from "./deliverables.service";
import { desk } from "./desk.service";
import { decide, reviewPage, revokeLink, sendReviewLink, type ReviewDeps } from "./review.service";
import { catchUpPublishDates } from "./schedule.service";

export function viewerOf(req: Request): Viewer {
  const member = memberOf(req);
  const user = signedInUser(req);
  return { channelId: member.channelId, userId: user.id, name: user.name, email: user.email, emailVerified: user.emailVerified, role: member.role, timeZone: user.timeZone };
}

const base = "/api/channels/:channelId";

function parseFilter(query: Request["query"]) {
  const filter = deskFilterSchema.safeParse({
    sponsorId: typeof query.sponsorId === "string" && query.sponsorId !== "" ? query.sponsorId : undefined,
    episodeId: typeof query.episodeId === "string" && query.episodeId !== "" ? query.episodeId : undefined,
  });
  if (!filter.success) throw new AppError("validation_failed", "The desk's filter names no sponsor or episode.");
  return filter.data;
}

/** Deals, their deliverables, review links and the desk. Thin: validate, authorise, call, answer. */
export function dealRoutes(db: Database, review: ReviewDeps): RouteSpec[] {
  return [
    {
      method: "get",
      path: `${base}/episodes/:episodeId/deals`,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        const viewer = viewerOf(req);
        const episodeId = parseId(req.params.episodeId, "Episode");
        if (!(await findEpisodeInChannel(db, viewer.channelId, episodeId))) throw notFound("Episode");
        await catchUpPublishDates(db, viewer.channelId);
        res.json({ deals: await dealViews(db, viewer, await listEpisodeDeals(db, viewer.channelId, episodeId)) });
      },
    },
    {
      method: "post",
      path: `${base}/deals`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const input = parseBody(createDealSchema, req.body);
        res.status(201).json({ deal: await createDeal(db, viewerOf(req), input) });
      },
    },
    {
      method: "get",
      path: `${base}/deals/:dealId`,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        const viewer = viewerOf(req);
        await catchUpPublishDates(db, viewer.channelId);
        res.json({ deal: await dealView(db, viewer, parseId(req.params.dealId, "Deal")) });
      },
    },
    {
      method: "patch",
      path: `${base}/deals/:dealId`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const dealId = parseId(req.params.dealId, "Deal");
        const input = parseBody(updateDealSchema, req.body);
        res.json({ deal: await updateDeal(db, viewerOf(req), dealId, input) });
      },
    },
    {
      method: "put",
      path: `${base}/deals/:dealId/money`,
      access: channelAccess("fees", "W"),
      handler: async (req, res) => {
        const dealId = parseId(req.params.dealId, "Deal");
        const input = parseBody(moneySchema, req.body);
        res.json({ deal: await updateMoney(db, viewerOf(req), dealId, input) });
      },
    },
    {
      method: "put",
      path: `${base}/deals/:dealId/cut`,
      // Read access lets the editor in; the service allows the roles that deliver the cut.
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => {
        const dealId = parseId(req.params.dealId, "Deal");
        const viewer = viewerOf(req);
        if (viewer.role === "crew") throw new AppError("forbidden", "Only the editor, a producer or an owner can set the cut.");
        const input = parseBody(cutSchema, req.body);
        res.json({ deal: await updateCut(db, viewer, dealId, input) });
      },
    },
    {
      method: "post",
      path: `${base}/deals/:dealId/deliverables`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const dealId = parseId(req.params.dealId, "Deal");
        const input = parseBody(newDeliverableSchema, req.body);
        const viewer = viewerOf(req);
        await addDeliverable(db, viewer, dealId, input);
        res.status(201).json({ deal: await dealView(db, viewer, dealId) });
      },
    },
    {
      method: "patch",
      path: `${base}/deliverables/:deliverableId`,
      // Read access lets the editor reach the cut items they deliver; the service says what each role may change.
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => {
        const deliverableId = parseId(req.params.deliverableId, "Deliverable");
        const viewer = viewerOf(req);
        if (viewer.role === "crew") throw new AppError("forbidden", "Your role may read this item but not change it.");
        const input = parseBody(updateDeliverableSchema, req.body);
        const dealId = await updateDeliverable(db, viewer, deliverableId, input);
        res.json({ deal: await dealView(db, viewer, dealId) });
      },
    },
    {
      method: "delete",
      path: `${base}/deliverables/:deliverableId`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        await removeDeliverable(db, viewerOf(req), parseId(req.params.deliverableId, "Deliverable"));
        res.status(204).end();
      },
    },
    {
      method: "post",
      path: `${base}/deals/:dealId/review-links`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const dealId = parseId(req.params.dealId, "Deal");
        const input = parseBody(sendReviewSchema, req.body);
        res.status(201).json(await sendReviewLink(review, viewerOf(req), dealId, input));
      },
    },
    {
      method: "delete",
      path: `${base}/deals/:dealId/review-links/:linkId`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        await revokeLink(db, viewerOf(req), parseId(req.params.dealId, "Deal"), parseId(req.params.linkId, "Review link"));
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
      method: "get",
      path: `${base}/desk`,
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => res.json(await desk(db, viewerOf(req), parseFilter(req.query))),
    },
  ];
}
