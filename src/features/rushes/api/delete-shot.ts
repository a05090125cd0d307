import { api } from "../../../lib/api-client";
import { shootBase, useShootMutation } from "./shoot-mutation";

export const useDeleteShot = (channelId: string, episodeId: string) =>
  useShootMutation(channelId, episodeId, (id: string) => api(`${shootBase(channelId)}/shots/${id}`, { method: "DELETE" }));
