import { useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";
import { rushesKeys } from "./keys";

export function useDeleteClip(channelId: string) {
  const queryClient = useQueryClient();
  return useClipMutation(
    channelId,
    (clipId: string) => api<void>(clipPath(channelId, clipId), { method: "DELETE" }),
    () => void queryClient.invalidateQueries({ queryKey: rushesKeys.channel(channelId) }),
  );
}
