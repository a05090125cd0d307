import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useDeleteRun = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (id: string) => api<void>(`${episodeBase(channelId, episodeId)}/bench-runs/${id}`, { method: "DELETE" }));
