import { checkThumbnailFile } from "@shared/publish/thumbnail";
import type { ThumbnailView } from "@shared/publish/schemas";
import { api, ApiError } from "../../../lib/api-client";
import { publishBase } from "./keys";
import { usePublishMutation } from "./publish-mutation";

let csrf = "";

/** The multipart form the thumbnail route takes: the size first, then the file, checked here first. */
export async function sendThumbnail(channelId: string, episodeId: string, file: File): Promise<ThumbnailView> {
  const check = checkThumbnailFile(file.name, file.size);
  if (!check.ok) throw new ApiError(check.status, "refused_here", check.message);
  if (!csrf) csrf = (await api<{ csrfToken: string }>("/api/auth/me")).csrfToken;
  const form = new FormData();
  form.append("size", String(file.size));
  form.append("file", file, file.name);
  let response: Response;
  try {
    response = await fetch(`${publishBase(channelId, episodeId)}/thumbnails`, { method: "POST", body: form, headers: { "x-csrf-token": csrf, accept: "application/json" }, credentials: "same-origin" });
  } catch {
    throw new ApiError(0, "offline", "Kerf can't reach the server. Check your connection and try again.");
  }
  const body = (await response.json().catch(() => null)) as { thumbnail?: ThumbnailView; error?: { code?: string; message?: string } } | null;
  if (!response.ok || !body?.thumbnail) throw new ApiError(response.status, body?.error?.code ?? "unexpected", body?.error?.message ?? `The server answered ${response.status}.`);
  return body.thumbnail;
}

export const useAddThumbnail = (channelId: string, episodeId: string) =>
  usePublishMutation(channelId, episodeId, (file: File) => sendThumbnail(channelId, episodeId, file).then(() => null));
