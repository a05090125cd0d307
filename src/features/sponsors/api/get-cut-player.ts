import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ReviewSegment } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export interface CutPlayer {
  url: string | null;
  segment: ReviewSegment | null;
}

/** The cut as the sponsor will see it, for the members: an address for an hour, so it is fetched when asked and kept well under that. */
export const cutPlayerQueryOptions = (channelId: string, dealId: string, clipId: string | null, enabled: boolean) =>
  queryOptions({
    queryKey: [...sponsorKeys.cutPlayer(channelId, dealId), clipId],
    queryFn: () => api<CutPlayer>(`${channelBase(channelId)}/deals/${dealId}/cut/player`),
    staleTime: 30 * 60 * 1000,
    enabled,
  });

export const useCutPlayer = (channelId: string, dealId: string, clipId: string | null, enabled: boolean) => useQuery(cutPlayerQueryOptions(channelId, dealId, clipId, enabled));
