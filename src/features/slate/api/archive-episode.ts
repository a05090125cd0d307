import { api } from "../../../lib/api-client";
import { episodesBase, useEpisodeMutation, type EpisodeAnswer } from "./episode-mutation";

/** Archives an episode, or restores it (the same endpoint pair: …/archive and …/restore). */
export const useArchiveEpisode = (channelId: string, episodeId: string) =>
  useEpisodeMutation(
    channelId,
    ({ version, archived }: { version: number; archived: boolean }) =>
      api<EpisodeAnswer>(`${episodesBase(channelId)}/${episodeId}/${archived ? "archive" : "restore"}`, { method: "POST", body: { version } }),
    episodeId,
  );
