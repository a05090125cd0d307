import { queryOptions, useQuery } from "@tanstack/react-query";
import type { EpisodeMoneyView } from "@shared/economics/schemas";
import { api } from "../../../lib/api-client";
import { economicsKeys, episodeMoneyBase } from "./keys";

/** While an invoice waits for the sponsor, the figures are asked again: "paid" arrives from the provider, not from this page. */
const WAITING_REFRESH_MS = 3_000;
const waitsForPayment = (money: EpisodeMoneyView | undefined) => money?.deals.some((deal) => deal.invoicedMinor > deal.paidMinor) ?? false;

export const episodeMoneyQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: economicsKeys.episode(channelId, episodeId),
    queryFn: () => api<{ money: EpisodeMoneyView }>(episodeMoneyBase(channelId, episodeId)).then((r) => r.money),
    refetchInterval: (query) => (waitsForPayment(query.state.data) ? WAITING_REFRESH_MS : false),
  });

export const useEpisodeMoney = (channelId: string, episodeId: string) => useQuery(episodeMoneyQueryOptions(channelId, episodeId));
