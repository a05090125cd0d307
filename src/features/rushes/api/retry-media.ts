import type { ClipDetail } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";

/** Asks the server again for a failed clip's poster and proxy. */
export function useRetryMedia(channelId: string, clipId: string) {
  return useClipMutation(channelId, () => api<{ clip: ClipDetail }>(`${clipPath(channelId, clipId)}/media/retry`, { method: "POST" }).then((r) => r.clip));
}
