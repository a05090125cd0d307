import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { FeedScope, NewFeed } from "@shared/calendar/feeds";
import { api } from "../../../lib/api-client";
import { calendarKeys } from "./keys";

/** A new private address for the member's feed in a channel; the one before it stops working. */
export function useMakeFeed() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ channelId, scope }: { channelId: string; scope: FeedScope }) =>
      api<{ feed: NewFeed }>(`/api/channels/${channelId}/calendar-feed`, { method: "POST", body: { scope } }).then((r) => r.feed),
    onSettled: () => queryClient.invalidateQueries({ queryKey: calendarKeys.feeds() }),
  });
}
