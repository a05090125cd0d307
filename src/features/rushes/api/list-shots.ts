import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ShotView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";
import { shootBase } from "./shoot-mutation";

export const shotsQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: rushesKeys.shots(channelId, episodeId),
    queryFn: () => api<{ shots: ShotView[] }>(`${shootBase(channelId)}/episodes/${episodeId}/shots`).then((r) => r.shots),
  });

export const useShots = (channelId: string, episodeId: string) => useQuery(shotsQueryOptions(channelId, episodeId));
