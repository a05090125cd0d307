import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeDetail } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export const episodeQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: slateKeys.detail(channelId, episodeId),
    queryFn: ({ signal }) => api<EpisodeDetail>(`/api/channels/${channelId}/episodes/${episodeId}`, { signal }),
  });

export const useEpisode = (channelId: string, episodeId: string) => useQuery(episodeQueryOptions(channelId, episodeId));
