import type { TestPlanInput, TestPlanView } from "@shared/bench/schemas";
import type { Versioned } from "@shared/http/version";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useSaveTestPlan = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (input: Versioned<TestPlanInput>) =>
    api<{ plan: TestPlanView }>(`${episodeBase(channelId, episodeId)}/test-plan`, { method: "PUT", body: input }).then((r) => r.plan),
  );
