import type { BuildPhotoView } from "@shared/bench/schemas";
import { checkStillFile } from "@shared/rushes/limits";
import { ApiError } from "../../../lib/api-client";
import { sendFile } from "../../../lib/send-file";
import { episodeBase, useBenchMutation } from "./bench-mutation";

/** A photo of a build iteration, checked here first so a wrong file is told at once. */
export async function sendBuildPhoto(channelId: string, episodeId: string, iterationId: string, file: File): Promise<BuildPhotoView> {
  const check = checkStillFile(file.name, file.size);
  if (!check.ok) throw new ApiError(check.status, "refused_here", check.message);
  return sendFile<BuildPhotoView>(`${episodeBase(channelId, episodeId)}/build-log/${iterationId}/photos`, file, "photo");
}

export const useAddBuildPhoto = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ iterationId, file }: { iterationId: string; file: File }) => sendBuildPhoto(channelId, episodeId, iterationId, file));
