import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { clipPath } from "./get-clip";
import { rushesKeys } from "./keys";

type SignedLink = { url: string; expiresAt: string };

/** A short-lived link to the clip's object; refetched well before it expires. */
export const previewQueryOptions = (channelId: string, clipId: string) =>
  queryOptions({
    queryKey: rushesKeys.preview(channelId, clipId),
    queryFn: () => api<SignedLink>(`${clipPath(channelId, clipId)}/preview`),
    staleTime: 4 * 60_000,
  });

export const usePreview = (channelId: string, clipId: string) => useQuery(previewQueryOptions(channelId, clipId));

/** The same link, asking storage to send the file as a download. */
export const fetchDownloadLink = (channelId: string, clipId: string) => api<SignedLink>(`${clipPath(channelId, clipId)}/preview?download=1`);
