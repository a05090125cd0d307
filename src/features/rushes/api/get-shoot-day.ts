import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ShootDayView, ShotView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";
import { shootBase } from "./shoot-mutation";

export interface ShootDayDetail {
  shootDay: ShootDayView;
  episodeTitle: string;
  shots: ShotView[];
  missing: ShotView[];
}

export const shootDayQueryOptions = (channelId: string, shootDayId: string) =>
  queryOptions({
    queryKey: rushesKeys.shootDay(channelId, shootDayId),
    queryFn: () => api<ShootDayDetail>(`${shootBase(channelId)}/shoot-days/${shootDayId}`),
  });

export const useShootDay = (channelId: string, shootDayId: string) => useQuery(shootDayQueryOptions(channelId, shootDayId));
