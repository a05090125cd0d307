import { queryOptions, useQuery } from "@tanstack/react-query";
import type { FootageLinks } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";

/** The episode's runs and iterations with the footage that shows each, and its clips to link. */
export const footageLinksQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: rushesKeys.footageLinks(channelId, episodeId),
    queryFn: () => api<FootageLinks>(`/api/channels/${channelId}/episodes/${episodeId}/footage-links`),
    // A run or an iteration added, renamed or deleted on the bench changes what can be linked.
    meta: { follows: ["bench"] },
  });

export const useFootageLinks = (channelId: string, episodeId: string) => useQuery(footageLinksQueryOptions(channelId, episodeId));
