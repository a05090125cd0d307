import type { Request } from "express";
import { isUuid } from "../../shared/http/ids";
import { CHANNEL, EPISODE, PART_MODULES } from "./page-preloads";
import { SESSION_COOKIE } from "./session";

type Answers = (params: Record<string, string>) => string[];
const episodeUrl = ({ channelId, episodeId }: Record<string, string>) => `/api/channels/${channelId}/episodes/${episodeId}`;
/** The episode and the answers its open part asks for beside it, as the part's `prefetch` in src/app/episode-sections.tsx. */
const episodeWith =
  (...paths: string[]): Answers =>
  (params) => {
    const episode = episodeUrl(params);
    return [episode, ...paths.map((p) => `${episode}/${p}`)];
  };
const partAnswers: Record<string, Answers> = {
  "test-plan": episodeWith("test-plan"),
  bench: (params) => [...episodeWith("bench-runs", "test-plan")(params), `/api/channels/${params.channelId}/bench/parts`],
  "sponsor-deals": episodeWith("deals"),
  "publish-package": episodeWith("publish"),
};

/**
 * The API answers a page asks for as soon as its code runs, by the address Express matches (as in
 * PAGE_MODULES). Named in the page's `Link` header, the browser fetches them alongside the code
 * instead of after it: the board or the episode arrives one chain of round trips sooner.
 */
export const PAGE_DATA: Record<string, Answers> = {
  [`${CHANNEL}/slate`]: ({ channelId }) => [`/api/channels/${channelId}/episodes`, `/api/channels/${channelId}/slate/people`],
  ...Object.fromEntries(Object.keys(PART_MODULES).map((part) => [`${EPISODE}/${part}`, partAnswers[part] ?? episodeWith()])),
  [`${EPISODE}{/:part}`]: episodeWith(),
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
