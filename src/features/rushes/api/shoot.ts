import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ShootDayInput, ShootDayView, ShotInput, ShotView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

export const shootDaysQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: rushesKeys.shootDays(channelId, episodeId),
    queryFn: () => api<{ shootDays: ShootDayView[] }>(`/api/channels/${channelId}/episodes/${episodeId}/shoot-days`).then((r) => r.shootDays),
  });
export const useShootDays = (channelId: string, episodeId: string) => useQuery(shootDaysQueryOptions(channelId, episodeId));

export const shotsQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: rushesKeys.shots(channelId, episodeId),
    queryFn: () => api<{ shots: ShotView[] }>(`/api/channels/${channelId}/episodes/${episodeId}/shots`).then((r) => r.shots),
  });
export const useShots = (channelId: string, episodeId: string) => useQuery(shotsQueryOptions(channelId, episodeId));

export interface ShootDayDetail {
  shootDay: ShootDayView;
  episodeTitle: string;
  shots: ShotView[];
  missing: ShotView[];
}
export const shootDayQueryOptions = (channelId: string, shootDayId: string) =>
  queryOptions({
    queryKey: rushesKeys.shootDay(channelId, shootDayId),
    queryFn: () => api<ShootDayDetail>(`/api/channels/${channelId}/shoot-days/${shootDayId}`),
  });
export const useShootDay = (channelId: string, shootDayId: string) => useQuery(shootDayQueryOptions(channelId, shootDayId));

function useShootRefresh(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: rushesKeys.shoot(channelId, episodeId) });
    void queryClient.invalidateQueries({ queryKey: [...rushesKeys.channel(channelId), "shoot-day"] });
  };
}

export function useCreateShootDay(channelId: string, episodeId: string) {
  const onSuccess = useShootRefresh(channelId, episodeId);
  return useMutation({ mutationFn: (input: ShootDayInput) => api(`/api/channels/${channelId}/episodes/${episodeId}/shoot-days`, { method: "POST", body: input }), onSuccess });
}

export function useDeleteShootDay(channelId: string, episodeId: string) {
  const onSuccess = useShootRefresh(channelId, episodeId);
  return useMutation({ mutationFn: (id: string) => api(`/api/channels/${channelId}/shoot-days/${id}`, { method: "DELETE" }), onSuccess });
}

export function useCreateShot(channelId: string, episodeId: string) {
  const onSuccess = useShootRefresh(channelId, episodeId);
  return useMutation({ mutationFn: (input: ShotInput) => api(`/api/channels/${channelId}/episodes/${episodeId}/shots`, { method: "POST", body: input }), onSuccess });
}

export function useUpdateShot(channelId: string, episodeId: string) {
  const onSuccess = useShootRefresh(channelId, episodeId);
  return useMutation({
    mutationFn: ({ id, ...patch }: { id: string } & Partial<ShotInput>) => api(`/api/channels/${channelId}/shots/${id}`, { method: "PATCH", body: patch }),
    onSuccess,
  });
}

export function useDeleteShot(channelId: string, episodeId: string) {
  const onSuccess = useShootRefresh(channelId, episodeId);
  return useMutation({ mutationFn: (id: string) => api(`/api/channels/${channelId}/shots/${id}`, { method: "DELETE" }), onSuccess });
}

/** Who can be put on a shoot day: the channel's people by name. */
export const shootCrewQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: [...rushesKeys.channel(channelId), "shoot-crew"] as const,
    queryFn: () => api<{ people: { userId: string; name: string; role: string }[] }>(`/api/channels/${channelId}/shoot-crew`).then((r) => r.people),
    staleTime: 60_000,
  });
export const useShootCrew = (channelId: string) => useQuery(shootCrewQueryOptions(channelId));
