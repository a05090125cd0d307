import type { Versioned } from "@shared/http/version";
import type { CreateDealInput, CutInput, DealView, MoneyInput, UpdateDealInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

type Answer = { deal: DealView };

export const useCreateDeal = (channelId: string) =>
  useSponsorMutation(channelId, (input: CreateDealInput) => api<Answer>(`${channelBase(channelId)}/deals`, { method: "POST", body: input }).then((r) => r.deal));

export const useUpdateDeal = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<UpdateDealInput>) => api<Answer>(`${channelBase(channelId)}/deals/${dealId}`, { method: "PATCH", body: input }).then((r) => r.deal));

export const useUpdateMoney = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<MoneyInput>) => api<Answer>(`${channelBase(channelId)}/deals/${dealId}/money`, { method: "PUT", body: input }).then((r) => r.deal));

export const useUpdateCut = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<CutInput>) => api<Answer>(`${channelBase(channelId)}/deals/${dealId}/cut`, { method: "PUT", body: input }).then((r) => r.deal));
