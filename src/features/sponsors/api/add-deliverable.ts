import type { NewDeliverableInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

export const useAddDeliverable = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: NewDeliverableInput) => api<DealAnswer>(`${channelBase(channelId)}/deals/${dealId}/deliverables`, { method: "POST", body: input }));
