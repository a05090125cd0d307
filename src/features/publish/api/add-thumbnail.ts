import { checkThumbnailFile } from "@shared/publish/thumbnail";
import type { ThumbnailView } from "@shared/publish/schemas";
import { ApiError } from "../../../lib/api-client";
import { sendFile } from "../../../lib/send-file";
import { publishBase } from "./keys";
import { usePublishMutation } from "./publish-mutation";

/** A thumbnail candidate, checked here first so a wrong file is told at once. */
export async function sendThumbnail(channelId: string, episodeId: string, file: File): Promise<ThumbnailView> {
  const check = checkThumbnailFile(file.name, file.size);
  if (!check.ok) throw new ApiError(check.status, "refused_here", check.message);
  return sendFile<ThumbnailView>(`${publishBase(channelId, episodeId)}/thumbnails`, file, "thumbnail");
}

export const useAddThumbnail = (channelId: string, episodeId: string) =>
  usePublishMutation(channelId, episodeId, (file: File) => sendThumbnail(channelId, episodeId, file).then(() => null));
