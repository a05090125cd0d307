import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useDeleteCriterion = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (id: string) => api<void>(`${episodeBase(channelId, episodeId)}/test-plan/criteria/${id}`, { method: "DELETE" }));
