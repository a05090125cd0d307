import type { Versioned } from "@shared/http/version";
import type { MoneyInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

export const useUpdateMoney = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<MoneyInput>) => api<DealAnswer>(`${channelBase(channelId)}/deals/${dealId}/money`, { method: "PUT", body: input }).then((r) => r.deal));
