import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { GateProblem } from "@shared/slate/gates";
import type { Board, EpisodeRecord, MoveEpisodeInput } from "@shared/slate/schemas";
import { ApiError, api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export interface MoveVariables extends MoveEpisodeInput {
  episodeId: string;
}

/** The problems a 422 lists when a forward move skips essentials; null for any other failure. */
export function gateProblemsOf(error: unknown): GateProblem[] | null {
  if (!(error instanceof ApiError) || error.status !== 422) return null;
  const problems = (error.body as { problems?: GateProblem[] } | null)?.problems;
  return Array.isArray(problems) ? problems : null;
}

/**
 * A stage move or reorder, shown at once: every cached board of the channel puts the card where it
 * was dropped before the server answers. A refusal (a 409, a 422 gate) puts the boards back as they
 * were; either way the boards, the episode's page and its history are read again to settle.
 */
export function useMoveEpisode(channelId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ episodeId, ...body }: MoveVariables) =>
      api<{ episode: EpisodeRecord }>(`/api/channels/${channelId}/episodes/${episodeId}/move`, { method: "POST", body }).then((r) => r.episode),
    meta: { changes: ["episode"] },
    onMutate: async (move) => {
      // A refetch already in flight would paint the old order over the drop.
      await queryClient.cancelQueries({ queryKey: slateKeys.boards(channelId) });
      const before = queryClient.getQueriesData<Board>({ queryKey: slateKeys.boards(channelId) });
      const placement = { episodeId: move.episodeId, stage: move.stage, afterId: move.afterId ?? null, beforeId: move.beforeId ?? null };
      queryClient.setQueriesData<Board>({ queryKey: slateKeys.boards(channelId) }, (board) => (board ? placeCard(board, placement) : board));
      return { before };
    },
    onError: (_error, _move, context) => {
      for (const [key, board] of context?.before ?? []) queryClient.setQueryData(key, board);
    },
    onSettled: (_data, _error, move) => {
      void queryClient.invalidateQueries({ queryKey: slateKeys.boards(channelId) });
      void queryClient.invalidateQueries({ queryKey: slateKeys.detail(channelId, move.episodeId) });
    },
  });
}

/** Puts a card where it was dropped in a cached board, so the drop shows before the server answers. */
export function placeCard(board: Board, move: { episodeId: string; stage: MoveEpisodeInput["stage"]; afterId: string | null; beforeId: string | null }): Board {
  const card = board.episodes.find((e) => e.id === move.episodeId);
  if (!card) return board;
  const rest = board.episodes.filter((e) => e.id !== move.episodeId);
  const moved = { ...card, stage: move.stage, daysInStage: card.stage === move.stage ? card.daysInStage : 0 };
  let at = move.afterId ? rest.findIndex((e) => e.id === move.afterId) + 1 : move.beforeId ? rest.findIndex((e) => e.id === move.beforeId) : -1;
  if (at <= 0 && !move.beforeId && !move.afterId) at = rest.length;
  if (at < 0) at = rest.length;
  return { ...board, episodes: [...rest.slice(0, at), moved, ...rest.slice(at)] };
}
