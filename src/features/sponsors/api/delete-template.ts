import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useDeleteTemplate = (channelId: string) =>
  useSponsorMutation(channelId, (templateId: string) => api(`${channelBase(channelId)}/deal-templates/${templateId}`, { method: "DELETE" }));
