import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SponsorDetail } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const sponsorQueryOptions = (channelId: string, sponsorId: string) =>
  queryOptions({
    queryKey: sponsorKeys.sponsor(channelId, sponsorId),
    queryFn: () => api<{ sponsor: SponsorDetail }>(`${channelBase(channelId)}/sponsors/${sponsorId}`).then((r) => r.sponsor),
  });

export const useSponsor = (channelId: string, sponsorId: string | null) => useQuery({ ...sponsorQueryOptions(channelId, sponsorId ?? ""), enabled: sponsorId !== null });
