import type { Stage } from "@shared/slate/stages";
import { api } from "../../../lib/api-client";
import { episodesBase, useEpisodeMutation, type EpisodeAnswer } from "./episode-mutation";

export const useOverrideDueDate = (channelId: string, episodeId: string) =>
  useEpisodeMutation(
    channelId,
    ({ stage, version, dueDate }: { stage: Stage; version: number; dueDate: string | null }) =>
      api<EpisodeAnswer>(`${episodesBase(channelId)}/${episodeId}/due-dates/${stage}`, { method: "PUT", body: { version, dueDate } }),
    episodeId,
  );
