import { api } from "../../../lib/api-client";
import { episodeMoneyBase } from "./keys";
import { useMoneyMutation } from "./money-mutation";

export const useDeleteEntry = (channelId: string, episodeId: string) =>
  useMoneyMutation(channelId, (entryId: string) => api<void>(`${episodeMoneyBase(channelId, episodeId)}/entries/${entryId}`, { method: "DELETE" }));
