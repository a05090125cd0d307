import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { StageLengths } from "@shared/slate/schedule";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

interface StageLengthSettings {
  stageLengths: StageLengths;
  custom: boolean;
}

export const stageLengthsQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: slateKeys.settings(channelId),
    queryFn: ({ signal }) => api<StageLengthSettings>(`/api/channels/${channelId}/slate/settings`, { signal }),
  });

export const useStageLengths = (channelId: string) => useQuery(stageLengthsQueryOptions(channelId));

/** New lengths move every due date: the boards and episode pages refetch. */
export function useSaveStageLengths(channelId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (stageLengths: StageLengths) => api<StageLengthSettings>(`/api/channels/${channelId}/slate/settings`, { method: "PUT", body: { stageLengths } }),
    onSuccess: (saved) => queryClient.setQueryData(slateKeys.settings(channelId), saved),
    onSettled: () => queryClient.invalidateQueries({ queryKey: slateKeys.channel(channelId) }),
  });
}
