import { queryOptions, useQuery } from "@tanstack/react-query";
import type { HomeView } from "@shared/home/needs";
import { api } from "../../../lib/api-client";
import { homeKeys } from "./keys";

export const homeQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: homeKeys.channel(channelId),
    queryFn: () => api<{ home: HomeView }>(`/api/channels/${channelId}/home`).then((r) => r.home),
    // What needs a member changes with everyone's work: read it afresh on every visit.
    staleTime: 0,
  });

export const useHome = (channelId: string) => useQuery(homeQueryOptions(channelId));
