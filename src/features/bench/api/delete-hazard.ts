import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useDeleteHazard = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (id: string) => api<void>(`${episodeBase(channelId, episodeId)}/test-plan/hazards/${id}`, { method: "DELETE" }));
