import { useMutation } from "@tanstack/react-query";
import type { PublishMovePreview } from "@shared/calendar/entries";
import { api } from "../../../lib/api-client";

/** What a publish-date move would shift, asked before anything is saved (the server saves nothing). */
export function usePreviewPublishMove(channelId: string) {
  return useMutation({
    mutationFn: ({ episodeId, date }: { episodeId: string; date: string }) =>
      api<{ preview: PublishMovePreview }>(`/api/channels/${channelId}/calendar/episodes/${episodeId}/publish-preview`, { method: "POST", body: { date } }).then((r) => r.preview),
  });
}
