import type { Versioned } from "@shared/http/version";
import type { DealView, NewDeliverableInput, UpdateDeliverableInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

type Answer = { deal: DealView };

export const useAddDeliverable = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: NewDeliverableInput) => api<Answer>(`${channelBase(channelId)}/deals/${dealId}/deliverables`, { method: "POST", body: input }));

export const useUpdateDeliverable = (channelId: string) =>
  useSponsorMutation(channelId, ({ id, input }: { id: string; input: Versioned<UpdateDeliverableInput> }) =>
    api<Answer>(`${channelBase(channelId)}/deliverables/${id}`, { method: "PATCH", body: input }),
  );

export const useRemoveDeliverable = (channelId: string) =>
  useSponsorMutation(channelId, (id: string) => api(`${channelBase(channelId)}/deliverables/${id}`, { method: "DELETE" }));
