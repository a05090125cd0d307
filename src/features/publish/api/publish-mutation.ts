import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PublishPackageView } from "@shared/publish/schemas";
import { publishKeys } from "./keys";

/**
 * Every publish write answers with the package as it now is, which replaces the cached one; going live
 * moves the sponsors' dates, which follow the "publish" topic.
 */
export function usePublishMutation<V>(channelId: string, episodeId: string, send: (variables: V) => Promise<PublishPackageView | null>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    meta: { changes: ["publish"] },
    onSuccess: (answer) => {
      if (answer) queryClient.setQueryData(publishKeys.package(channelId, episodeId), answer);
      else void queryClient.invalidateQueries({ queryKey: publishKeys.package(channelId, episodeId) });
    },
  });
}
