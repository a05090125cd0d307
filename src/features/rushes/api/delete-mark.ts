import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";

export const useDeleteMark = (channelId: string, clipId: string) =>
  useClipMutation(channelId, (markId: string) => api<void>(`${clipPath(channelId, clipId)}/marks/${markId}`, { method: "DELETE" }));
