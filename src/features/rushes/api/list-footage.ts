import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { FootagePage } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { MEDIA_POLL_MS, mediaPending } from "./get-clip";
import { rushesKeys } from "./keys";

/** `query` is the list's search string (filters, sort, cursor), the same one the page's URL holds. */
export const footageQueryOptions = (channelId: string, query: string) =>
  queryOptions({
    queryKey: rushesKeys.footageList(channelId, query),
    queryFn: ({ signal }) => api<FootagePage>(`/api/channels/${channelId}/clips?${query}`, { signal }),
    placeholderData: keepPreviousData,
    refetchInterval: (query) => (query.state.data?.clips.some(mediaPending) ? MEDIA_POLL_MS : false),
  });

export const useFootage = (channelId: string, query: string) => useQuery(footageQueryOptions(channelId, query));
