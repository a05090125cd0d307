import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SponsorSettings } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const settingsQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: sponsorKeys.settings(channelId),
    queryFn: () => api<{ settings: SponsorSettings }>(`${channelBase(channelId)}/sponsor-settings`).then((r) => r.settings),
  });

export const useSponsorSettings = (channelId: string) => useQuery(settingsQueryOptions(channelId));
