import { useMutation, useQueryClient } from "@tanstack/react-query";
import { benchKeys } from "./keys";

/**
 * Every bench write can change a verdict somewhere else (a criterion re-judges every run, a part's
 * mass re-weighs every craft it flew in), so each one refreshes the channel's bench data.
 */
export function useBenchMutation<V, R>(channelId: string, send: (variables: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    // What shows a run or an iteration (the footage's links) follows the bench.
    meta: { changes: ["bench"] },
    onSettled: () => queryClient.invalidateQueries({ queryKey: benchKeys.channel(channelId) }),
  });
}

export const episodeBase = (channelId: string, episodeId: string) => `/api/channels/${channelId}/episodes/${episodeId}`;
export const partsBase = (channelId: string) => `/api/channels/${channelId}/bench/parts`;
