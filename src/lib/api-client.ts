
/** A failed API call with the server's error shape: code, readable message and per-field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly body: unknown = null,
  ) {
    super(message);
  }
}

let csrfToken = "";
/** The session's CSRF token, handed out by /api/auth/me and the sign-in answers. */
export function rememberCsrfToken(token: string): void {
  csrfToken = token;
}

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/** `keepalive`: the request outlives the page (sent as it closes; its body must stay under 64 KiB). */
export async function api<T>(path: string, options: { method?: Method; body?: unknown; signal?: AbortSignal; keepalive?: boolean } = {}): Promise<T> {
  const method = options.method ?? "GET";
  // A GET sends no headers of its own, so the browser can answer it with what the page's head preloaded.
  const headers: Record<string, string> = {};
  if (options.body !== undefined) headers["content-type"] = "application/json";
  if (method !== "GET") headers["x-csrf-token"] = csrfToken;

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      credentials: "same-origin",
      signal: options.signal,
      keepalive: options.keepalive,
    });
  } catch (error) {
    if ((error as Error).name === "AbortError") throw error;
    throw new ApiError(0, "offline", "Kerf can't reach the server. Check your connection and try again.");
  }
  if (response.status === 204) return undefined as T;
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    // The error shape's schema (and zod with it) is fetched the first time a call fails, not with the first page.
    const { errorBodySchema } = await import("@shared/http/errors");
    const parsed = errorBodySchema.safeParse(body);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields, body);
    throw new ApiError(response.status, "unexpected", `The server answered ${response.status}.`);
  }
  return body as T;
}
