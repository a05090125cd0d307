import type { EpisodeChanges } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { episodesBase, useEpisodeMutation, type EpisodeAnswer } from "./episode-mutation";

export const useEditEpisode = (channelId: string, episodeId: string) =>
  useEpisodeMutation(channelId, (changes: EpisodeChanges) => api<EpisodeAnswer>(`${episodesBase(channelId)}/${episodeId}`, { method: "PATCH", body: changes }), episodeId);
