import { useQueryClient } from "@tanstack/react-query";
import type { MarkPatch, MarkView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";
import { rushesKeys } from "./keys";

/** A mark's change (what it shows, its note, its points); the clip's panel reads it again. */
export function useUpdateMark(channelId: string, clipId: string) {
  const queryClient = useQueryClient();
  return useClipMutation(
    channelId,
    ({ markId, patch }: { markId: string; patch: MarkPatch }) => api<{ mark: MarkView }>(`${clipPath(channelId, clipId)}/marks/${markId}`, { method: "PATCH", body: patch }).then((r) => r.mark),
    () => void queryClient.invalidateQueries({ queryKey: rushesKeys.clip(channelId, clipId) }),
  );
}
