import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useDeleteBuildPhoto = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (id: string) => api<void>(`${episodeBase(channelId, episodeId)}/build-photos/${id}`, { method: "DELETE" }));
