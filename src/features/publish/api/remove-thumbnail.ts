import { api } from "../../../lib/api-client";
import { publishBase } from "./keys";
import { usePublishMutation } from "./publish-mutation";

export const useRemoveThumbnail = (channelId: string, episodeId: string) =>
  usePublishMutation(channelId, episodeId, (thumbnailId: string) =>
    api<void>(`${publishBase(channelId, episodeId)}/thumbnails/${thumbnailId}`, { method: "DELETE" }).then(() => null),
  );
