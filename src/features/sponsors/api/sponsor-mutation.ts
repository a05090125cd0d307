import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DealView } from "@shared/sponsors/schemas";
import { sponsorKeys } from "./keys";

/**
 * A sponsor write can change what several views show (a deal's items feed the desk, a sponsor's deal
 * count, the board's flags), so each one refreshes the channel's sponsor data.
 */
export function useSponsorMutation<V, R>(channelId: string, send: (variables: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSettled: () => queryClient.invalidateQueries({ queryKey: sponsorKeys.channel(channelId) }),
  });
}

/** What the deal endpoints answer: the deal as it is now. */
export type DealAnswer = { deal: DealView };
