import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { clipPath } from "./get-clip";
import { rushesKeys } from "./keys";

type SignedLink = { url: string; expiresAt: string; source: "proxy" | "original" };

/** A short-lived link to the clip's proxy (once there is one) or original; refetched well before it expires. */
export const previewQueryOptions = (channelId: string, clipId: string, proxy = false) =>
  queryOptions({
    queryKey: rushesKeys.preview(channelId, clipId, proxy),
    queryFn: () => api<SignedLink>(`${clipPath(channelId, clipId)}/preview`),
    staleTime: 4 * 60_000,
  });

export const usePreview = (channelId: string, clipId: string, proxy = false) => useQuery(previewQueryOptions(channelId, clipId, proxy));

/** The same link, asking storage to send the file as a download. */
export const fetchDownloadLink = (channelId: string, clipId: string) => api<SignedLink>(`${clipPath(channelId, clipId)}/preview?download=1`);
