import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { SearchAnswer } from "@shared/search/schemas";
import { api } from "../../../lib/api-client";
import { searchKeys } from "./keys";

/** Fewer letters than this find too much to be worth asking. */
export const SHORTEST_SEARCH = 2;

export const searchQueryOptions = (channelId: string, query: string) =>
  queryOptions({
    queryKey: searchKeys.results(channelId, query),
    queryFn: ({ signal }) => api<SearchAnswer>(`/api/channels/${channelId}/search?${new URLSearchParams({ q: query })}`, { signal }),
    // Results stay on screen while the next words are asked; any write that changes records asks again.
    placeholderData: keepPreviousData,
    meta: { follows: ["episode", "footage", "bench"] },
  });

export const useSearch = (channelId: string, query: string) => useQuery({ ...searchQueryOptions(channelId, query), enabled: query.length >= SHORTEST_SEARCH });
