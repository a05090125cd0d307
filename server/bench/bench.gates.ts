import type { GateProblem } from "../../shared/slate/gates";
import { leavesStageForward, type StageGate } from "../seams/stage-gates";
import { findPlan, listCriteria } from "./test-plan.repository";

/** Leaving the test plan stage (or jumping past it) without a hypothesis or a required criterion asks for confirmation. */
export const testPlanEssentials: StageGate = {
  name: "test_plan.essentials",
  applies: (from, to) => leavesStageForward("test_plan", from, to),
  async check({ db, channelId, episodeId }) {
    const [plan, criteria] = await Promise.all([findPlan(db, channelId, episodeId), listCriteria(db, channelId, episodeId)]);
    const problems: GateProblem[] = [];
    if (!plan?.hypothesis.trim()) {
      problems.push({ code: "test_plan.no_hypothesis", message: "The test plan has no hypothesis yet." });
    }
    if (!criteria.some((criterion) => criterion.definition.required)) {
      problems.push({ code: "test_plan.no_required_criterion", message: "The test plan has no required pass criterion yet." });
    }
    return problems;
  },
};

/** Test-plan essentials checked when an episode leaves the test plan stage. */
export const benchGates: StageGate[] = [testPlanEssentials];
