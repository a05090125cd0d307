import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ClipDetail, ClipView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

export const clipPath = (channelId: string, clipId: string) => `/api/channels/${channelId}/clips/${clipId}`;

export const clipQueryOptions = (channelId: string, clipId: string) =>
  queryOptions({
    queryKey: rushesKeys.clip(channelId, clipId),
    queryFn: () => api<{ clip: ClipDetail }>(clipPath(channelId, clipId)).then((r) => r.clip),
    // While the server makes its poster and proxy, look again every few seconds.
    refetchInterval: (query) => (query.state.data && mediaPending(query.state.data) ? MEDIA_POLL_MS : false),
  });

export const MEDIA_POLL_MS = 3_000;

/** The server hasn't finished this clip's poster and proxy yet. */
export const mediaPending = (clip: Pick<ClipView, "media">) => clip.media.state === "waiting" || clip.media.state === "making";

export const useClip = (channelId: string, clipId: string) => useQuery(clipQueryOptions(channelId, clipId));
