import { api } from "../../../lib/api-client";
import { shootBase, useShootMutation } from "./shoot-mutation";

export const useDeleteShootDay = (channelId: string, episodeId: string) =>
  useShootMutation(channelId, episodeId, (id: string) => api(`${shootBase(channelId)}/shoot-days/${id}`, { method: "DELETE" }));
