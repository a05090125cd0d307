import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SponsorSummary } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const sponsorsQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: sponsorKeys.sponsors(channelId),
    queryFn: () => api<{ sponsors: SponsorSummary[] }>(`${channelBase(channelId)}/sponsors`).then((r) => r.sponsors),
  });

export const useSponsors = (channelId: string) => useQuery(sponsorsQueryOptions(channelId));
