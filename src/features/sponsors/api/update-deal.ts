import type { Versioned } from "@shared/http/version";
import type { UpdateDealInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

export const useUpdateDeal = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<UpdateDealInput>) => api<DealAnswer>(`${channelBase(channelId)}/deals/${dealId}`, { method: "PATCH", body: input }).then((r) => r.deal));
