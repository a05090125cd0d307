import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useDeleteIteration = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (id: string) => api<void>(`${episodeBase(channelId, episodeId)}/build-log/${id}`, { method: "DELETE" }));
