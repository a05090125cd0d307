import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ClipDetail } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

export const clipPath = (channelId: string, clipId: string) => `/api/channels/${channelId}/clips/${clipId}`;

export const clipQueryOptions = (channelId: string, clipId: string) =>
  queryOptions({
    queryKey: rushesKeys.clip(channelId, clipId),
    queryFn: () => api<{ clip: ClipDetail }>(clipPath(channelId, clipId)).then((r) => r.clip),
  });

export const useClip = (channelId: string, clipId: string) => useQuery(clipQueryOptions(channelId, clipId));
