import { queryOptions, useQuery } from "@tanstack/react-query";
import type { UploadView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** This person's unfinished uploads for the episode, with the parts storage already holds. */
export const openUploadsQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: rushesKeys.openUploads(channelId, episodeId),
    queryFn: () => api<{ uploads: UploadView[] }>(`/api/channels/${channelId}/uploads?episodeId=${episodeId}`).then((r) => r.uploads),
  });
export const useOpenUploads = (channelId: string, episodeId: string) => useQuery(openUploadsQueryOptions(channelId, episodeId));
