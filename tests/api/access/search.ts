import type { FeatureAccess } from "./matrix";
import { ok } from "./matrix";

/*
 * Search: every member may search (the spec: all roles read episodes); what each role finds is
 * tested in tests/api/search.test.ts. The matrix sends no words, so a caller let through meets the
 * query's own 400 ("Type a word to search for.").
 */
const search = "/api/channels/:channelId/search";

export const access: FeatureAccess = {
  rows: [
    // route           visitor owner producer editor crew outsider
    [`GET ${search}`,  401,  ok,   ok,   ok,   ok,   404],
  ],
  recipes: () => ({ [`GET ${search}`]: { ok: 400 } }),
};
