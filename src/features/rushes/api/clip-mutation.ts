import { useMutation, useQueryClient } from "@tanstack/react-query";
import { rushesKeys } from "./keys";

/**
 * A change to a clip shows in the footage list (filters, totals), in the clip's panel and in the
 * shot list (captured); other features' views of the footage follow it through `changes`.
 */
export function useClipMutation<V, R>(channelId: string, send: (variables: V) => Promise<R>, onSuccess?: (answer: R) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    meta: { changes: ["footage"] },
    onSuccess,
    onSettled: () => queryClient.invalidateQueries({ queryKey: rushesKeys.footage(channelId) }),
  });
}
