import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Stage } from "@shared/slate/stages";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** The answer of GET /api/channels/:channelId/episode-titles; it mirrors `episodeTitlesResponseSchema` in shared/slate/schemas.ts. */
export interface EpisodeTitlesResponse {
  episodes: { id: string; title: string; stage: Stage }[];
}

/** The channel's episodes by title, for the footage filter: a small list, not the whole board. */
export const episodeTitlesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: rushesKeys.episodeTitles(channelId),
    queryFn: ({ signal }) => api<EpisodeTitlesResponse>(`/api/channels/${channelId}/episode-titles`, { signal }).then((r) => r.episodes),
    staleTime: 60_000,
    // A new, renamed or archived episode shows in the filter at once.
    meta: { follows: ["episode"] },
  });

/** `enabled` is false where the filter has its episode already (on the episode's own page). */
export const useEpisodeTitles = (channelId: string, enabled = true) => useQuery({ ...episodeTitlesQueryOptions(channelId), enabled });
