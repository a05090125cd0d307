import { useMutation, useQueryClient } from "@tanstack/react-query";
import { rushesKeys } from "./keys";

export const shootBase = (channelId: string) => `/api/channels/${channelId}`;

/** A change to the shoot plan shows on the episode's plan and on every shoot day's page. */
export function useShootMutation<V>(channelId: string, episodeId: string, send: (variables: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: rushesKeys.shoot(channelId, episodeId) });
      void queryClient.invalidateQueries({ queryKey: rushesKeys.shootDayPages(channelId) });
    },
  });
}
