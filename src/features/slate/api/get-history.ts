import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeHistory } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export const historyQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: slateKeys.history(channelId, episodeId),
    queryFn: ({ signal }) => api<EpisodeHistory>(`/api/channels/${channelId}/episodes/${episodeId}/history`, { signal }),
  });

export const useHistory = (channelId: string, episodeId: string) => useQuery(historyQueryOptions(channelId, episodeId));
