import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ClipDetail, MarkInput, MarkView, UpdateClipInput } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** Logging changes the list (filters, totals) and the shot list (captured), so both are refreshed. */
export function useUpdateClip(channelId: string, clipId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: UpdateClipInput) => api<{ clip: ClipDetail }>(`/api/channels/${channelId}/clips/${clipId}`, { method: "PATCH", body: patch }).then((r) => r.clip),
    onSuccess: (clip) => {
      queryClient.setQueryData(rushesKeys.clip(channelId, clipId), clip);
      void queryClient.invalidateQueries({ queryKey: rushesKeys.footage(channelId) });
      void queryClient.invalidateQueries({ queryKey: rushesKeys.shoot(channelId, clip.episodeId) });
    },
  });
}

export function useDeleteClip(channelId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (clipId: string) => api<void>(`/api/channels/${channelId}/clips/${clipId}`, { method: "DELETE" }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: rushesKeys.channel(channelId) }),
  });
}

export function useMarks(channelId: string, clipId: string) {
  const queryClient = useQueryClient();
  const refresh = () => {
    void queryClient.invalidateQueries({ queryKey: rushesKeys.clip(channelId, clipId) });
    void queryClient.invalidateQueries({ queryKey: rushesKeys.footage(channelId) });
  };
  const base = `/api/channels/${channelId}/clips/${clipId}/marks`;
  return {
    add: useMutation({ mutationFn: (input: MarkInput) => api<{ mark: MarkView }>(base, { method: "POST", body: input }), onSuccess: refresh }),
    remove: useMutation({ mutationFn: (markId: string) => api<void>(`${base}/${markId}`, { method: "DELETE" }), onSuccess: refresh }),
  };
}
