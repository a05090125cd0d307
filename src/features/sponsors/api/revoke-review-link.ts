import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useRevokeReviewLink = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (linkId: string) => api(`${channelBase(channelId)}/deals/${dealId}/review-links/${linkId}`, { method: "DELETE" }));
