import { queryOptions, useQuery } from "@tanstack/react-query";
import type { BuildPhotoView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase } from "./bench-mutation";
import { benchKeys } from "./keys";

// Each photo's link works for ten minutes: read the list again well before they run out.
const LINKS_FRESH_MS = 5 * 60 * 1000;

export const buildPhotosQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: benchKeys.buildPhotos(channelId, episodeId),
    queryFn: () => api<{ photos: BuildPhotoView[] }>(`${episodeBase(channelId, episodeId)}/build-photos`).then((r) => r.photos),
    staleTime: LINKS_FRESH_MS,
    refetchInterval: LINKS_FRESH_MS,
  });

export const useBuildPhotos = (channelId: string, episodeId: string) => useQuery(buildPhotosQueryOptions(channelId, episodeId));
