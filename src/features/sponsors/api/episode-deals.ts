import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DealView } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const episodeDealsQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: sponsorKeys.episodeDeals(channelId, episodeId),
    queryFn: () => api<{ deals: DealView[] }>(`${channelBase(channelId)}/episodes/${episodeId}/deals`).then((r) => r.deals),
    // Another feature's write can change a deal: the publish date moves its items' dates, new footage its cut choices.
    meta: { follows: ["episode", "footage", "publish"] },
  });

export const useEpisodeDeals = (channelId: string, episodeId: string) => useQuery(episodeDealsQueryOptions(channelId, episodeId));
