import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RunView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase } from "./bench-mutation";
import { benchKeys } from "./keys";

export const runsQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: benchKeys.runs(channelId, episodeId),
    queryFn: () => api<{ runs: RunView[] }>(`${episodeBase(channelId, episodeId)}/bench-runs`).then((r) => r.runs),
  });

export const useRuns = (channelId: string, episodeId: string) => useQuery(runsQueryOptions(channelId, episodeId));
