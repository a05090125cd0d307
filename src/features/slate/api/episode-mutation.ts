import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { EpisodeRecord } from "@shared/slate/schemas";
import { ApiError } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export type EpisodeAnswer = { episode: EpisodeRecord };

export const episodesBase = (channelId: string) => `/api/channels/${channelId}/episodes`;

/** On a 409 the server sent the episode as it is now: the page shows it by refetching. */
export const isConflict = (error: unknown): error is ApiError => error instanceof ApiError && error.status === 409;

/**
 * Any change to an episode shows on every board of the channel and on its own page; other features'
 * data that follows the episode (a deal's dates follow its publish date) is told through the
 * mutation's `changes` (src/lib/query-client.ts).
 */
export function useEpisodeMutation<V>(channelId: string, send: (variables: V) => Promise<EpisodeAnswer>, episodeId?: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (variables: V) => send(variables).then((r) => r.episode),
    meta: { changes: ["episode"] },
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: slateKeys.boards(channelId) });
      if (episodeId) void queryClient.invalidateQueries({ queryKey: slateKeys.detail(channelId, episodeId) });
    },
  });
}
