import { useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import type { EpisodeChanges, EpisodeFields, EpisodeRecord } from "@shared/slate/schemas";
import type { Stage } from "@shared/slate/stages";
import { api, ApiError } from "../../../lib/api-client";
import { slateKeys } from "./keys";

type Answer = { episode: EpisodeRecord };

/** Any change to an episode shows on every board of the channel and on its own page. */
function refreshEpisode(queryClient: QueryClient, channelId: string, episodeId?: string) {
  void queryClient.invalidateQueries({ queryKey: slateKeys.boards(channelId) });
  if (episodeId) void queryClient.invalidateQueries({ queryKey: slateKeys.detail(channelId, episodeId) });
}

/** On a 409 the server sent the episode as it is now: the page shows it by refetching. */
export const isConflict = (error: unknown): error is ApiError => error instanceof ApiError && error.status === 409;

export function useCreateEpisode(channelId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: EpisodeFields) => api<Answer>(`/api/channels/${channelId}/episodes`, { method: "POST", body: fields }).then((r) => r.episode),
    onSettled: () => refreshEpisode(queryClient, channelId),
  });
}

export function useEditEpisode(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: EpisodeChanges) => api<Answer>(`/api/channels/${channelId}/episodes/${episodeId}`, { method: "PATCH", body: changes }).then((r) => r.episode),
    onSettled: () => refreshEpisode(queryClient, channelId, episodeId),
  });
}

export function useArchiveEpisode(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ version, archived }: { version: number; archived: boolean }) =>
      api<Answer>(`/api/channels/${channelId}/episodes/${episodeId}/${archived ? "archive" : "restore"}`, { method: "POST", body: { version } }).then((r) => r.episode),
    onSettled: () => refreshEpisode(queryClient, channelId, episodeId),
  });
}

export function useOverrideDueDate(channelId: string, episodeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ stage, version, dueDate }: { stage: Stage; version: number; dueDate: string | null }) =>
      api<Answer>(`/api/channels/${channelId}/episodes/${episodeId}/due-dates/${stage}`, { method: "PUT", body: { version, dueDate } }).then((r) => r.episode),
    onSettled: () => refreshEpisode(queryClient, channelId, episodeId),
  });
}
