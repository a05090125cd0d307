import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeComment } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export const commentsQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: slateKeys.comments(channelId, episodeId),
    queryFn: ({ signal }) => api<{ comments: EpisodeComment[] }>(`/api/channels/${channelId}/episodes/${episodeId}/comments`, { signal }).then((r) => r.comments),
  });

export const useComments = (channelId: string, episodeId: string) => useQuery(commentsQueryOptions(channelId, episodeId));
