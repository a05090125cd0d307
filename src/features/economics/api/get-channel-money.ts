import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ChannelMoneyView } from "@shared/economics/schemas";
import { api } from "../../../lib/api-client";
import { economicsKeys, moneyBase } from "./keys";

export const channelMoneyQueryOptions = (channelId: string) =>
  queryOptions({ queryKey: economicsKeys.overview(channelId), queryFn: () => api<{ money: ChannelMoneyView }>(moneyBase(channelId)).then((r) => r.money) });

export const useChannelMoney = (channelId: string) => useQuery(channelMoneyQueryOptions(channelId));
