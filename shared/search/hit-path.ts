import type { SearchHit } from "./schemas";

/**
 * The page a hit opens, as a path inside the app: the episode page's part, the clip or the mark itself.
 * Apart from the schemas, so the top bar's search (on every page) does not bring zod with it.
 */
export function searchHitPath(channelId: string, hit: Pick<SearchHit, "kind" | "id" | "episodeId" | "place">): string {
  const c = `/c/${channelId}`;
  const episode = (part: string) => `${c}/episodes/${hit.episodeId}/${part}`;
  switch (hit.kind) {
    case "episode":
      return episode("overview");
    case "testPlan":
      return episode("test-plan");
    case "benchRun":
      return episode("bench");
    case "buildEntry":
      return episode("build-log");
    case "shot":
      return episode("shoot");
    case "comment":
      return episode("comments");
    case "deal":
    case "dealMoney":
      // A deal signed before its episode is found on its sponsor's page.
      return hit.episodeId ? episode("sponsor-deals") : `${c}/sponsors`;
    case "part":
      return `${c}/shelf/${hit.id}`;
    case "clip":
      return `${c}/rushes?clip=${hit.id}`;
    case "mark":
      return `${c}/rushes?clip=${hit.place.clipId}&mark=${hit.id}`;
    case "sponsor":
      return `${c}/sponsors?sponsor=${hit.id}`;
  }
}
