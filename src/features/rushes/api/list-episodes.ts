import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** The channel's episodes, as the footage filter needs them (title and id only). */
export const episodeChoicesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: [...rushesKeys.channel(channelId), "episode-choices"] as const,
    queryFn: () => api<{ episodes: { id: string; title: string }[] }>(`/api/channels/${channelId}/episodes`).then((r) => r.episodes.map(({ id, title }) => ({ id, title }))),
    staleTime: 60_000,
  });
export const useEpisodeChoices = (channelId: string) => useQuery(episodeChoicesQueryOptions(channelId));
