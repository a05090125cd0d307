import { useQueryClient } from "@tanstack/react-query";
import type { ClipDetail, UpdateClipInput } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";
import { rushesKeys } from "./keys";

/** Logging a clip: the panel shows the answer at once; the list and the shot list refetch. */
export function useUpdateClip(channelId: string, clipId: string) {
  const queryClient = useQueryClient();
  return useClipMutation(
    channelId,
    (patch: UpdateClipInput) => api<{ clip: ClipDetail }>(clipPath(channelId, clipId), { method: "PATCH", body: patch }).then((r) => r.clip),
    (clip) => {
      queryClient.setQueryData(rushesKeys.clip(channelId, clipId), clip);
      void queryClient.invalidateQueries({ queryKey: rushesKeys.shoot(channelId, clip.episodeId) });
    },
  );
}
