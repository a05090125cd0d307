import type { EpisodeFields } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { episodesBase, useEpisodeMutation, type EpisodeAnswer } from "./episode-mutation";

export const useCreateEpisode = (channelId: string) =>
  useEpisodeMutation(channelId, (fields: EpisodeFields) => api<EpisodeAnswer>(episodesBase(channelId), { method: "POST", body: fields }));
