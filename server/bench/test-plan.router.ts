import { criterionInputSchema, hazardChangeSchema, hazardCheckSchema, hazardInputSchema, testPlanInputSchema } from "../../shared/bench/schemas";
import type { Database } from "../db/client";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { addCriterion, addHazard, changeCriterion, changeHazard, removeCriterion, removeHazard, saveTestPlan, testPlanView } from "./test-plan.service";

const plan = "/api/channels/:channelId/episodes/:episodeId/test-plan";

/**
 * The test plan sheet: owner and producer write, editor and crew read (the spec's "test plan sheet" row).
 * Checking a listed hazard is the "safety checks" row: crew check at power-on too.
 */
export function testPlanRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("testPlan", "R");
  const write = channelAccess("testPlan", "W");
  return [
    {
      method: "get",
      path: plan,
      access: read,
      handler: async (req, res) => res.json({ plan: await testPlanView(db, callerOf(req).channelId, idOf(req, "episodeId")) }),
    },
    {
      method: "put",
      path: plan,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const { version, input } = parseVersioned(testPlanInputSchema, req.body);
        res.json({ plan: await saveTestPlan(db, callerOf(req), episodeId, version, input) });
      },
    },
    {
      method: "post",
      path: `${plan}/criteria`,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const criterion = parseBody(criterionInputSchema, req.body);
        res.status(201).json({ criterion: await addCriterion(db, callerOf(req).channelId, episodeId, criterion) });
      },
    },
    {
      method: "put",
      path: `${plan}/criteria/:criterionId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const criterionId = idOf(req, "criterionId");
        const { version, input } = parseVersioned(criterionInputSchema, req.body);
        res.json({ criterion: await changeCriterion(db, callerOf(req).channelId, episodeId, criterionId, version, input) });
      },
    },
    {
      method: "delete",
      path: `${plan}/criteria/:criterionId`,
      access: write,
      handler: async (req, res) => {
        await removeCriterion(db, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "criterionId"));
        res.status(204).end();
      },
    },
    {
      method: "post",
      path: `${plan}/hazards`,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const hazard = parseBody(hazardInputSchema, req.body);
        res.status(201).json({ hazard: await addHazard(db, callerOf(req).channelId, episodeId, hazard) });
      },
    },
    {
      method: "patch",
      path: `${plan}/hazards/:hazardId`,
      access: write,
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const hazardId = idOf(req, "hazardId");
        const change = parseBody(hazardChangeSchema, req.body);
        res.json({ hazard: await changeHazard(db, callerOf(req), episodeId, hazardId, change) });
      },
    },
    {
      method: "put",
      path: `${plan}/hazards/:hazardId/check`,
      access: channelAccess("safetyChecks", "W"),
      handler: async (req, res) => {
        const { checked } = parseBody(hazardCheckSchema, req.body);
        res.json({ hazard: await changeHazard(db, callerOf(req), idOf(req, "episodeId"), idOf(req, "hazardId"), { checked }) });
      },
    },
    {
      method: "delete",
      path: `${plan}/hazards/:hazardId`,
      access: write,
      handler: async (req, res) => {
        await removeHazard(db, callerOf(req).channelId, idOf(req, "episodeId"), idOf(req, "hazardId"));
        res.status(204).end();
      },
    },
  ];
}
