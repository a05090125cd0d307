import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { calendarKeys } from "./keys";

/** Ends the member's feed in a channel: its address answers "not found" from now on. */
export function useEndFeed() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ channelId }: { channelId: string }) => api<unknown>(`/api/channels/${channelId}/calendar-feed`, { method: "DELETE" }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: calendarKeys.feeds() }),
  });
}
