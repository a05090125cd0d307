import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { CommentInput, EpisodeComment } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export function useAddComment(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CommentInput) =>
      api<{ comment: EpisodeComment }>(`/api/channels/${channelId}/episodes/${episodeId}/comments`, { method: "POST", body: input }).then((r) => r.comment),
    onSettled: () => queryClient.invalidateQueries({ queryKey: slateKeys.comments(channelId, episodeId) }),
  });
}
