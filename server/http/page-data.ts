import type { Request } from "express";
import { isUuid } from "../../shared/http/ids";
import { CHANNEL } from "./page-preloads";
import { SESSION_COOKIE } from "./session";

/**
 * The API answers a page asks for as soon as its code runs, by the address Express matches (as in
 * PAGE_MODULES). Named in the page's `Link` header, the browser fetches them alongside the code
 * instead of after it: the board or the episode arrives one chain of round trips sooner.
 */
export const PAGE_DATA: Record<string, (params: Record<string, string>) => string[]> = {
  [`${CHANNEL}/slate`]: ({ channelId }) => [`/api/channels/${channelId}/episodes`, `/api/channels/${channelId}/slate/people`],
  [`${CHANNEL}/episodes/:episodeId{/:part}`]: ({ channelId, episodeId }) => [`/api/channels/${channelId}/episodes/${episodeId}`],
};

/**
 * The `Link` header that preloads a page's first answers, or null. Only for a visitor with a session:
 * a first /api/auth/me starts one, and two of them at once could hand the page two. Only for plain
 * addresses (a query string changes what the page asks for) whose ids have an id's shape.
 * The client's GETs send no headers of their own, so the browser can hand them the preloaded answer.
 */
export function pageDataLink(req: Request, address?: string): string | null {
  if (!req.headers.cookie?.includes(`${SESSION_COOKIE}=`) || req.url.includes("?")) return null;
  const params = req.params as Record<string, string | undefined>;
  const ids = Object.entries(params).filter(([name]) => name.endsWith("Id"));
  if (!ids.every(([, value]) => isUuid(value))) return null;
  const urls = ["/api/auth/me", ...(address && PAGE_DATA[address] ? PAGE_DATA[address](params as Record<string, string>) : [])];
  return urls.map((url) => `<${url}>; rel=preload; as=fetch; crossorigin`).join(", ");
}
