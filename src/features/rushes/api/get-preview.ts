import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { clipPath } from "./get-clip";
import { rushesKeys } from "./keys";

type SignedLink = { url: string; expiresAt: string; source: "proxy" | "original" };

/** A short-lived link to the clip's proxy (once there is one) or original; refetched well before it expires. */
export const previewQueryOptions = (channelId: string, clipId: string, proxyOfAttempt: number | null = null) =>
  queryOptions({
    queryKey: rushesKeys.preview(channelId, clipId, proxyOfAttempt),
    queryFn: () => api<SignedLink>(`${clipPath(channelId, clipId)}/preview`),
    staleTime: 4 * 60_000,
  });

export const usePreview = (channelId: string, clipId: string, proxyOfAttempt: number | null = null) => useQuery(previewQueryOptions(channelId, clipId, proxyOfAttempt));

/** The same link, asking storage to send the file as a download. */
export const fetchDownloadLink = (channelId: string, clipId: string) => api<SignedLink>(`${clipPath(channelId, clipId)}/preview?download=1`);
