import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useRemoveContact = (channelId: string, sponsorId: string) =>
  useSponsorMutation(channelId, (contactId: string) => api(`${channelBase(channelId)}/sponsors/${sponsorId}/contacts/${contactId}`, { method: "DELETE" }));
