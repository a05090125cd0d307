import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useRemoveDeliverable = (channelId: string) =>
  useSponsorMutation(channelId, (id: string) => api(`${channelBase(channelId)}/deliverables/${id}`, { method: "DELETE" }));
