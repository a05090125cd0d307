import type { CreateDealInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

export const useCreateDeal = (channelId: string) =>
  useSponsorMutation(channelId, (input: CreateDealInput) => api<DealAnswer>(`${channelBase(channelId)}/deals`, { method: "POST", body: input }).then((r) => r.deal));
