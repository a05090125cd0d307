import { api, ApiError } from "./api-client";

let csrf = "";

/**
 * Sends one file as Kerf's stored-file routes take it: a multipart form with the size first, then the
 * file. Answers the reply's `field`; a refusal or a lost connection is an ApiError in plain words.
 */
export async function sendFile<T>(url: string, file: File, field: string): Promise<T> {
  if (!csrf) csrf = (await api<{ csrfToken: string }>("/api/auth/me")).csrfToken;
  const form = new FormData();
  form.append("size", String(file.size));
  form.append("file", file, file.name);
  let response: Response;
  try {
    response = await fetch(url, { method: "POST", body: form, headers: { "x-csrf-token": csrf, accept: "application/json" }, credentials: "same-origin" });
  } catch {
    throw new ApiError(0, "offline", "Kerf can't reach the server. Check your connection and try again.");
  }
  const body = (await response.json().catch(() => null)) as (Record<string, unknown> & { error?: { code?: string; message?: string } }) | null;
  if (!response.ok || !body?.[field]) throw new ApiError(response.status, body?.error?.code ?? "unexpected", body?.error?.message ?? `The server answered ${response.status}.`);
  return body[field] as T;
}
