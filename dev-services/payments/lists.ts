import { invalidParam } from "./api-error";
import type { Params } from "./params";

/**
 * The provider's list object: newest first (an invoice's lines in their own order), `limit` (1–100, default 10) and cursor paging with
 * `starting_after` / `ending_before` (an id from the previous page), `has_more` when more remain.
 */
export const PAGING_PARAMS = ["limit", "starting_after", "ending_before"] as const;

export function listPage<T extends { id: string; seq: number }>(
  records: T[],
  params: Params,
  url: string,
  view: (record: T) => unknown,
  order: "newest first" | "as given" = "newest first",
) {
  const limit = params.integer("limit", { min: 1, max: 100 }) ?? 10;
  const startingAfter = params.string("starting_after");
  const endingBefore = params.string("ending_before");
  const ordered = order === "as given" ? records : [...records].sort((a, b) => b.seq - a.seq);
  const cursorIndex = (param: string, id: string) => {
    const index = ordered.findIndex((record) => record.id === id);
    if (index < 0) throw invalidParam(param, `No such object: '${id}'`, "resource_missing");
    return index;
  };
  let page: T[];
  let hasMore: boolean;
  if (startingAfter !== undefined) {
    const rest = ordered.slice(cursorIndex("starting_after", startingAfter) + 1);
    page = rest.slice(0, limit);
    hasMore = rest.length > limit;
  } else if (endingBefore !== undefined) {
    const before = ordered.slice(0, cursorIndex("ending_before", endingBefore));
    page = before.slice(Math.max(0, before.length - limit));
    hasMore = before.length > limit;
  } else {
    page = ordered.slice(0, limit);
    hasMore = ordered.length > limit;
  }
  return { object: "list", data: page.map(view), has_more: hasMore, url };
}
