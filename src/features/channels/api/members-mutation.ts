import { useMutation, useQueryClient } from "@tanstack/react-query";
import { channelKeys } from "./keys";

export const base = (channelId: string) => `/api/channels/${channelId}`;

/** Every change to the members or their invitations shows on the members page. */
export function useMembersMutation<V>(channelId: string, send: (variables: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSettled: () => queryClient.invalidateQueries({ queryKey: channelKeys.members(channelId) }),
  });
}
