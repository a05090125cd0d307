import { queryOptions, useQuery } from "@tanstack/react-query";
import type { FiguresView } from "@shared/publish/figures";
import { api } from "../../../lib/api-client";
import { publishBase, publishKeys } from "./keys";

export const figuresQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: publishKeys.figures(channelId, episodeId),
    queryFn: () => api<{ figures: FiguresView }>(`${publishBase(channelId, episodeId)}/figures`).then((r) => r.figures),
    // The figure days are the deals' report items, dated from go-live.
    meta: { follows: ["publish", "episode"] },
  });

export const useFigures = (channelId: string, episodeId: string) => useQuery(figuresQueryOptions(channelId, episodeId));
