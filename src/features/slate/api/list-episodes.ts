import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeSummary } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export const episodesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: slateKeys.lists(channelId),
    queryFn: () => api<{ episodes: EpisodeSummary[] }>(`/api/channels/${channelId}/episodes`).then((r) => r.episodes),
  });

export const useEpisodes = (channelId: string) => useQuery(episodesQueryOptions(channelId));
