import { useQueryClient } from "@tanstack/react-query";
import { useCallback } from "react";
import type { ClipDetail, ClipMetadata } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { refreshFollowers } from "../../../lib/query-client";
import { rushesKeys } from "./keys";
import { uploadsBase } from "./start-upload";

/** Joins the stored parts into the file and records the clip. */
export const completeUpload = (channelId: string, uploadId: string, body: { metadata?: ClipMetadata; sha256?: string }) =>
  api<{ clip: ClipDetail }>(`${uploadsBase(channelId)}/${uploadId}/complete`, { method: "POST", body }).then((r) => r.clip);

/** What a finished upload (or its poster) changes: the footage lists, and whatever follows the footage. Stable per channel. */
export function useFootageArrived(channelId: string) {
  const queryClient = useQueryClient();
  return useCallback(() => {
    void queryClient.invalidateQueries({ queryKey: rushesKeys.footage(channelId) });
    refreshFollowers(queryClient, ["footage"]);
  }, [queryClient, channelId]);
}
