import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { DeskView } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const deskQueryOptions = (channelId: string, filter: { sponsorId?: string; episodeId?: string }) =>
  queryOptions({
    queryKey: sponsorKeys.desk(channelId, filter),
    queryFn: () => {
      const query = new URLSearchParams(Object.entries(filter).filter((entry): entry is [string, string] => Boolean(entry[1])));
      return api<DeskView>(`${channelBase(channelId)}/desk${query.size > 0 ? `?${query}` : ""}`);
    },
    placeholderData: keepPreviousData,
  });

export const useDesk = (channelId: string, filter: { sponsorId?: string; episodeId?: string }) => useQuery(deskQueryOptions(channelId, filter));
