import { useMutation, useQueryClient } from "@tanstack/react-query";
import { economicsKeys } from "./keys";

/** Every money write can move an episode's totals and the channel's months, so each refreshes the channel's money. */
export function useMoneyMutation<V, R>(channelId: string, send: (variables: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSettled: () => queryClient.invalidateQueries({ queryKey: economicsKeys.channel(channelId) }),
  });
}
