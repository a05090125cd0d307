import { criterionInputSchema, hazardChangeSchema, hazardInputSchema, testPlanInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { memberOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { addCriterion, addHazard, changeCriterion, changeHazard, removeCriterion, removeHazard, saveTestPlan, testPlanView } from "./test-plan.service";

const plan = "/api/channels/:channelId/episodes/:episodeId/test-plan";
const episodeOf = (req: { params: Record<string, unknown> }) => parseId(req.params.episodeId, "Episode");

/** The test plan sheet: owner and producer write, editor and crew read (the spec's "test plan sheet" row). */
export function testPlanRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("testPlan", "R");
  const write = channelAccess("testPlan", "W");
  return [
    {
      method: "get",
      path: plan,
      access: read,
      handler: async (req, res) => res.json({ plan: await testPlanView(db, memberOf(req).channelId, episodeOf(req)) }),
    },
    {
      method: "put",
      path: plan,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const input = parseBody(testPlanInputSchema, req.body);
        res.json({ plan: await saveTestPlan(db, memberOf(req), episodeId, input) });
      },
    },
    {
      method: "post",
      path: `${plan}/criteria`,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const criterion = parseBody(criterionInputSchema, req.body);
        res.status(201).json({ criterion: await addCriterion(db, memberOf(req).channelId, episodeId, criterion) });
      },
    },
    {
      method: "put",
      path: `${plan}/criteria/:criterionId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const criterionId = parseId(req.params.criterionId, "Criterion");
        const criterion = parseBody(criterionInputSchema, req.body);
        res.json({ criterion: await changeCriterion(db, memberOf(req).channelId, episodeId, criterionId, criterion) });
      },
    },
    {
      method: "delete",
      path: `${plan}/criteria/:criterionId`,
      access: write,
      handler: async (req, res) => {
        await removeCriterion(db, memberOf(req).channelId, episodeOf(req), parseId(req.params.criterionId, "Criterion"));
        res.status(204).end();
      },
    },
    {
      method: "post",
      path: `${plan}/hazards`,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const hazard = parseBody(hazardInputSchema, req.body);
        res.status(201).json({ hazard: await addHazard(db, memberOf(req).channelId, episodeId, hazard) });
      },
    },
    {
      method: "patch",
      path: `${plan}/hazards/:hazardId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = episodeOf(req);
        const hazardId = parseId(req.params.hazardId, "Hazard");
        const change = parseBody(hazardChangeSchema, req.body);
        res.json({ hazard: await changeHazard(db, memberOf(req), episodeId, hazardId, change) });
      },
    },
    {
      method: "delete",
      path: `${plan}/hazards/:hazardId`,
      access: write,
      handler: async (req, res) => {
        await removeHazard(db, memberOf(req).channelId, episodeOf(req), parseId(req.params.hazardId, "Hazard"));
        res.status(204).end();
      },
    },
  ];
}
