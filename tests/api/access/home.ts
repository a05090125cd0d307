import type { FeatureAccess } from "./matrix";
import { ok } from "./matrix";

/*
 * A member's home ("what needs me"): every role has one (all read episodes); what fills it follows
 * each entry's own area, tested in tests/api/home.test.ts. "outsider" is the owner of another channel: 404.
 */
const home = "/api/channels/:channelId/home";

export const access: FeatureAccess = {
  rows: [
    // route            visitor owner producer editor crew outsider
    [`GET ${home}`,       401,  ok,   ok,   ok,   ok,   404],
  ],
  recipes: () => ({ [`GET ${home}`]: { ok: 200 } }),
};
