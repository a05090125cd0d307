import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SettingsInput, SponsorSettings } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const settingsQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: sponsorKeys.settings(channelId),
    queryFn: () => api<{ settings: SponsorSettings }>(`${channelBase(channelId)}/sponsor-settings`).then((r) => r.settings),
  });

export const useSponsorSettings = (channelId: string) => useQuery(settingsQueryOptions(channelId));

export const useSaveSettings = (channelId: string) =>
  useSponsorMutation(channelId, (input: SettingsInput) => api(`${channelBase(channelId)}/sponsor-settings`, { method: "PUT", body: input }));

export const useSaveSpeakingRate = (channelId: string) =>
  useSponsorMutation(channelId, ({ userId, wordsPerMinute }: { userId: string; wordsPerMinute: number }) =>
    api(`${channelBase(channelId)}/speaking-rates/${userId}`, { method: "PUT", body: { wordsPerMinute } }),
  );
