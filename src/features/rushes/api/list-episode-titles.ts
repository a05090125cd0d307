import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeTitles } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** The channel's episodes by title, for the footage filter: a small list, not the whole board. */
export const episodeTitlesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: rushesKeys.episodeTitles(channelId),
    queryFn: ({ signal }) => api<EpisodeTitles>(`/api/channels/${channelId}/episode-titles`, { signal }).then((r) => r.episodes),
    staleTime: 60_000,
    // A new, renamed or archived episode shows in the filter at once.
    meta: { follows: ["episode"] },
  });

/** `enabled` is false where the filter has its episode already (on the episode's own page). */
export const useEpisodeTitles = (channelId: string, enabled = true) => useQuery({ ...episodeTitlesQueryOptions(channelId), enabled });
