import type { BuildPhotoView } from "@shared/bench/schemas";
import { checkStillFile } from "@shared/rushes/limits";
import { api, ApiError } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

let csrf = "";

/** The multipart form the photo route takes: the size first, then the file, checked here first so a wrong file is told at once. */
export async function sendBuildPhoto(channelId: string, episodeId: string, iterationId: string, file: File): Promise<BuildPhotoView> {
  const check = checkStillFile(file.name, file.size);
  if (!check.ok) throw new ApiError(check.status, "refused_here", check.message);
  if (!csrf) csrf = (await api<{ csrfToken: string }>("/api/auth/me")).csrfToken;
  const form = new FormData();
  form.append("size", String(file.size));
  form.append("file", file, file.name);
  let response: Response;
  try {
    response = await fetch(`${episodeBase(channelId, episodeId)}/build-log/${iterationId}/photos`, { method: "POST", body: form, headers: { "x-csrf-token": csrf, accept: "application/json" }, credentials: "same-origin" });
  } catch {
    throw new ApiError(0, "offline", "Kerf can't reach the server. Check your connection and try again.");
  }
  const body = (await response.json().catch(() => null)) as { photo?: BuildPhotoView; error?: { code?: string; message?: string } } | null;
  if (!response.ok || !body?.photo) throw new ApiError(response.status, body?.error?.code ?? "unexpected", body?.error?.message ?? `The server answered ${response.status}.`);
  return body.photo;
}

export const useAddBuildPhoto = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ iterationId, file }: { iterationId: string; file: File }) => sendBuildPhoto(channelId, episodeId, iterationId, file));
