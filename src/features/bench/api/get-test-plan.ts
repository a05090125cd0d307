import { queryOptions, useQuery } from "@tanstack/react-query";
import type { TestPlanView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase } from "./bench-mutation";
import { benchKeys } from "./keys";

export const testPlanQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: benchKeys.testPlan(channelId, episodeId),
    queryFn: () => api<{ plan: TestPlanView }>(`${episodeBase(channelId, episodeId)}/test-plan`).then((r) => r.plan),
  });

export const useTestPlan = (channelId: string, episodeId: string) => useQuery(testPlanQueryOptions(channelId, episodeId));
