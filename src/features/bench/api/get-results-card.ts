import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ResultsCardView } from "@shared/bench/results-card-view";
import { api } from "../../../lib/api-client";
import { episodeBase } from "./bench-mutation";
import { benchKeys } from "./keys";

const drawing = (card: ResultsCardView | null | undefined) => card?.state === "queued" || card?.state === "drawing";

/** The episode's results card; asked again every second while its job is waiting or drawing. */
export const resultsCardQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: benchKeys.resultsCard(channelId, episodeId),
    queryFn: () => api<{ card: ResultsCardView | null }>(`${episodeBase(channelId, episodeId)}/results-card`).then((r) => r.card),
    refetchInterval: (query) => (drawing(query.state.data) ? 1000 : false),
  });

export const useResultsCard = (channelId: string, episodeId: string) => useQuery(resultsCardQueryOptions(channelId, episodeId));
