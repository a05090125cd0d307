import { queryOptions, useQuery } from "@tanstack/react-query";
import type { IterationView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase } from "./bench-mutation";
import { benchKeys } from "./keys";

export const buildLogQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: benchKeys.buildLog(channelId, episodeId),
    queryFn: () => api<{ iterations: IterationView[] }>(`${episodeBase(channelId, episodeId)}/build-log`).then((r) => r.iterations),
  });

export const useBuildLog = (channelId: string, episodeId: string) => useQuery(buildLogQueryOptions(channelId, episodeId));
