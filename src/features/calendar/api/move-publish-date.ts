import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { calendarKeys } from "./keys";

/**
 * The move itself, once the person has seen what goes with it: the episode's own save (its version
 * guards against someone else's edit in between), which moves the stage due dates and sponsor items too.
 */
export function useMovePublishDate(channelId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ episodeId, version, date }: { episodeId: string; version: number; date: string }) =>
      api<unknown>(`/api/channels/${channelId}/episodes/${episodeId}`, { method: "PATCH", body: { version, targetPublishDate: date } }),
    meta: { changes: ["episode"] },
    onSettled: () => queryClient.invalidateQueries({ queryKey: calendarKeys.channel(channelId) }),
  });
}
