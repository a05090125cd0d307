import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EdlRate, EdlRatesView } from "@shared/rushes/exports/edl-rates";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** The frame rates of the filter's clips: a CMX 3600 list holds one, so the footage list offers one list per rate. */
export const edlRatesQueryOptions = (channelId: string, query: string) =>
  queryOptions({
    queryKey: rushesKeys.edlRates(channelId, query),
    queryFn: ({ signal }) => api<EdlRatesView>(`/api/channels/${channelId}/exports/edl-rates?${query}`, { signal }),
  });

export const useEdlRates = (channelId: string, query: string) => useQuery(edlRatesQueryOptions(channelId, query));

/** The EDL of the filter: one list, or (rates mixed, none chosen) a zip of one list per rate. */
export const edlUrl = (channelId: string, query: string, rate?: EdlRate) => {
  const params = new URLSearchParams(query);
  if (rate) params.set("rate", rate);
  return `/api/channels/${channelId}/exports/footage.edl?${params}`;
};
