import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ClipDetail } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

export const clipQueryOptions = (channelId: string, clipId: string) =>
  queryOptions({
    queryKey: rushesKeys.clip(channelId, clipId),
    queryFn: () => api<{ clip: ClipDetail }>(`/api/channels/${channelId}/clips/${clipId}`).then((r) => r.clip),
  });

export const useClip = (channelId: string, clipId: string) => useQuery(clipQueryOptions(channelId, clipId));

/** A short-lived link to the clip's object; refetched well before it expires. */
export const previewQueryOptions = (channelId: string, clipId: string) =>
  queryOptions({
    queryKey: rushesKeys.preview(channelId, clipId),
    queryFn: () => api<{ url: string; expiresAt: string }>(`/api/channels/${channelId}/clips/${clipId}/preview`),
    staleTime: 4 * 60_000,
  });

export const usePreview = (channelId: string, clipId: string) => useQuery(previewQueryOptions(channelId, clipId));
