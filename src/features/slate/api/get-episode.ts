import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeSummary } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export const episodeQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: slateKeys.detail(channelId, episodeId),
    queryFn: () => api<{ episode: EpisodeSummary }>(`/api/channels/${channelId}/episodes/${episodeId}`).then((r) => r.episode),
  });

export const useEpisode = (channelId: string, episodeId: string) => useQuery(episodeQueryOptions(channelId, episodeId));
