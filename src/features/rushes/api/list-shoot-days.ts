import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ShootDayView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";
import { shootBase } from "./shoot-mutation";

export const shootDaysQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: rushesKeys.shootDays(channelId, episodeId),
    queryFn: () => api<{ shootDays: ShootDayView[] }>(`${shootBase(channelId)}/episodes/${episodeId}/shoot-days`).then((r) => r.shootDays),
  });

export const useShootDays = (channelId: string, episodeId: string) => useQuery(shootDaysQueryOptions(channelId, episodeId));
