import { useMutation, useQueryClient } from "@tanstack/react-query";
import { intakeKeys } from "./keys";

/**
 * Every intake write can move suggestions between ideas, counts and orders, so each refreshes the
 * channel's intake; promoting one also makes an episode, which the slate follows by topic.
 */
export function useIntakeMutation<V, R>(channelId: string, send: (variables: V) => Promise<R>, changesEpisodes = false) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    meta: changesEpisodes ? { changes: ["episode"] } : undefined,
    onSettled: () => queryClient.invalidateQueries({ queryKey: intakeKeys.channel(channelId) }),
  });
}
