import { api } from "../../../lib/api-client";
import { episodeMoneyBase } from "./keys";
import { useMoneyMutation } from "./money-mutation";

export const useSetDealRate = (channelId: string, episodeId: string) =>
  useMoneyMutation(channelId, ({ dealId, rate }: { dealId: string; rate: string }) => api<void>(`${episodeMoneyBase(channelId, episodeId)}/deals/${dealId}/rate`, { method: "PUT", body: { rate } }));
