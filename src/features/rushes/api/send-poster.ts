import { api } from "../../../lib/api-client";

let csrf = "";
/** The multipart form the poster route takes: the size first, then the file. */
export async function sendPoster(channelId: string, clipId: string, poster: Blob): Promise<void> {
  if (!csrf) csrf = (await api<{ csrfToken: string }>("/api/auth/me")).csrfToken;
  const form = new FormData();
  form.append("size", String(poster.size));
  form.append("file", poster, "poster.jpg");
  await fetch(`/api/channels/${channelId}/clips/${clipId}/poster`, { method: "POST", body: form, headers: { "x-csrf-token": csrf }, credentials: "same-origin" });
}
