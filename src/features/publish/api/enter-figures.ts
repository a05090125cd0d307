import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { FigureColumns, FiguresInput, FiguresView } from "@shared/publish/figures";
import { api } from "../../../lib/api-client";
import { publishBase, publishKeys } from "./keys";

/** A day's figures; the answer is every day's, which replaces the cached ones. The sponsor's report follows "publish". */
export function useEnterFigures(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ day, input }: { day: number; input: FiguresInput }) =>
      api<{ figures: FiguresView }>(`${publishBase(channelId, episodeId)}/figures/${day}`, { method: "PUT", body: input }).then((r) => r.figures),
    meta: { changes: ["publish"] },
    onSuccess: (figures) => queryClient.setQueryData(publishKeys.figures(channelId, episodeId), figures),
  });
}

/** The channel's export columns, kept for every episode. */
export function useSaveFigureColumns(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (columns: FigureColumns) => api<{ columns: FigureColumns }>(`/api/channels/${channelId}/publish/figure-columns`, { method: "PUT", body: columns }).then((r) => r.columns),
    onSuccess: (columns) => {
      queryClient.setQueryData(publishKeys.figures(channelId, episodeId), (old: FiguresView | undefined) => old && { ...old, columns });
      void queryClient.invalidateQueries({ queryKey: publishKeys.channel(channelId) });
    },
  });
}
